// The reference for every check is JSON.parse itself (ECMA-262, section 25.5.1, JSON.parse) of the body decoded as
// UTF-8, as the standard path decodes it; the number grammar is that of RFC 8259, section 6. Names given twice in
// one object (RFC 8259, section 4: names SHOULD be unique, parsers differ on duplicates) are refused instead.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { duplicateNameIssues, InputIssues, readJsonColumns } from "../../core/index.js";

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

/** Object members in valid JSON text: a colon outside strings only ever separates a name from its value (RFC 8259, section 4). */
const membersWritten = (text: string): number => {
  let count = 0;
  for (let i = 0; i < text.length; i++) {
    if (text[i] === '"') for (i++; text[i] !== '"'; i++) i += text[i] === "\\" ? 1 : 0;
    else if (text[i] === ":") count++;
  }
  return count;
};

/** Members JSON.parse kept: fewer than written exactly when some object named a member twice (the last one won). */
const membersKept = (value: unknown): number => {
  if (value === null || typeof value !== "object") return 0;
  const children = Object.values(value);
  return (Array.isArray(value) ? 0 : children.length) + children.reduce((sum: number, child) => sum + membersKept(child), 0);
};

/** Whether the fast reader refused a name given twice: the issues it threw, undefined when it read or declined. */
const readOrIssues = (bytes: Uint8Array): { read: unknown; issues?: InputIssues } => {
  try {
    return { read: readJsonColumns(bytes, COLUMNS) };
  } catch (error) {
    if (error instanceof InputIssues) return { read: undefined, issues: error };
    throw error;
  }
};

/**
 * Reads with the fast reader; when it declines, JSON.parse must refuse the text, or the text holds a refused key.
 * Valid text with a name given twice must be refused by the reader (or declined) and by duplicateNameIssues alike.
 */
