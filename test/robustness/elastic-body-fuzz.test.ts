import fc from "fast-check";
import { describe, expect, it } from "vitest";
import {
  CORRELATIONS,
  DENSITY_UNITS,
  DEPTH_UNITS,
  IMPEDANCE_UNITS,
  MODULUS_UNITS,
  SLOWNESS_UNITS,
  VELOCITY_UNITS,
} from "../../core/index.js";
import { CASE_BOUND_MS, FUZZ_SEED, expectColumnsOfLength, expectSuccessOrProblem, withinBound, fuzzedApp } from "./answer-checks.js";

const COLUMN_KEYS = ["depth", "top", "base", "vp", "vs", "dtc", "dts", "rho"];
const OPTION_KEYS = ["units", "null_value", "keep_negative_poisson", "limits", "correlations", "correlation_options", "vs_from", "rho_from", "fill", "zones"];
const PROTOTYPE_KEYS = ["__proto__", "constructor", "prototype", "toString", "hasOwnProperty", "valueOf"];
const UNITS_BY_KEY: Record<string, string[]> = {
  velocity: Object.keys(VELOCITY_UNITS),
  slowness: Object.keys(SLOWNESS_UNITS),
  density: Object.keys(DENSITY_UNITS),
  modulus: Object.keys(MODULUS_UNITS),
  depth: Object.keys(DEPTH_UNITS),
  impedance: Object.keys(IMPEDANCE_UNITS),
};
const UNIT_KEYS = Object.keys(UNITS_BY_KEY);
const UNIT_NAMES = Object.values(UNITS_BY_KEY).flat();
const LIMIT_KEYS = ["vp_min_m_s", "vp_max_m_s", "vs_min_m_s", "vs_max_m_s", "rho_min_g_cm3", "rho_max_g_cm3", "vp_vs_max"];
const CORRELATION_IDS = CORRELATIONS.map((correlation) => correlation.id);
const idsOfKind = (kind: string) => CORRELATIONS.filter((correlation) => correlation.kind === kind).map((correlation) => correlation.id);
const OPTION_NAMES = CORRELATIONS.flatMap((correlation) => correlation.options.map((option) => option.name));

/** Numbers as JSON text, so values JSON.stringify cannot write (1e309, -0, 1e-400, 30 digits) reach the parser. */
const numberText = fc.oneof(
  { weight: 3, arbitrary: fc.double({ min: 40, max: 3500, noNaN: true }).map(String) },
  { weight: 1, arbitrary: fc.double({ noNaN: true }).map((value) => (Number.isFinite(value) ? String(value) : value > 0 ? "1e309" : "-1e309")) },
  { weight: 1, arbitrary: fc.integer().map(String) },
  {
    weight: 1,
    arbitrary: fc.constantFrom("1e309", "-1e309", "1e-400", "-0", "0", "5e-324", "1.7976931348623157e308", "123456789012345678901234567890", "-999.25", "2.45E+0"),
  },
);

const textValue = fc
  .oneof(fc.string(), fc.string({ unit: "binary" }), fc.constantFrom("95.2", "NaN", "Infinity", "-999.25", "", "null", ...UNIT_NAMES))
  .map((text) => JSON.stringify(text));

const keyText = fc.oneof(fc.constantFrom(...COLUMN_KEYS, ...OPTION_KEYS), fc.constantFrom(...PROTOTYPE_KEYS), fc.string());

const objectText = (entries: [string, string][]): string => `{${entries.map(([key, value]) => `${JSON.stringify(key)}:${value}`).join(",")}}`;

/** Any JSON value, nested a few levels, with prototype and random keys. */
const { anyValue } = fc.letrec<{ anyValue: string; arrayValue: string; objectValue: string }>((tie) => ({
  anyValue: fc.oneof(
    { depthSize: "small", withCrossShrink: true },
    numberText,
    textValue,
    fc.constantFrom("true", "false", "null"),
    tie("arrayValue"),
    tie("objectValue"),
  ),
  arrayValue: fc.array(tie("anyValue"), { maxLength: 5 }).map((items) => `[${items.join(",")}]`),
  objectValue: fc.array(fc.tuple(keyText, tie("anyValue")), { maxLength: 5 }).map(objectText),
}));

