// The reference for every check is JSON.parse itself (ECMA-262, section 25.5.1, JSON.parse) of the body decoded as
// UTF-8, as the standard path decodes it; the number grammar is that of RFC 8259, section 6.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { readJsonColumns } from "../../core/index.js";

const COLUMNS = new Set(["depth", "dtc", "rho"]);
const bytesOf = (text: string) => new Uint8Array(Buffer.from(text, "utf8"));
const standard = (bytes: Uint8Array): unknown => JSON.parse(Buffer.from(bytes).toString("utf8"));

/** JSON.parse's value with the column arrays (root object, named key, numbers and nulls only) as Float64Arrays. */
const expected = (value: unknown): unknown => {
  if (value === null || typeof value !== "object" || Array.isArray(value)) return value;
  return Object.fromEntries(
    Object.entries(value).map(([key, child]) =>
      COLUMNS.has(key) && Array.isArray(child) && child.every((x) => x === null || typeof x === "number")
        ? [key, Float64Array.from(child, (x) => (x === null ? NaN : x))]
        : [key, child],
    ),
  );
};

const hasRefusedKey = (value: unknown): boolean =>
  value !== null &&
  typeof value === "object" &&
  Object.entries(value).some(([key, child]) => key === "__proto__" || key === "constructor" || hasRefusedKey(child));

/** Reads with the fast reader; when it declines, JSON.parse must refuse the text, or the text holds a refused key. */
const agreesWithJsonParse = (bytes: Uint8Array) => {
  const read = readJsonColumns(bytes, COLUMNS);
  let reference: { value: unknown } | undefined;
  try {
    reference = { value: standard(bytes) };
  } catch {
    reference = undefined;
  }
  if (read === undefined) {
    if (reference !== undefined && !hasRefusedKey(reference.value)) throw new Error(`declined valid JSON: ${Buffer.from(bytes).toString("utf8").slice(0, 200)}`);
    return;
  }
  if (reference === undefined) throw new Error(`read invalid JSON: ${Buffer.from(bytes).toString("utf8").slice(0, 200)}`);
  // toStrictEqual tells -0 from 0 (Object.is) and a Float64Array from an array.
  expect(read).toStrictEqual(expected(reference.value));
};

/** JSON number texts beyond what JSON.stringify writes: long mantissas, leading zeros in fractions, exponents. */
const numberText = fc.oneof(
  fc.double({ noNaN: true, noDefaultInfinity: true }).map(String),
  fc.tuple(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.integer({ min: 0, max: 20 })).map(([x, digits]) => x.toExponential(digits)),
  fc
    .tuple(
      fc.boolean(),
      fc.stringMatching(/^(0|[1-9][0-9]{0,24})$/),
      fc.option(fc.stringMatching(/^[0-9]{1,25}$/)),
      fc.option(fc.tuple(fc.constantFrom("e", "E"), fc.constantFrom("", "+", "-"), fc.integer({ min: 0, max: 400 }))),
    )
    .map(([minus, whole, fraction, exponent]) => `${minus ? "-" : ""}${whole}${fraction === null ? "" : `.${fraction}`}${exponent === null ? "" : exponent.join("")}`),
);

