import { describe, expect, it } from "vitest";
import { applyCorrelations, findCorrelation, flagCodesOf, InputIssues, type Correlation } from "../../core/index.js";
import { elasticOf } from "../helpers/elastic.js";

const byId = (id: string) => findCorrelation(id) as Correlation;

describe("applyCorrelations", () => {
  it("evaluates each scope's correlations on its samples only and NaN elsewhere", () => {
    const log = elasticOf([3048, 3048, 3048], [1700, 1700, 1700], [2.4, 2.4, 2.4]);
    const derived = applyCorrelations(
      [
        { members: undefined, correlations: [] },
        { members: Uint8Array.of(1, 0, 1), correlations: [byId("ucs.mcnally1987")] },
      ],
      log.si,
      {},
      log.flags,
    );
    // McNally (1987): UCS = 1200·exp(−0.036·Δt), Δt = 304800/3048 = 100 µs/ft
    const values = Array.from(derived.get("ucs.mcnally1987")?.values ?? []);
    expect(values[0]).toBeCloseTo(1200 * Math.exp(-3.6), 9);
    expect(values[1]).toBeNaN();
    expect(values[2]).toBeCloseTo(1200 * Math.exp(-3.6), 9);
  });

  it("feeds a scope's static_e into correlations that take a static modulus, and refuses them without one", () => {
    const log = elasticOf([3048], [1700], [2.4]);
    const derived = applyCorrelations([{ members: undefined, correlations: [byId("static_e.wang2000_soft"), byId("ucs.bradford1998")] }], log.si, {}, log.flags);
    const es = derived.get("static_e.wang2000_soft")?.values[0] as number;
    expect(es).toBeCloseTo(0.4145 * log.youngsModulus[0] - 1.0593, 9); // Wang (2000), soft rock, GPa
    expect(derived.get("ucs.bradford1998")?.values[0]).toBeCloseTo(2.28 + 4.1089 * es, 9); // Bradford et al. (1998)
    expect(() => applyCorrelations([{ members: undefined, correlations: [byId("ucs.bradford1998")] }], log.si, {}, log.flags)).toThrow(InputIssues);
  });

  it("sets outside_calibration on samples whose inputs lie outside the source's data", () => {
    const log = elasticOf([4500, 2500], [2600, 1300], [2.6, 2.2]);
    applyCorrelations([{ members: undefined, correlations: [byId("static_e.wang2000_soft")] }], log.si, {}, log.flags);
    expect(log.youngsModulus[0]).toBeGreaterThan(15);
    expect(log.youngsModulus[1]).toBeLessThan(15);
    expect(flagCodesOf(log.flags[0])).toContain("outside_calibration");
    expect(flagCodesOf(log.flags[1])).not.toContain("outside_calibration");
  });
});

