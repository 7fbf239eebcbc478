import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CORRELATIONS, DENSITY_UNITS, IMPEDANCE_UNITS, MODULUS_UNITS, SLOWNESS_UNITS, VELOCITY_UNITS } from "../../core/index.js";
import { CASE_BOUND_MS, FUZZ_SEED, PROPERTY_COLUMNS, expectSuccessOrProblem, withinBound, fuzzedApp } from "./answer-checks.js";

const SAMPLE_NAMES = ["vp", "vs", "dtc", "dts", "rho"];
const UNIT_PARAMETERS: Record<string, string[]> = {
  velocity_unit: Object.keys(VELOCITY_UNITS),
  slowness_unit: Object.keys(SLOWNESS_UNITS),
  density_unit: Object.keys(DENSITY_UNITS),
  modulus_unit: Object.keys(MODULUS_UNITS),
  impedance_unit: Object.keys(IMPEDANCE_UNITS),
};
const LIMIT_NAMES = ["vp_min_m_s", "vp_max_m_s", "vs_min_m_s", "vs_max_m_s", "rho_min_g_cm3", "rho_max_g_cm3", "vp_vs_max"];
const OTHER_NAMES = ["keep_negative_poisson", "null_value", "correlations", "vs_from", "rho_from", "fill"];
const OPTION_NAMES = [...Object.keys(UNIT_PARAMETERS), ...LIMIT_NAMES, ...OTHER_NAMES];
const PARAMETER_NAMES = [...SAMPLE_NAMES, ...OPTION_NAMES];
const CORRELATION_IDS = CORRELATIONS.map((correlation) => correlation.id);

/** Values as a query carries them: numbers in many spellings, the real words of each parameter, and junk. */
const numberWord = fc.oneof(
  { weight: 8, arbitrary: fc.double({ min: 0.5, max: 8000, noNaN: true }).map(String) },
  { weight: 1, arbitrary: fc.double().map(String) },
  { weight: 1, arbitrary: fc.constantFrom("1e309", "-1e309", "1e-400", "-0", "0", "0x10", "1_000", " 12 ", "", "Infinity", "NaN", "-999.25", "2,45", "1e", ".", "+5") },
);

const valueFor = (name: string): fc.Arbitrary<string> => {
  if (name in UNIT_PARAMETERS) return fc.oneof({ weight: 6, arbitrary: fc.constantFrom(...UNIT_PARAMETERS[name]) }, { weight: 1, arbitrary: fc.string() });
  if (name === "keep_negative_poisson") return fc.constantFrom("true", "false", "1", "0", "yes", "no", "maybe", "");
  if (name === "correlations") return fc.array(fc.oneof(fc.constantFrom(...CORRELATION_IDS), fc.string()), { maxLength: 6 }).map((ids) => ids.join(","));
  if (name === "vs_from" || name === "rho_from") return fc.oneof(fc.constantFrom(...CORRELATION_IDS), fc.string());
  if (name === "fill") return fc.constantFrom("nulls", "all", "", "NULLS");
  return numberWord;
};

const junkName = fc.oneof(fc.constantFrom("__proto__", "constructor", "prototype", "toString", "VP", "vp[]", "vp[0]", "a.b", "zones", "format"), fc.string({ maxLength: 20 }));

const encode = (text: string): string => encodeURIComponent(text);

/** One `name=value` pair: mostly a real parameter with a fitting value, sometimes junk, a bare name, a second `=` or broken percent-encoding. */
const pair = fc.oneof(
  { weight: 8, arbitrary: fc.constantFrom(...OPTION_NAMES).chain((name) => valueFor(name).map((value) => `${name}=${encode(value)}`)) },
  { weight: 1, arbitrary: fc.constantFrom(...SAMPLE_NAMES).chain((name) => valueFor(name).map((value) => `${name}=${encode(value)}`)) },
  { weight: 1, arbitrary: fc.tuple(junkName, fc.string()).map(([name, value]) => `${encode(name)}=${encode(value)}`) },
  { weight: 1, arbitrary: fc.constantFrom(...PARAMETER_NAMES) },
  { weight: 1, arbitrary: fc.tuple(fc.constantFrom(...PARAMETER_NAMES), fc.constantFrom("%", "%zz", "%E0%A4%A", "%00", "%FF%FE", "a==b", "%C0%AE", "&&")).map(([name, junk]) => `${name}=${junk}`) },
);

/** A query mostly shaped like a real one (a sonic pair and a density), with random extra pairs. */
const queryString = fc
  .tuple(
    fc.oneof({ weight: 8, arbitrary: fc.constantFrom(["dtc"], ["vp"]) }, { weight: 1, arbitrary: fc.constantFrom([], ["dtc", "vp"]) }),
    fc.oneof({ weight: 8, arbitrary: fc.constantFrom(["dts"], ["vs"]) }, { weight: 1, arbitrary: fc.constantFrom([], ["dts", "vs"]) }),
    fc.oneof({ weight: 8, arbitrary: fc.constant(true) }, { weight: 1, arbitrary: fc.constant(false) }),
    fc.array(pair, { maxLength: 4 }),
  )
  .chain(([compressional, shear, density, extra]) =>
    fc.tuple(...[...compressional, ...shear, ...(density ? ["rho"] : [])].map((name) => numberWord.map((value) => `${name}=${encode(value)}`))).map((samples) =>
      [...samples, ...extra].join("&"),
    ),
  );

const app = fuzzedApp();

describe("GET /v1/elastic under random query strings", () => {
  it("always answers 2xx or a 4xx problem document (RFC 9457), never 5xx nor a hang; a 2xx is one sample", async () => {
    await fc.assert(
      fc.asyncProperty(queryString, async (query) => {
        const url = `/v1/elastic?${query}`;
        const answer = await withinBound(app.inject({ method: "GET", url }), CASE_BOUND_MS, `GET ${url}`);
        expectSuccessOrProblem(answer, url);
        if (answer.statusCode >= 300) return;
        const point = answer.json() as Record<string, unknown>;
        for (const key of PROPERTY_COLUMNS) expect(point[key] === null || typeof point[key] === "number", `${key} for ${url}`).toBe(true);
        expect(point.valid, url).toBeTypeOf("boolean");
      }),
      { seed: FUZZ_SEED, numRuns: 300 },
    );
  }, 120_000);
});