describe("readJsonColumns (JSON.parse with Float64Array columns)", () => {
  it("reads every JSON number to the double JSON.parse gives (RFC 8259 grammar, ECMA-262 rounding)", () => {
    fc.assert(
      fc.property(numberText, (text) => {
        expect(Object.is(readJsonColumns(bytesOf(text), COLUMNS), JSON.parse(text))).toBe(true);
        const column = readJsonColumns(bytesOf(`{"dtc":[${text},null]}`), COLUMNS) as { dtc: Float64Array };
        expect(Object.is(column.dtc[0], JSON.parse(text))).toBe(true);
        expect(column.dtc[1]).toBeNaN();
      }),
      { numRuns: 20_000 },
    );
  });

  it("reads numbers at the edges of the exact fast path and past them", () => {
    for (const text of ["0", "-0", "-0.0", "0e-5", "9007199254740993", "123456789012345", "1234567890123456", "1e22", "1e23", "1.5e-22", "1e-23",
      "0.000000000000000000001234", "2.2250738585072014e-308", "5e-324", "4.9e-324", "2e-324", "1e309", "-1e309", "1.7976931348623157e308",
      "100000000000000000000000000000000000000000001", "3.141592653589793238462643383279", "0.1", "0.30000000000000004", "2150.1524"]) {
      expect(Object.is(readJsonColumns(bytesOf(text), COLUMNS), JSON.parse(text)), text).toBe(true);
    }
  });

  it("equals JSON.parse on any JSON value, columns aside", () => {
    const withColumns = fc.dictionary(fc.constantFrom("depth", "dtc", "rho", "units", "zones", "x"), fc.oneof(fc.jsonValue(), fc.array(fc.option(fc.double()))));
    fc.assert(
      fc.property(fc.oneof(fc.jsonValue(), withColumns), fc.constantFrom(undefined, 2), (value, indent) => agreesWithJsonParse(bytesOf(JSON.stringify(value, null, indent)))),
      { numRuns: 3000 },
    );
  });

  it("never reads text JSON.parse refuses, and reads what it accepts alike (token soup)", () => {
    const token = fc.constantFrom("[", "]", "{", "}", ",", ":", '"dtc"', '"a"', '"\\u0041"', '"\\x"', "1", "-", "0", "01", ".5", "1.", "1e", "2.45", "-999.25",
      "null", "nul", "true", "tru", "false", " ", "\t", "\n", "\r", "\f", "\u00a0", '"', "\\", '"__proto__"', '"constructor"', "NaN", "Infinity", "+1");
    fc.assert(fc.property(fc.array(token, { maxLength: 30 }), (tokens) => agreesWithJsonParse(bytesOf(tokens.join("")))), { numRuns: 20_000 });
  });

  it("decodes strings as the whole body's UTF-8 decoding does, invalid sequences included", () => {
    fc.assert(
      fc.property(fc.uint8Array({ maxLength: 24 }), fc.string({ unit: "binary" }), (raw, text) => {
        // Raw bytes inside quotes (quote, backslash and control bytes mapped away so that the text stays one string).
        const inner = raw.map((byte) => (byte === 0x22 || byte === 0x5c || byte < 0x20 ? 0x61 : byte));
        agreesWithJsonParse(new Uint8Array([...bytesOf('{"units":"'), ...inner, ...bytesOf(`","x":${JSON.stringify(text)}}`)]));
      }),
      { numRuns: 5000 },
    );
  });

  it("gives columns only under the named keys of the top-level object, and only of numbers and nulls", () => {
    const read = readJsonColumns(bytesOf('{"dtc":[95.2,null,-999.25],"x":[1,2],"zones":[{"dtc":[1]}],"rho":[2.4,"2.5"],"depth":[]}'), COLUMNS) as Record<string, unknown>;
    expect(read.dtc).toStrictEqual(Float64Array.of(95.2, NaN, -999.25));
    expect(read.x).toStrictEqual([1, 2]);
    expect(read.zones).toStrictEqual([{ dtc: [1] }]);
    expect(read.rho).toStrictEqual([2.4, "2.5"]);
    expect(read.depth).toStrictEqual(new Float64Array(0));
    expect(readJsonColumns(bytesOf("[[1,2]]"), COLUMNS)).toStrictEqual([[1, 2]]);
  });

  it("keeps the last of duplicate keys in the first one's place, as JSON.parse does", () => {
    const text = '{"dtc":[1],"a":1,"dtc":[2,3]}';
    const read = readJsonColumns(bytesOf(text), COLUMNS) as Record<string, unknown>;
    expect(Object.keys(read)).toStrictEqual(Object.keys(JSON.parse(text)));
    expect(read.dtc).toStrictEqual(Float64Array.of(2, 3));
  });

  it("declines keys __proto__ and constructor (escaped too), an empty body, a byte-order mark and deep nesting", () => {
    for (const text of ['{"__proto__":{"x":1}}', '{"a":{"constructor":{}}}', '{"\\u005f_proto__":1}', "", " ", "\ufeff{}"]) {
      expect(readJsonColumns(bytesOf(text), COLUMNS), text).toBeUndefined();
    }
    const deep = `${"[".repeat(200_000)}${"]".repeat(200_000)}`;
    expect(() => readJsonColumns(bytesOf(deep), COLUMNS)).not.toThrow();
  });
});