/** Arrays or objects nested thousands deep. */
const deepValue = fc
  .tuple(fc.integer({ min: 100, max: 20_000 }), fc.boolean(), fc.constantFrom("1", "null", '{"__proto__":1}', "[]"))
  .map(([depth, arrays, core]) => (arrays ? `${"[".repeat(depth)}${core}${"]".repeat(depth)}` : `${'{"a":'.repeat(depth)}${core}${"}".repeat(depth)}`));

/** Mostly valid, sometimes not: the parts of a body should reach the computation often, not only the validator. */
const mostly = (valid: fc.Arbitrary<string>) => fc.oneof({ weight: 12, arbitrary: valid }, { weight: 1, arbitrary: anyValue });

const cleanSample = fc.oneof({ weight: 12, arbitrary: numberText }, { weight: 1, arbitrary: fc.constant("null") });
const anySample = fc.oneof({ weight: 12, arbitrary: numberText }, { weight: 1, arbitrary: fc.constant("null") }, { weight: 1, arbitrary: anyValue });

/** A column of `rows` values: a short random pattern, tiled so that long columns (a few thousand) stay cheap to generate. */
const columnText = (rows: number) =>
  fc
    .oneof({ weight: 20, arbitrary: fc.array(cleanSample, { minLength: 1, maxLength: 30 }) }, { weight: 1, arbitrary: fc.array(anySample, { minLength: 1, maxLength: 30 }) })
    .map((pattern) => `[${Array.from({ length: rows }, (_, i) => pattern[i % pattern.length]).join(",")}]`);

/** Units per quantity, mostly one of that quantity's units, sometimes another quantity's, a junk key or a junk value. */
const unitsText = fc
  .array(
    fc.oneof(
      { weight: 12, arbitrary: fc.constantFrom(...UNIT_KEYS).chain((key) => fc.constantFrom(...UNITS_BY_KEY[key]).map((unit): [string, string] => [key, JSON.stringify(unit)])) },
      { weight: 1, arbitrary: fc.tuple(fc.oneof(fc.constantFrom(...UNIT_KEYS), keyText), fc.oneof(fc.constantFrom(...UNIT_NAMES).map((unit) => JSON.stringify(unit)), anyValue)) },
    ),
    { maxLength: 6 },
  )
  .map(objectText);

const positiveText = fc.double({ min: 0.001, max: 1e6, noNaN: true }).map(String);

const limitsText = fc
  .array(fc.tuple(fc.oneof({ weight: 12, arbitrary: fc.constantFrom(...LIMIT_KEYS) }, { weight: 1, arbitrary: keyText }), mostly(positiveText)), { maxLength: 3 })
  .map(objectText);

const correlationId = fc.oneof({ weight: 12, arbitrary: fc.constantFrom(...CORRELATION_IDS) }, { weight: 1, arbitrary: fc.string() });

const correlationsText = fc.oneof(
  { weight: 8, arbitrary: fc.array(correlationId, { maxLength: 6 }).map((ids) => JSON.stringify(ids)) },
  { weight: 1, arbitrary: fc.array(correlationId, { minLength: 65, maxLength: 80 }).map((ids) => JSON.stringify(ids)) },
  { weight: 1, arbitrary: anyValue },
);

const correlationOptionsText = fc
  .array(
    fc.tuple(
      correlationId,
      fc.array(fc.tuple(fc.oneof({ weight: 8, arbitrary: fc.constantFrom(...OPTION_NAMES) }, { weight: 1, arbitrary: keyText }), mostly(numberText)), { maxLength: 4 }).map(objectText),
    ),
    { maxLength: 3 },
  )
  .map(objectText);

/** A zone, mostly with top above base, sometimes with bounds of any order or type. */
const zoneText = fc
  .record({
    name: mostly(fc.string({ maxLength: 250 }).map((name) => JSON.stringify(name))),
    bounds: fc.oneof(
      { weight: 6, arbitrary: fc.tuple(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.double({ noNaN: true, noDefaultInfinity: true })).map(([a, b]) => [String(Math.min(a, b)), String(Math.max(a, b))]) },
      { weight: 1, arbitrary: fc.tuple(mostly(numberText), mostly(numberText)) },
    ),
    correlations: fc.option(correlationsText, { nil: undefined, freq: 3 }),
  })
  .map(({ name, bounds: [top, base], correlations }) => objectText([["name", name], ["top", top], ["base", base], ...(correlations === undefined ? [] : [["correlations", correlations] as [string, string]])]));

