import { describe, expect, it } from "vitest";
import { problemSchema } from "../../server/schemas/problem.js";
import { build } from "../helpers/build.js";

const RICKMAN = "brittleness.rickman2008";
const LACY = "static_e.lacy1997";

const post = async (payload: object) => {
  const app = await build();
  const response = await app.inject({ method: "POST", url: "/v1/elastic", payload });
  return { response, body: response.json() };
};

/** Every refusal is an RFC 9457 problem of the invalid-request kind (server/problems.ts). */
const expectInvalid = (response: { statusCode: number; headers: Record<string, unknown> }, body: unknown) => {
  expect(response.statusCode).toBe(400);
  expect(response.headers["content-type"]).toMatch(/^application\/problem\+json/);
  return problemSchema.parse(body);
};

const columns = { dtc: [80, 82], dts: [140, 143], rho: [2.5, 2.52] };

describe("correlation_options must name a correlation the request applies", () => {
  it("options for a catalogue correlation the request does not apply are a 400 naming the entry and the applied correlations", async () => {
    const { response, body } = await post({ ...columns, correlations: [LACY, "ucs.mcnally1987"], correlation_options: { [RICKMAN]: { e_max_mpsi: 12 } } });
    const problem = expectInvalid(response, body);
    expect(problem.type).toBe("/problems/invalid-request");
    expect(problem.errors).toEqual([
      { field: `body.correlation_options.${RICKMAN}`, message: expect.stringContaining("this request applies static_e.lacy1997, ucs.mcnally1987") },
    ]);
    expect(problem.errors?.[0].message).toContain(`add ${RICKMAN} to correlations`);
  });

  it("options without any correlation are a 400 saying the request applies none (they were ignored before)", async () => {
    const { response, body } = await post({ ...columns, correlation_options: { [RICKMAN]: { nu_min: 0.1 } } });
    const problem = expectInvalid(response, body);
    expect(problem.errors).toEqual([{ field: `body.correlation_options.${RICKMAN}`, message: expect.stringContaining("applies no correlation") }]);
  });

  it("options for an id that is not in the catalogue are a 400 saying so", async () => {
    const { response, body } = await post({ ...columns, correlations: [LACY, RICKMAN], correlation_options: { "brittleness.rickman2080": { nu_min: 0.1 } } });
    const problem = expectInvalid(response, body);
    expect(problem.errors).toEqual([
      { field: "body.correlation_options.brittleness.rickman2080", message: expect.stringContaining('no correlation "brittleness.rickman2080" in the catalogue') },
    ]);
  });

  it("every unapplied entry is listed, while the applied ones pass", async () => {
    const { response, body } = await post({
      ...columns,
      correlations: [LACY, RICKMAN],
      correlation_options: { [RICKMAN]: { e_max_mpsi: 12 }, "ucs.mcnally1987": {}, "ucs.horsrud2001": {} },
    });
    const problem = expectInvalid(response, body);
    expect(problem.errors?.map((error) => error.field)).toEqual(["body.correlation_options.ucs.mcnally1987", "body.correlation_options.ucs.horsrud2001"]);
  });

  it("options for the vs_from correlation are a 400: gap filling uses it as published, without options", async () => {
    const { response, body } = await post({ dtc: [80], rho: [2.5], vs_from: "vs.castagna1985", correlation_options: { "vs.castagna1985": { a: 1 } } });
    const problem = expectInvalid(response, body);
    expect(problem.errors).toEqual([{ field: "body.correlation_options.vs.castagna1985", message: expect.stringContaining("vs_from and rho_from use vs.castagna1985 as published") }]);
  });

  it("an option name the correlation does not have is a 400 listing its options (Rickman et al. 2008 define four bounds)", async () => {
    const { response, body } = await post({ ...columns, correlations: [LACY, RICKMAN], correlation_options: { [RICKMAN]: { e_maximum: 12 } } });
    const problem = expectInvalid(response, body);
    expect(problem.errors).toEqual([
      { field: `body.correlation_options.${RICKMAN}.e_maximum`, message: expect.stringContaining("e_min_mpsi, e_max_mpsi, nu_min, nu_max") },
    ]);
  });

  it("any option for a correlation that takes none is a 400 (McNally 1987 is a formula of Δt alone)", async () => {
    const { response, body } = await post({ ...columns, correlations: ["ucs.mcnally1987"], correlation_options: { "ucs.mcnally1987": { a: 1 } } });
    const problem = expectInvalid(response, body);
    expect(problem.errors).toEqual([{ field: "body.correlation_options.ucs.mcnally1987.a", message: "ucs.mcnally1987 takes no options" }]);
  });

  it("options for a correlation applied only in a zone are used there: the zone's value equals the whole-request value with the same bounds", async () => {
    const depth = [1000, 1001, 1002];
    const well = { depth, dtc: [80, 82, 84], dts: [140, 143, 150], rho: [2.5, 2.52, 2.48] };
    const options = { [RICKMAN]: { e_max_mpsi: 12, nu_min: 0.1 } };
    const zoned = await post({
      ...well,
      correlation_options: options,
      zones: [{ name: "Kestrel_Shale", top: 1001, base: 1003, correlations: [LACY, RICKMAN] }],
    });
    expect(zoned.response.statusCode).toBe(200);
    const whole = await post({ ...well, correlations: [LACY, RICKMAN], correlation_options: options });
    const standard = await post({ ...well, correlations: [LACY, RICKMAN] });
    const zonedValues = zoned.body.derived[RICKMAN].values;
    expect(zonedValues[0]).toBeNull();
    expect(zonedValues.slice(1)).toEqual(whole.body.derived[RICKMAN].values.slice(1));
    // Rickman et al. (2008): BI falls as Emax rises, so the widened bound must change the value.
    expect(zonedValues[1]).not.toBe(standard.body.derived[RICKMAN].values[1]);
  });

  it("a body large enough for the worker threads gets the same 400 (JSON bodies over 64 KiB are prepared there)", async () => {
    const samples = 6000;
    const big = { dtc: Array(samples).fill(80.123456), dts: Array(samples).fill(140.123456), rho: Array(samples).fill(2.512345) };
    expect(JSON.stringify(big).length).toBeGreaterThan(64 * 1024);
    const { response, body } = await post({ ...big, correlation_options: { [RICKMAN]: { nu_min: 0.1 } } });
    const problem = expectInvalid(response, body);
    expect(problem.errors?.[0].field).toBe(`body.correlation_options.${RICKMAN}`);
  });

  it.each([
    ["GET /v1/elastic", "GET", "/v1/elastic?dtc=80&dts=140&rho=2.5&correlation_options=x"],
    ["POST /v1/logs", "POST", "/v1/logs?correlation_options=x"],
  ])("%s has no correlation_options query parameter: naming one is a 400 for an unknown field", async (_name, method, url) => {
    const app = await build();
    const response = await app.inject({ method: method as "GET" | "POST", url, headers: { "content-type": "text/csv" }, payload: method === "POST" ? "DEPT,DTC,DTS,RHOB\n1000,80,140,2.5\n" : undefined });
    const problem = expectInvalid(response, response.json());
    expect(problem.errors).toContainEqual({ field: "query.correlation_options", message: expect.stringContaining("unknown field") });
  });
});