describe("predictions no rock can have, and which static_e feeds a consumer", () => {
  const issuesOf = (run: () => unknown) => {
    try {
      run();
    } catch (error) {
      if (error instanceof InputIssues) return error.issues;
      throw error;
    }
    return [];
  };

  it("a static E at or below zero (Wang 2000, soft rock: Es = 0.4145·Ed − 1.0593 GPa, below Ed ≈ 2.56 GPa) is null and flagged, and UCS is not computed from it", () => {
    // A very soft, slow sample (DTC 200, DTS 900 µs/ft, 1.9 g/cm3): Ed ≈ 0.65 GPa, so the line predicts Es ≈ −0.79 GPa.
    const log = elasticOf([304800 / 200], [304800 / 900], [1.9]);
    expect(0.4145 * log.youngsModulus[0] - 1.0593).toBeLessThan(0);
    const derived = applyCorrelations([{ members: undefined, correlations: [byId("static_e.wang2000_soft"), byId("ucs.bradford1998")] }], log.si, {}, log.flags);
    expect(derived.get("static_e.wang2000_soft")?.values[0]).toBeNaN();
    expect(derived.get("static_e.wang2000_soft")?.outsideCalibration[0]).toBe(1);
    expect(derived.get("ucs.bradford1998")?.values[0]).toBeNaN();
    expect(flagCodesOf(log.flags[0])).toContain("outside_calibration");
  });

  it("a negative UCS (Lal 1999: UCS = 10·(304.8/Δt − 1) MPa, below Vp = 1 km/s) is null and flagged; a positive one is kept", () => {
    const log = elasticOf([304800 / 320, 304800 / 100], [400, 1700], [2.0, 2.4]);
    const derived = applyCorrelations([{ members: undefined, correlations: [byId("ucs.lal1999")] }], log.si, {}, log.flags);
    const column = derived.get("ucs.lal1999");
    expect(column?.values[0]).toBeNaN();
    expect(column?.outsideCalibration[0]).toBe(1);
    expect(column?.values[1]).toBeCloseTo(10 * (304.8 / 100 - 1), 9);
  });

  it("refuses a list with two static_e correlations when a correlation of the list takes a static E, and names both", () => {
    const log = elasticOf([3048], [1700], [2.4]);
    const list = [byId("static_e.lacy1997"), byId("static_e.eissa1988"), byId("ucs.bradford1998")];
    const issues = issuesOf(() => applyCorrelations([{ members: undefined, correlations: list }], log.si, {}, log.flags));
    expect(issues).toHaveLength(1);
    expect(issues[0].field).toBe("correlations");
    expect(issues[0].message).toContain("static_e.lacy1997, static_e.eissa1988");
    // Without a consumer, two static estimates side by side are a comparison, and allowed.
    expect(issuesOf(() => applyCorrelations([{ members: undefined, correlations: list.slice(0, 2) }], log.si, {}, log.flags))).toEqual([]);
  });

  it("refuses zones that share samples and feed one consumer from different static_e; apart, or with the same static_e, they are fine", () => {
    const log = elasticOf([3048, 3048, 3048], [1700, 1700, 1700], [2.4, 2.4, 2.4]);
    const zone = (members: number[], staticId: string) => ({ members: Uint8Array.from(members), correlations: [byId(staticId), byId("ucs.bradford1998")] });
    const request = { members: undefined, correlations: [] };
    const overlapping = [request, zone([1, 1, 0], "static_e.lacy1997_shale"), zone([0, 1, 1], "static_e.lacy1997_sandstone")];
    const issues = issuesOf(() => applyCorrelations(overlapping, log.si, {}, log.flags));
    expect(issues).toHaveLength(1);
    expect(issues[0].field).toBe("zones[1].correlations");
    expect(issues[0].message).toContain("zones[0] and zones[1] share samples");
    const apart = [request, zone([1, 0, 0], "static_e.lacy1997_shale"), zone([0, 1, 1], "static_e.lacy1997_sandstone")];
    expect(issuesOf(() => applyCorrelations(apart, log.si, {}, log.flags))).toEqual([]);
    const same = [request, zone([1, 1, 0], "static_e.lacy1997_shale"), zone([0, 1, 1], "static_e.lacy1997_shale")];
    expect(issuesOf(() => applyCorrelations(same, log.si, {}, log.flags))).toEqual([]);
  });
});

describe("gap filling in computeElasticLog", () => {
  it("fills only absent Vs from Vp (Castagna et al. 1985 mudrock line), flags estimated_vs, and counts the filled samples", () => {
    const log = elasticOf([3000, 3000], [1500, NaN], [2.4, 2.4], { fillShear: { correlation: byId("vs.castagna1985"), mode: "nulls" } });
    expect(log.filled).toEqual({ vs: 1, rho: 0 });
    expect(log.vs[0]).toBe(1500);
    expect(log.vs[1]).toBeCloseTo(((3 - 1.36) / 1.16) * 1000, 9);
    expect(flagCodesOf(log.flags[0])).toEqual([]);
    expect(flagCodesOf(log.flags[1])).toEqual(["estimated_vs"]);
  });

  it("fills absent density from Vp (Gardner et al. 1974: ρ = 0.31·Vp^0.25, Vp in m/s) and flags estimated_rho", () => {
    const log = elasticOf([3000], [1500], [NaN], { fillDensity: { correlation: byId("density.gardner1974"), mode: "nulls" } });
    expect(log.si.densityKilogramsPerCubicMetre[0]).toBeCloseTo(310 * 3000 ** 0.25, 9);
    expect(flagCodesOf(log.flags[0])).toEqual(["estimated_rho"]);
  });
});