/** Values of the body's options, each mostly valid. */
const OPTION_VALUES: Record<string, fc.Arbitrary<string>> = {
  units: mostly(unitsText),
  null_value: mostly(numberText),
  keep_negative_poisson: mostly(fc.constantFrom("true", "false")),
  limits: mostly(limitsText),
  correlations: correlationsText,
  correlation_options: mostly(correlationOptionsText),
  vs_from: mostly(fc.oneof({ weight: 6, arbitrary: fc.constantFrom(...idsOfKind("vs")) }, { weight: 1, arbitrary: correlationId }).map((id) => JSON.stringify(id))),
  rho_from: mostly(fc.oneof({ weight: 6, arbitrary: fc.constantFrom(...idsOfKind("density")) }, { weight: 1, arbitrary: correlationId }).map((id) => JSON.stringify(id))),
  fill: mostly(fc.constantFrom('"nulls"', '"all"')),
  zones: mostly(fc.array(zoneText, { maxLength: 6 }).map((zones) => `[${zones.join(",")}]`)),
};

/** Up to four options. */
const optionEntries = fc
  .subarray(OPTION_KEYS, { maxLength: 4 })
  .chain((keys) => fc.tuple(...keys.map((key) => OPTION_VALUES[key].map((value): [string, string] => [key, value]))));

/** Which columns a body gives (one of vp/dtc, one of vs/dts, rho, depth or top and base, mostly as the schema asks) and their lengths. */
const columnEntries = fc
  .tuple(
    fc.oneof({ weight: 6, arbitrary: fc.integer({ min: 0, max: 40 }) }, { weight: 1, arbitrary: fc.integer({ min: 1000, max: 4000 }) }),
    fc.oneof({ weight: 15, arbitrary: fc.constantFrom(["vp"], ["dtc"]) }, { weight: 1, arbitrary: fc.constantFrom([], ["vp", "dtc"]) }),
    fc.oneof({ weight: 15, arbitrary: fc.constantFrom(["vs"], ["dts"]) }, { weight: 1, arbitrary: fc.constantFrom([], ["vs", "dts"]) }),
    fc.oneof({ weight: 15, arbitrary: fc.constant(["rho"]) }, { weight: 1, arbitrary: fc.constant([]) }),
    fc.oneof({ weight: 15, arbitrary: fc.constantFrom([], ["depth"], ["top", "base"]) }, { weight: 1, arbitrary: fc.constantFrom(["top"], ["depth", "base"]) }),
    fc.oneof({ weight: 15, arbitrary: fc.constant(0) }, { weight: 1, arbitrary: fc.constantFrom(-1, 1) }),
  )
  .chain(([rows, compressional, shear, density, depth, skew]) => {
    const keys = [...depth, ...compressional, ...shear, ...density];
    if (keys.length === 0) return fc.constant([] as [string, string][]);
    return fc.tuple(...keys.map((key, i) => columnText(Math.max(0, rows + (i === keys.length - 1 ? skew : 0))).map((text): [string, string] => [key, text])));
  });

/** A body shaped like a real request (columns and options), with junk, prototype or deeply nested entries mixed in now and then. */
const shapedBody = fc
  .tuple(
    columnEntries,
    optionEntries,
    fc.oneof({ weight: 12, arbitrary: fc.constant([] as [string, string][]) }, { weight: 1, arbitrary: fc.array(fc.tuple(keyText, fc.oneof(anyValue, deepValue)), { minLength: 1, maxLength: 2 }) }),
    fc.oneof({ weight: 15, arbitrary: fc.constant(undefined) }, { weight: 1, arbitrary: fc.tuple(fc.constantFrom(...COLUMN_KEYS, ...OPTION_KEYS), deepValue) }),
  )
  .map(([columns, options, extra, deep]) => objectText([...columns, ...options, ...extra, ...(deep === undefined ? [] : [deep])]));