const agreesWithJsonParse = (bytes: Uint8Array) => {
  const { read, issues } = readOrIssues(bytes);
  const text = Buffer.from(bytes).toString("utf8");
  let reference: { value: unknown } | undefined;
  try {
    reference = { value: standard(bytes) };
  } catch {
    reference = undefined;
  }
  const duplicated = reference !== undefined && membersWritten(text) > membersKept(reference.value);
  if (reference !== undefined) expect(duplicateNameIssues(text).length > 0, text.slice(0, 200)).toBe(duplicated);
  if (issues !== undefined) {
    if (!duplicated) throw new Error(`refused names of valid JSON without duplicates: ${text.slice(0, 200)}`);
    expect(issues.issues).toStrictEqual(duplicateNameIssues(text));
    return;
  }
  if (read === undefined) {
    if (reference !== undefined && !hasRefusedKey(reference.value)) throw new Error(`declined valid JSON: ${text.slice(0, 200)}`);
    return;
  }
  if (reference === undefined) throw new Error(`read invalid JSON: ${text.slice(0, 200)}`);
  if (duplicated) throw new Error(`read a name given twice without notice: ${text.slice(0, 200)}`);
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
    const token = fc.constantFrom("[", "]", "{", "}", ",", ":", '"dtc"', '"a"', '"\\u0041"', '"\\u0061"', '"\\x"', "1", "-", "0", "01", ".5", "1.", "1e", "2.45", "-999.25",
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

  it("refuses a name given twice in one object, naming its path, where JSON.parse keeps the last without notice (RFC 8259, section 4)", () => {
    const cases: [string, string][] = [
      ['{"dtc":[95],"dts":[170],"rho":[2.4],"dtc":[100]}', "dtc"],
      ['{"dtc":[95],"units":{"slowness":"us/m","slowness":"us/ft"}}', "units.slowness"],
      ['{"zones":[{"top":1},{"top":1,"base":2,"top":3}]}', "zones[1].top"],
      ['{"a":1,"\\u0061":2}', "a"],
      ['{"x":{"a b":1,"a b":2}}', 'x."a b"'],
      ['{"rho":[2.4],"rho":[2.5],"rho":"2.6"}', "rho"],
      ['[{"dtc":[1]},[{"k":null,"k":null}]]', "[1][0].k"],
    ];
    for (const [text, field] of cases) {
      const { read, issues } = readOrIssues(bytesOf(text));
      expect(read, text).toBeUndefined();
      expect(issues?.issues, text).toStrictEqual([{ field, message: expect.stringMatching(/is given more than once in one object; send each name once$/) }]);
      expect(issues?.issues[0].message).toContain(JSON.stringify(field.split(/[.\]]/).at(-1)?.replace(/^"|"$/g, "")));
      expect(duplicateNameIssues(text), text).toStrictEqual(issues?.issues);
    }
    // One name in different objects, and JSON.parse's own reading of a repeated name, for contrast (ECMA-262, JSON.parse).
    expect(readJsonColumns(bytesOf('{"units":{"a":1},"limits":{"a":1},"zones":[{"a":1},{"a":2}]}'), COLUMNS)).toBeDefined();
    expect(JSON.parse('{"dtc":[95],"dtc":[100]}')).toStrictEqual({ dtc: [100] });
  });

  it("lists each repeated name once, at most MAX_LISTED_ISSUES, and reports a syntax error before a duplicate", () => {
    const issues = readOrIssues(bytesOf(`{${Array.from({ length: 30 }, (_, i) => `"n${i}":1,"n${i}":2,"n${i}":3`).join(",")}}`)).issues;
    expect(issues?.issues.map((issue) => issue.field)).toStrictEqual(Array.from({ length: 20 }, (_, i) => `n${i}`));
    // Not valid JSON: declined, so that the standard parser words the syntax error.
    expect(readOrIssues(bytesOf('{"dtc":[95],"dtc":[100]')).read).toBeUndefined();
    expect(readOrIssues(bytesOf('{"dtc":[95],"dtc":[100]')).issues).toBeUndefined();
  });

  it("reports objects with a name given twice always, and objects without never (generated objects, RFC 8259, section 4)", () => {
    const leaf = fc
      .oneof(fc.double({ noNaN: true, noDefaultInfinity: true }), fc.string(), fc.boolean(), fc.constant(null), fc.array(fc.option(fc.double({ noNaN: true, noDefaultInfinity: true }))))
      .map((value) => ({ text: JSON.stringify(value), duplicated: false }));
    // Spellings of a few names, escaped ones among them: "\u0061" is the name a (RFC 8259, section 7).
    const spellings: [string, string][] = [['"a"', "a"], ['"\\u0061"', "a"], ['"b"', "b"], ['"dtc"', "dtc"], ['"d\\u0074c"', "dtc"], ['"é"', "é"], ['"\\u00e9"', "é"], ['"units"', "units"]];
    const gap = fc.constantFrom("", " ", "\n  ");
    type Built = { text: string; duplicated: boolean };
    const { object } = fc.letrec<{ node: Built; array: Built; object: Built }>((tie) => ({
      node: fc.oneof({ depthSize: "small", withCrossShrink: true }, leaf, tie("array"), tie("object")),
      array: fc.array(tie("node"), { maxLength: 4 }).map((items) => ({ text: `[${items.map((item) => item.text).join(",")}]`, duplicated: items.some((item) => item.duplicated) })),
      object: fc.array(fc.tuple(fc.constantFrom(...spellings), tie("node"), gap), { maxLength: 5 }).map((members) => ({
        text: `{${members.map(([[spelling], value, space]) => `${space}${spelling}${space}:${space}${value.text}`).join(",")}}`,
        duplicated: new Set(members.map(([[, name]]) => name)).size < members.length || members.some(([, value]) => value.duplicated),
      })),
    }));
    fc.assert(
      fc.property(object, ({ text, duplicated }) => {
        const { read, issues } = readOrIssues(bytesOf(text));
        expect(issues !== undefined, text).toBe(duplicated);
        expect(duplicateNameIssues(text), text).toStrictEqual(issues?.issues ?? []);
        if (!duplicated) expect(read).toStrictEqual(expected(JSON.parse(text)));
      }),
      { numRuns: 3000 },
    );
  });

  it("finds a name given twice below nesting too deep for the reader, with the path shortened in the middle", () => {
    const depth = 50_000;
    const text = `{"x":${"[".repeat(depth)}{"a":1,"a":2}${"]".repeat(depth)}}`;
    expect(readOrIssues(bytesOf(text))).toStrictEqual({ read: undefined });
    expect(duplicateNameIssues(text)).toStrictEqual([{ field: `x${"[0]".repeat(7)}…(${depth + 2 - 16} levels)…${"[0]".repeat(7)}.a`, message: expect.any(String) }]);
  });

  it("declines keys __proto__ and constructor (escaped too), an empty body, a byte-order mark and deep nesting", () => {
    for (const text of ['{"__proto__":{"x":1}}', '{"a":{"constructor":{}}}', '{"\\u005f_proto__":1}', "", " ", "\ufeff{}"]) {
      expect(readJsonColumns(bytesOf(text), COLUMNS), text).toBeUndefined();
    }
    const deep = `${"[".repeat(200_000)}${"]".repeat(200_000)}`;
    expect(() => readJsonColumns(bytesOf(deep), COLUMNS)).not.toThrow();
  });
});