describe("correlation_options must lie in each option's declared range (Rickman et al. 2008, SPE 115258: bounds per play)", () => {
  const LACY_SANDSTONE = "static_e.lacy1997_sandstone";
  const withOptions = (options: Record<string, number>, extra: object = columns) =>
    post({ ...extra, correlations: [LACY_SANDSTONE, RICKMAN], correlation_options: { [RICKMAN]: options } });

  it.each([
    [
      "Young's modulus bounds of ±1.7e308, whose difference overflowed",
      { e_min_mpsi: -1.7e308, e_max_mpsi: 1.7e308 },
      [{ field: `body.correlation_options.${RICKMAN}.e_min_mpsi`, message: "must be a finite number above 0 Mpsi; got -1.7e+308" }],
    ],
    [
      "Poisson's ratio bounds outside (−1, 0.5], what isotropic elasticity allows (Landau & Lifshitz §5, from memory)",
      { nu_min: -5, nu_max: 7 },
      [
        { field: `body.correlation_options.${RICKMAN}.nu_min`, message: "must be a number above -1 and at most 0.5; got -5" },
        { field: `body.correlation_options.${RICKMAN}.nu_max`, message: "must be a number above -1 and at most 0.5; got 7" },
      ],
    ],
    [
      "e_max_mpsi one ulp above the default e_min_mpsi of 1, which gave BI ≈ −9e15 %",
      { e_max_mpsi: 1.0000000000000002 },
      [{ field: `body.correlation_options.${RICKMAN}.e_max_mpsi`, message: expect.stringContaining("must exceed e_min_mpsi (1, its default) by at least 0.008 Mpsi") }],
    ],
  ])("%s is a 400 naming the option's path and the accepted range", async (_name, options, errors) => {
    const { response, body } = await withOptions(options);
    const problem = expectInvalid(response, body);
    expect(problem.type).toBe("/problems/invalid-request");
    expect(problem.errors).toEqual(errors);
    expect(problem.detail).toContain(`correlation_options.${RICKMAN}.`);
  });

  it("the same 400 for a correlation applied only in a zone, and for a body prepared on the worker threads (over 64 KiB)", async () => {
    const depth = [1000, 1001, 1002];
    const zoned = await post({
      depth,
      ...{ dtc: [80, 82, 84], dts: [140, 143, 150], rho: [2.5, 2.52, 2.48] },
      correlation_options: { [RICKMAN]: { nu_max: 0.6 } },
      zones: [{ name: "Kestrel_Shale", top: 1001, base: 1003, correlations: [LACY_SANDSTONE, RICKMAN] }],
    });
    expect(expectInvalid(zoned.response, zoned.body).errors).toEqual([
      { field: `body.correlation_options.${RICKMAN}.nu_max`, message: "must be a number above -1 and at most 0.5; got 0.6" },
    ]);
    const samples = 6000;
    const big = { dtc: Array(samples).fill(80.123456), dts: Array(samples).fill(140.123456), rho: Array(samples).fill(2.512345) };
    const large = await withOptions({ e_min_mpsi: 0 }, big);
    expect(expectInvalid(large.response, large.body).errors?.[0].field).toBe(`body.correlation_options.${RICKMAN}.e_min_mpsi`);
  });

  it("bounds inside their ranges still work: ν_max = 0.5 (G = 0) with a wide E span gives the published formula's value", async () => {
    const { response, body } = await withOptions({ e_min_mpsi: 0.5, e_max_mpsi: 12, nu_min: 0, nu_max: 0.5 });
    expect(response.statusCode).toBe(200);
    const es = body.derived[LACY_SANDSTONE].values[0] / 6.894757293168362; // GPa → Mpsi (1 psi = 6894.757293168362 Pa, core/units.ts)
    const nu = body.nu[0];
    // Rickman et al. (2008): BI = 50·((E − Emin)/(Emax − Emin) + (νmax − ν)/(νmax − νmin))
    expect(body.derived[RICKMAN].values[0]).toBeCloseTo(50 * ((es - 0.5) / 11.5 + (0.5 - nu) / 0.5), 9);
  });

  it("GET /v1/correlations/{id} lists each option's range and pairing, as the refusals word them", async () => {
    const app = await build();
    const response = await app.inject({ url: `/v1/correlations/${RICKMAN}` });
    expect(response.statusCode).toBe(200);
    const options = response.json().options;
    expect(options.map((option: { name: string }) => option.name)).toEqual(["e_min_mpsi", "e_max_mpsi", "nu_min", "nu_max"]);
    expect(options[0]).toMatchObject({ range: { min: 0, min_included: false, max: null, max_included: false }, below: "e_max_mpsi" });
    expect(options[0].accepts).toContain("a finite number above 0 Mpsi, below e_max_mpsi");
    expect(options[3]).toMatchObject({ range: { min: -1, min_included: false, max: 0.5, max_included: true }, below: null });
  });
});
