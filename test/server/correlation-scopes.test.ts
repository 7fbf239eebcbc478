import { describe, expect, it } from "vitest";
import { build } from "../helpers/build.js";

/** Requests of our fictional well Marram Bank 3: a shale over a sand, DTC/DTS in µs/ft, RHOB in g/cm3. */
const post = async (payload: object) => {
  const app = await build();
  const response = await app.inject({ method: "POST", url: "/v1/elastic", payload });
  return { status: response.statusCode, body: response.json() };
};

const columns = {
  depth: [1500, 1501, 1502, 1503],
  dtc: [100, 100, 80, 80],
  dts: [190, 190, 140, 140],
  rho: [2.45, 2.45, 2.3, 2.3],
};

describe("which static E a strength correlation takes is never a guess", () => {
  it("refuses two static_e beside a UCS-from-E correlation in one list, whatever their order (400 naming the list)", async () => {
    for (const list of [
      ["static_e.lacy1997", "static_e.eissa1988", "ucs.bradford1998"],
      ["static_e.eissa1988", "static_e.lacy1997", "ucs.bradford1998"],
    ]) {
      const { status, body } = await post({ ...columns, correlations: list });
      expect(status).toBe(400);
      expect(body.errors[0].field).toBe("body.correlations");
      expect(body.errors[0].message).toContain("keep one of them");
    }
  });

  it("names the zone by its position in the request, also when an earlier zone lists no correlation", async () => {
    const { status, body } = await post({
      ...columns,
      zones: [
        { name: "Brackwater Shale", top: 1500, base: 1502 },
        { name: "Wrenfold Sand", top: 1502, base: 1504, correlations: ["ucs.bradford1998"] },
      ],
    });
    expect(status).toBe(400);
    expect(body.errors[0].field).toBe("body.zones[1].correlations");
  });

  it("refuses zones that share samples and feed one UCS correlation from different static_e, naming both zones", async () => {
    const { status, body } = await post({
      ...columns,
      zones: [
        { name: "Upper", top: 1500, base: 1502.5, correlations: ["static_e.lacy1997_shale", "ucs.bradford1998"] },
        { name: "Lower", top: 1501.5, base: 1504, correlations: ["static_e.lacy1997_sandstone", "ucs.bradford1998"] },
      ],
    });
    expect(status).toBe(400);
    expect(body.errors[0]).toMatchObject({ field: "body.zones[1].correlations" });
    expect(body.errors[0].message).toContain("zones[0] and zones[1] share samples");
  });
});

describe("a prediction no rock can have is null, and flagged", () => {
  it("a negative UCS from Lal (1999) on a very slow sample (DTC 320 µs/ft, Vp < 1 km/s) is null with outside_calibration; a real one is kept", async () => {
    const { status, body } = await post({ dtc: [320, 100], dts: [700, 190], rho: [2.0, 2.45], correlations: ["ucs.lal1999"] });
    expect(status).toBe(200);
    const ucs = body.derived["ucs.lal1999"];
    expect(ucs.values[0]).toBeNull();
    // Lal (1999): UCS = 10·(304.8/Δt − 1) MPa, Δt in µs/ft.
    expect(ucs.values[1]).toBeCloseTo(10 * (304.8 / 100 - 1), 9);
    expect(ucs.outside_calibration).toContain(0);
    expect(body.flags).toContainEqual(expect.objectContaining({ index: 0, code: "outside_calibration" }));
  });
});
