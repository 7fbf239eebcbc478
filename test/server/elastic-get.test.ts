import { describe, expect, it } from "vitest";
import { elasticPointResponse } from "../../server/schemas/elastic.js";
import { build } from "../helpers/build.js";
import { relativeError } from "../helpers/elastic.js";

const get = async (query: string) => {
  const app = await build();
  const response = await app.inject({ url: `/v1/elastic?${query}` });
  return { response, body: response.json() };
};

describe("GET /v1/elastic", () => {
  it("answers E, ν, G, K, λ, M and Vp/Vs of one sample, matching the answer schema", async () => {
    const { response, body } = await get("vp=3000&vs=1500&rho=2.45");
    expect(response.statusCode).toBe(200);
    expect(elasticPointResponse.parse(body)).toBeTruthy();
    // G = ρVs² = 2450·1500² Pa; ν = 1/3 at Vp/Vs = 2; E = 2G(1+ν) (Rock Physics Handbook, table 2.2.1)
    expect(body.G).toBeCloseTo(5.5125, 12);
    expect(body.nu).toBeCloseTo(1 / 3, 14);
    expect(body.E).toBeCloseTo(14.7, 12);
    expect(body.M).toBeCloseTo(22.05, 12);
    expect(body.K).toBeCloseTo(22.05 - (4 / 3) * 5.5125, 12);
    expect(body.lambda).toBeCloseTo(22.05 - 2 * 5.5125, 12);
    expect(body.vp_vs).toBe(2);
    expect(body).toMatchObject({ valid: true, flags: [], units: { modulus: "GPa", velocity: "m/s", density: "g/cm3" } });
  });

  it("takes slownesses in µs/ft: DTC 100 and DTS 200 are Vp 3048 and Vs 1524 m/s", async () => {
    const { body } = await get("dtc=100&dts=200&rho=2.3");
    expect(body.vp).toBe(3048);
    expect(body.vs).toBe(1524);
    expect(body.nu).toBeCloseTo(1 / 3, 14);
  });

  it("gives the same moduli for the same rock in m/s + g/cm3 + GPa, ft/s + kg/m3 + Mpsi, and µs/m", async () => {
    const a = (await get("vp=3048&vs=1524&rho=2.3")).body;
    const b = (await get("vp=10000&vs=5000&rho=2300&velocity_unit=ft/s&density_unit=kg/m3&modulus_unit=Mpsi")).body;
    const c = (await get(`dtc=${1e6 / 3048}&dts=${1e6 / 1524}&rho=2.3&slowness_unit=us/m&modulus_unit=MPa`)).body;
    expect(relativeError(b.E * 6.894757293168, a.E)).toBeLessThan(1e-12);
    expect(relativeError(c.E / 1000, a.E)).toBeLessThan(1e-12);
    expect(b.units).toMatchObject({ velocity: "ft/s", density: "kg/m3", modulus: "Mpsi", lambda_rho: "Mpsi*g/cm3" });
  });

  it("explains each flag with the values involved, and returns null moduli for an invalid sample", async () => {
    const { response, body } = await get("vp=2000&vs=2100&rho=2.4");
    expect(response.statusCode).toBe(200);
    expect(body.valid).toBe(false);
    expect(body.E).toBeNull();
    expect(body.vp).toBe(2000);
    expect(body.flags).toEqual([
      { code: "vs_not_below_vp", severity: "invalid", message: expect.stringContaining("Here Vs = 2100 m/s and Vp = 2000 m/s") },
    ]);
  });

  it("keep_negative_poisson=true returns the values of a Vp/Vs < √2 sample, flagged suspect", async () => {
    const strict = (await get("vp=2600&vs=2000&rho=2.4")).body;
    const kept = (await get("vp=2600&vs=2000&rho=2.4&keep_negative_poisson=true")).body;
    expect(strict.E).toBeNull();
    expect(strict.flags[0]).toMatchObject({ code: "vp_vs_below_sqrt2", severity: "invalid" });
    expect(kept.nu).toBeLessThan(0);
    expect(kept.flags[0]).toMatchObject({ code: "vp_vs_below_sqrt2", severity: "suspect" });
  });

  it("a density log in kg/m3 sent as g/cm3 (2400 for 2.4) is density_impossible: invalid, moduli null, and the flag names the value and the likely unit mistake", async () => {
    const { body } = await get("dtc=95&dts=170&rho=2400");
    expect(body.valid).toBe(false);
    expect(body.E).toBeNull();
    const flag = body.flags.find((f: { code: string }) => f.code === "density_impossible");
    expect(flag).toMatchObject({ severity: "invalid" });
    expect(JSON.stringify(flag)).toContain("Here rho = 2400 g/cm3.");
    expect(JSON.stringify(flag)).toContain("kg/m3 read as g/cm3");
  });

  it("treats the null value as missing and lets the request change it and the plausibility limits", async () => {
    const missing = (await get("vp=3000&vs=-999.25&rho=2.4")).body;
    expect(missing.flags.map((f: { code: string }) => f.code)).toEqual(["missing"]);
    const ownNull = (await get("vp=3000&vs=-9999&rho=2.4&null_value=-9999")).body;
    expect(ownNull.flags.map((f: { code: string }) => f.code)).toEqual(["missing"]);
    const limits = (await get("vp=3000&vs=1500&rho=2.4&rho_max_g_cm3=2.3&vp_vs_max=1.9")).body;
    expect(limits.flags.map((f: { code: string }) => f.code)).toEqual(["density_out_of_range", "vp_vs_high"]);
    expect(limits.limits).toMatchObject({ rho_max_g_cm3: 2.3, vp_vs_max: 1.9 });
    expect(limits.E).not.toBeNull();
  });

  it.each([
    ["vs=1500&rho=2.4", "query.vp", "give vp (velocity) or dtc (slowness)"],
    ["vp=3000&dtc=100&vs=1500&rho=2.4", "query.dtc", "not both"],
    ["vp=3000&vs=1500", "query.rho", ""],
    ["vp=3000&vs=1500&rho=2.4&modulus_unit=kbar", "query.modulus_unit", "GPa"],
    ["vp=abc&vs=1500&rho=2.4", "query.vp", "number"],
    ["vp=1e309&vs=1500&rho=2.4", "query.vp", 'got "1e309", which is beyond a 64-bit float'],
    ["vp=95abc&vs=1500&rho=2.4", "query.vp", 'got "95abc"'],
    ["vp=95%00&vs=1500&rho=2.4", "query.vp", 'got "95\\u0000"'],
    ["dtc=95&dtc=96&dts=170&rho=2.4", "query.dtc", 'is given 2 times ("95", "96"): give it once'],
    ["dtc=95&dts=170&rho=2.4&rho_min_g_cm3=-5", "query.rho_min_g_cm3", "must be above 0, got -5"],
    ["vp=3000&vs=1500&rho=2.4&Vp=1", "query.Vp", "unknown field"],
    ["dtc=&dts=170&rho=2.4", "query.dtc", "is empty"],
    ["vp=0x10&vs=1500&rho=2.4", "query.vp", "expected a finite decimal number"],
  ])("GET ?%s is a 400 problem naming %s", async (query, field, words) => {
    const { response, body } = await get(query);
    expect(response.statusCode).toBe(400);
    expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
    expect(body).toMatchObject({ type: "/problems/invalid-request", status: 400, title: expect.any(String) });
    expect(body.errors).toContainEqual({ field, message: expect.stringContaining(words) });
  });

  it.each([["image/png"], ["application/json;q=0"], ["text/csv, application/x-las"]])(
    "Accept: %s, which names nothing this endpoint writes, is a 406 problem (RFC 9110 §12.5.1), as openapi.yaml documents",
    async (accept) => {
      const app = await build();
      const response = await app.inject({ url: "/v1/elastic?dtc=95&dts=170&rho=2.45", headers: { accept } });
      expect(response.statusCode).toBe(406);
      expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
      expect(response.json()).toMatchObject({ type: "/problems/not-acceptable", detail: expect.stringContaining("application/json") });
    },
  );

  it.each([["*/*"], ["application/*"], ["application/json"], ["text/html, application/json;q=0.5"]])("Accept: %s gets the JSON answer", async (accept) => {
    const app = await build();
    const response = await app.inject({ url: "/v1/elastic?dtc=95&dts=170&rho=2.45", headers: { accept } });
    expect(response.statusCode).toBe(200);
    expect(response.headers["content-type"]).toMatch(/^application\/json/);
  });

  it("a body sent with the GET is refused (400 naming the body), not silently ignored", async () => {
    const app = await build();
    const response = await app.inject({
      method: "GET",
      url: "/v1/elastic?dtc=95&dts=170&rho=2.45",
      headers: { "content-type": "application/json" },
      payload: '{"dtc":[100]}',
    });
    expect(response.statusCode).toBe(400);
    expect(response.json().errors).toContainEqual({ field: "body", message: expect.stringContaining("POST") });
  });

  it.each([
    ["vp_min_m_s=8000&vp_max_m_s=1000", "query.vp_min_m_s", "vp_min_m_s (8000) must be below vp_max_m_s (1000)"],
    ["vp_min_m_s=8000", "query.vp_min_m_s", "vp_min_m_s (8000) must be below vp_max_m_s (7500, the default)"],
    ["rho_max_g_cm3=0.5", "query.rho_max_g_cm3", "rho_min_g_cm3 (1, the default) must be below rho_max_g_cm3 (0.5)"],
    ["vs_min_m_s=900&vs_max_m_s=900", "query.vs_min_m_s", "must be below"],
  ])("a plausibility range whose bounds are reversed or equal after the defaults (?%s) is a 400 naming %s", async (limits, field, words) => {
    const { response, body } = await get(`dtc=95&dts=170&rho=2.45&${limits}`);
    expect(response.statusCode).toBe(400);
    expect(body.errors).toContainEqual({ field, message: words.includes("(") ? words : expect.stringContaining(words) });
  });

  it("returns the bulk density used in the unit it was given in, which units.density names (2450 kg/m3 stays 2450)", async () => {
    const { body } = await get("dtc=95&dts=170&rho=2450&density_unit=kg/m3");
    expect(body.rho).toBe(2450);
    expect(body.units.density).toBe("kg/m3");
    const same = await get("dtc=95&dts=170&rho=2.45");
    expect(same.body.rho).toBe(2.45);
    expect(same.body.units.density).toBe("g/cm3");
    // The same rock either way: 2450 kg/m3 is 2.45 g/cm3 (SI definition of the gram and the metre).
    expect(body.E).toBeCloseTo(same.body.E, 12);
  });
});

