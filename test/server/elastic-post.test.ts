import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { elasticColumnsResponse } from "../../server/schemas/elastic.js";
import { build } from "../helpers/build.js";

const post = async (payload: unknown, options: { maxSamples?: number; bodyLimit?: number } = {}) => {
  const app = await build({ config: { maxSamples: options.maxSamples, jsonBodyLimitBytes: options.bodyLimit } });
  const response = await app.inject({ method: "POST", url: "/v1/elastic", payload: payload as object });
  return { response, body: response.json() };
};

describe("POST /v1/elastic", () => {
  it("answers one value per input row in input order, nulls where invalid, flags by index and a summary", async () => {
    const { response, body } = await post({
      depth: [1500, 1500.1524, 1500.3048, 1500.4572, 1500.6096],
      dtc: [100, 80, null, 90, 95],
      dts: [200, 150, 160, 85, -999.25],
      rho: [2.3, 2.5, 2.4, 2.4, 2.45],
    });
    expect(response.statusCode).toBe(200);
    expect(elasticColumnsResponse.parse(body)).toBeTruthy();
    expect(body.count).toBe(5);
    for (const name of ["E", "nu", "G", "K", "lambda", "M", "vp_vs", "p_impedance", "s_impedance", "lambda_rho", "mu_rho", "vp", "vs", "depth"]) {
      expect(body[name], name).toHaveLength(5);
    }
    expect(body.depth).toEqual([1500, 1500.1524, 1500.3048, 1500.4572, 1500.6096]);
    expect(body.nu[0]).toBeCloseTo(1 / 3, 14);
    expect(body.E.map((e: number | null) => e === null)).toEqual([false, false, true, true, true]);
    expect(body.flags).toEqual([
      { index: 2, code: "missing", severity: "invalid" },
      { index: 3, code: "vs_not_below_vp", severity: "invalid" },
      { index: 4, code: "missing", severity: "invalid" },
    ]);
    expect(body.summary).toEqual({ count: 5, valid: 2, flags: { missing: 2, vs_not_below_vp: 1 } });
    expect(Object.keys(body.flag_legend)).toEqual(["missing", "vs_not_below_vp"]);
  });

  it("accepts interval input (top and base instead of depth) and echoes it", async () => {
    const { response, body } = await post({ top: [1500, 1620], base: [1620, 1710], vp: [3000, 4200], vs: [1500, 2300], rho: [2.45, 2.6] });
    expect(response.statusCode).toBe(200);
    expect(body).toMatchObject({ top: [1500, 1620], base: [1620, 1710], count: 2 });
    expect(body.depth).toBeUndefined();
  });

  it("for random columns, every answer column has the input's length and row i depends only on input row i", async () => {
    const row = fc.record({
      vp: fc.option(fc.double({ min: -10, max: 8000, noNaN: true }), { nil: null }),
      vs: fc.option(fc.double({ min: -10, max: 5000, noNaN: true }), { nil: null }),
      rho: fc.option(fc.double({ min: -1, max: 4, noNaN: true }), { nil: null }),
    });
    const app = await build();
    await fc.assert(
      fc.asyncProperty(fc.array(row, { minLength: 1, maxLength: 40 }), async (rows) => {
        const columns = { vp: rows.map((r) => r.vp), vs: rows.map((r) => r.vs), rho: rows.map((r) => r.rho) };
        const all = (await app.inject({ method: "POST", url: "/v1/elastic", payload: columns })).json();
        expect(all.E).toHaveLength(rows.length);
        const last = rows.length - 1;
        const single = (
          await app.inject({ method: "POST", url: "/v1/elastic", payload: { vp: [rows[last].vp], vs: [rows[last].vs], rho: [rows[last].rho] } })
        ).json();
        expect(all.E[last]).toEqual(single.E[0]);
        expect(all.nu[last]).toEqual(single.nu[0]);
      }),
      { numRuns: 30 },
    );
  });

  it.each([
    [{ vp: [3000, 3100], vs: [1500], rho: [2.4, 2.4] }, "body.vs", "has 1 values but vp has 2"],
    [{ vp: [3000], dtc: [100], vs: [1500], rho: [2.4] }, "body.dtc", "not both"],
    [{ rho: [2.4], vs: [1500] }, "body.vp", "give vp"],
    [{ vp: [3000], vs: [1500] }, "body.rho", "required"],
    [{ vp: [3000], vs: [1500], rho: [2.4], units: { velocity: "mph" } }, "body.units.velocity", "m/s"],
    [{ vp: [3000, "fast"], vs: [1500, 1400], rho: [2.4, 2.4] }, "body.vp", 'got the string "fast"'],
    [{ vp: 3000, vs: [1500], rho: [2.4] }, "body.vp", "expected an array"],
    [{ vp: [3000], vs: [1500], rho: [2.4], depth: [1], top: [1], base: [2] }, "body.depth", "not both"],
    [{ vp: [3000], vs: [1500], rho: [2.4], top: [1] }, "body.base", "together"],
    [{ VP: [3000], vs: [1500], rho: [2.4] }, "body.VP", "unknown field"],
  ])("%j is a 400 problem naming %s", async (payload, field, words) => {
    const { response, body } = await post(payload);
    expect(response.statusCode).toBe(400);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(body.errors).toContainEqual(expect.objectContaining({ field, message: expect.stringContaining(words) }));
  });

  it("names the row of a bad element (RFC 9457 extension member errors[].index)", async () => {
    const { body } = await post({ vp: [3000, 3100, true], vs: [1500, 1500, 1500], rho: [2.4, 2.4, 2.4] });
    expect(body.errors).toEqual([{ field: "body.vp", index: 2, message: "expected a number or null, got boolean" }]);
  });

  it("refuses more samples than MAX_SAMPLES with a 413 problem that says the limit", async () => {
    const { response, body } = await post({ vp: [3000, 3000, 3000], vs: [1500, 1500, 1500], rho: [2.4, 2.4, 2.4] }, { maxSamples: 2 });
    expect(response.statusCode).toBe(413);
    expect(body).toMatchObject({ type: "/problems/too-many-samples", detail: expect.stringContaining("at most 2") });
  });

  it("refuses a body over the byte limit with a 413 problem", async () => {
    const { response, body } = await post({ vp: Array(200).fill(3000), vs: Array(200).fill(1500), rho: Array(200).fill(2.4) }, { bodyLimit: 1000 });
    expect(response.statusCode).toBe(413);
    expect(body).toMatchObject({ type: "/problems/body-too-large", detail: expect.stringContaining("1000 bytes") });
  });

  it("reversed plausibility bounds in body.limits are a 400 naming the field, not a range that flags every sample", async () => {
    const { response, body } = await post({ dtc: [95], dts: [170], rho: [2.45], limits: { rho_min_g_cm3: 2.9, rho_max_g_cm3: 2.1 } });
    expect(response.statusCode).toBe(400);
    expect(body.errors).toContainEqual({ field: "body.limits.rho_min_g_cm3", message: "rho_min_g_cm3 (2.9) must be below rho_max_g_cm3 (2.1)" });
  });

  it("an interval whose top lies below its base is a 400 naming the row, not a silently misplaced interval", async () => {
    const { response, body } = await post({ top: [1500, 1502], base: [1501, 1501.5], vp: [3000, 3100], vs: [1500, 1550], rho: [2.4, 2.45] });
    expect(response.statusCode).toBe(400);
    expect(JSON.stringify(body.errors)).toContain("base 1501.5 is above top 1502");
    expect(body.errors).toHaveLength(1);
  });

  it("a depth equal to the null value is absent, as in a well file (LAS 2.0 ~W NULL): echoed as null and in no zone", async () => {
    const { response, body } = await post({
      depth: [1510, null, -999.25],
      dtc: [95, 96, 97],
      dts: [170, 172, 174],
      rho: [2.45, 2.44, 2.43],
      zones: [{ name: "Whole log", top: -2000, base: 3000 }],
    });
    expect(response.statusCode).toBe(200);
    expect(body.depth).toEqual([1510, null, null]);
    expect(body.zones[0].count).toBe(1);
    const custom = await post({ depth: [1510, -1, 1511], dtc: [95, 96, 97], dts: [170, 172, 174], rho: [2.45, 2.44, 2.43], null_value: -1 });
    expect(custom.body.depth).toEqual([1510, null, 1511]);
  });

  it("intervals whose top or base is the null value sit in no zone", async () => {
    const { response, body } = await post({
      top: [1510, -999.25],
      base: [1511, 1512],
      dtc: [95, 96],
      dts: [170, 172],
      rho: [2.45, 2.44],
      zones: [{ name: "Whole log", top: -2000, base: 3000 }],
    });
    expect(response.statusCode).toBe(200);
    expect(body.zones[0].count).toBe(1);
  });
});