/** The text cut short or with one character put in: mostly not JSON any more. */
const textMutation = fc.oneof(
  { weight: 12, arbitrary: fc.constant((text: string) => text) },
  { weight: 1, arbitrary: fc.nat().map((at) => (text: string) => text.slice(0, at % (text.length + 1))) },
  {
    weight: 1,
    arbitrary: fc.tuple(fc.nat(), fc.string({ unit: "binary", minLength: 1, maxLength: 3 })).map(([at, insert]) => (text: string) => {
      const cut = at % (text.length + 1);
      return text.slice(0, cut) + insert + text.slice(cut);
    }),
  },
);

const bodyText = fc
  .tuple(fc.oneof({ weight: 10, arbitrary: shapedBody }, { weight: 1, arbitrary: anyValue }, { weight: 1, arbitrary: deepValue }), textMutation)
  .map(([text, mutate]) => mutate(text));

const requestId = fc.oneof(fc.constant(undefined), fc.stringMatching(/^[\x21-\x7e]{0,200}$/));

/** The rows a body declares, read with the standard JSON parser (RFC 8259): the length of each column array it holds. */
const declaredColumnLengths = (text: string): number[] => {
  try {
    const body = JSON.parse(text) as unknown;
    if (typeof body !== "object" || body === null || Array.isArray(body)) return [];
    return COLUMN_KEYS.flatMap((key) => {
      const column = (body as Record<string, unknown>)[key];
      return Array.isArray(column) ? [column.length] : [];
    });
  } catch {
    return [];
  }
};

const app = fuzzedApp();

describe("POST /v1/elastic under random and mutated JSON bodies", () => {
  it("always answers 2xx or a 4xx problem document (RFC 9457), never 5xx nor a hang; a 2xx keeps every input row", async () => {
    await fc.assert(
      fc.asyncProperty(bodyText, requestId, async (text, id) => {
        const answer = await withinBound(
          app.inject({
            method: "POST",
            url: "/v1/elastic",
            headers: { "content-type": "application/json", ...(id === undefined ? {} : { "x-request-id": id }) },
            payload: text,
          }),
          CASE_BOUND_MS,
          "POST /v1/elastic",
        );
        expectSuccessOrProblem(answer, text);
        if (answer.statusCode >= 300) return;
        const lengths = declaredColumnLengths(text);
        const json = answer.json() as Record<string, unknown>;
        for (const length of lengths) expect(length, "every input column has count rows").toBe(json.count);
        expectColumnsOfLength(json, lengths[0], text);
      }),
      { seed: FUZZ_SEED, numRuns: 300 },
    );
  }, 120_000);

  it("refuses a __proto__ or constructor key at any depth and place with a 400 forbidden-key problem (issue 5, item 1)", async () => {
    const places = fc.constantFrom(
      (member: string) => `{${member},"dtc":[90],"dts":[160],"rho":[2.4]}`,
      (member: string) => `{"dtc":[90],"dts":[160],"rho":[2.4],"correlation_options":{${member}}}`,
      (member: string) => `{"depth":[1],"dtc":[90],"dts":[160],"rho":[2.4],"zones":[{"name":"Linnet Sand","top":0,"base":2,${member}}]}`,
      (member: string) => `{"dtc":[90],"dts":[160],"rho":[2.4],"units":{${member}}}`,
      (member: string) => `{"dtc":[90],"dts":[160],"rho":[2.4],"limits":{${member}}}`,
    );
    await fc.assert(
      fc.asyncProperty(fc.constantFrom("__proto__", "constructor"), fc.integer({ min: 0, max: 300 }), places, anyValue, async (forbidden, depth, place, inner) => {
        const member = `${'"qc":{'.repeat(depth)}${JSON.stringify(forbidden)}:{"polluted":true,"inner":${inner}}${"}".repeat(depth)}`;
        const text = place(member);
        const answer = await withinBound(
          app.inject({ method: "POST", url: "/v1/elastic", headers: { "content-type": "application/json" }, payload: text }),
          CASE_BOUND_MS,
          "POST /v1/elastic",
        );
        expectSuccessOrProblem(answer, text);
        expect(answer.json().type, text.slice(0, 300)).toBe("/problems/forbidden-key");
        expect(({} as Record<string, unknown>).polluted).toBeUndefined();
      }),
      { seed: FUZZ_SEED, numRuns: 100 },
    );
  });
});
