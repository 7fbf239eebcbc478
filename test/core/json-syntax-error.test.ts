// The reference is JSON.parse itself (ECMA-262, JSON.parse), whose grammar is that of RFC 8259 (sections 2 to 7):
// the scanner finds no error exactly when JSON.parse accepts the text, and where V8's message gives a position
// ("… in JSON at position N", Node 20) the scanner names the same one.
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { jsonSyntaxErrorAt } from "../../core/index.js";

/** JSON.parse's verdict: undefined when it accepts the text, else the position its message gives (null when none). */
const parseVerdict = (text: string): number | null | undefined => {
  try {
    JSON.parse(text);
    return undefined;
  } catch (error) {
    const position = /position (\d+)/.exec((error as Error).message)?.[1];
    return position === undefined ? null : Number(position);
  }
};

const agreesWithJsonParse = (text: string): void => {
  const verdict = parseVerdict(text);
  const found = jsonSyntaxErrorAt(text);
  if (verdict === undefined) expect(found, JSON.stringify(text)).toBeUndefined();
  else {
    expect(found, JSON.stringify(text)).toBeTypeOf("number");
    if (verdict !== null) expect(found, JSON.stringify(text)).toBe(verdict);
    expect(found).toBeGreaterThanOrEqual(0);
    expect(found).toBeLessThanOrEqual(text.length);
  }
};

/** Pieces of JSON, whole and broken, so that random joins are often nearly valid. */
const TOKENS = [
  "{", "}", "[", "]", ",", ":", " ", "\n", "\r", "\t", "\u000b", "\u00a0", '"', '"dtc"', '"a\\"b"', "\\", "\\u00e9", "\\uD800", "\\x", "\\u12",
  "\u0001", "0", "1", "-", "+", ".", "e", "E", "90", "-0.5", "1e+3", "01", "true", "tru", "false", "null", "nul", "NaN", "Infinity", "x", "'", "\uFEFF", "é",
];
const tokenSoup = fc.array(fc.constantFrom(...TOKENS), { maxLength: 24 }).map((parts) => parts.join(""));

/** One edit of a text: a character deleted, one inserted, or the text cut short. */
const edited = fc
  .tuple(fc.json({ maxDepth: 4 }), fc.nat(), fc.constantFrom(...TOKENS), fc.constantFrom("delete", "insert", "cut"))
  .map(([text, at, token, how]) => {
    const i = text.length === 0 ? 0 : at % (text.length + 1);
    if (how === "delete") return text.slice(0, i) + text.slice(i + 1);
    if (how === "insert") return text.slice(0, i) + token + text.slice(i);
    return text.slice(0, i);
  });

describe("jsonSyntaxErrorAt against JSON.parse (ECMA-262; RFC 8259 grammar)", () => {
  it("finds no error in any text JSON.parse accepts (fast-check's JSON texts, any depth up to 6, with white space around)", () => {
    fc.assert(
      fc.property(fc.json({ maxDepth: 6 }), fc.constantFrom("", " ", "\n", "\t\r\n "), (text, space) => {
        expect(jsonSyntaxErrorAt(space + text + space)).toBeUndefined();
      }),
      { numRuns: 2000 },
    );
  });

  it("finds an error exactly when JSON.parse refuses, at V8's position where it gives one: token soup", () => {
    fc.assert(fc.property(tokenSoup, agreesWithJsonParse), { numRuns: 5000 });
  });

  it("finds an error exactly when JSON.parse refuses, at V8's position where it gives one: valid texts with one edit", () => {
    fc.assert(fc.property(edited, agreesWithJsonParse), { numRuns: 5000 });
  });

  it("finds an error exactly when JSON.parse refuses: any short string, unpaired surrogates included", () => {
    fc.assert(
      fc.property(fc.oneof(fc.string({ maxLength: 12 }), fc.string({ unit: "binary", maxLength: 12 }), fc.string({ unit: fc.constantFrom(..."[]{},:\"0123456789-.eE \\"), maxLength: 16 })), agreesWithJsonParse),
      { numRuns: 5000 },
    );
  });
});

describe("jsonSyntaxErrorAt points at the first offending character (hand-made broken texts)", () => {
  it.each([
    // The text of the review: V8's message ("Unexpected token ']', …") gives no position; the ] after the comma is the error.
    ['{"dtc":[90,],"dts":[160],"rho":[2.4]}', 11],
    ['{"dtc":[90],"dts":[160,],"rho":[2.4]}', 23],
    ['{"dtc":[90],}', 12],
    ['{"dtc":[90] "dts":[160]}', 12],
    ['{"dtc" [90]}', 7],
    ["{'dtc':[90]}", 1],
    ['{"dtc":[NaN]}', 8],
    ['{"dtc":[-Infinity]}', 9],
    ['{"dtc":[tru]}', 11],
    ['{"dtc":[90.]}', 11],
    ['{"dtc":[1e]}', 10],
    ['{"dtc":[012]}', 9],
    ['{"dtc":[+1]}', 8],
    ['{"name":"a\\qb"}', 11],
    ['{"name":"\\u00g9"}', 13],
    ['{"name":"tab\there"}', 12],
    ['{"dtc":[90]}}', 12],
    ['{"dtc":[90]', 11],
    ['{"name":"open', 13],
    ["\uFEFF{}", 0],
    ["", 0],
    ["  \n ", 4],
  ] as const)("%j goes wrong at offset %i", (text, offset) => {
    expect(jsonSyntaxErrorAt(text)).toBe(offset);
    expect(() => JSON.parse(text)).toThrow();
  });

  it("reads a deep nesting without recursion and accepts what JSON.parse accepts", () => {
    const depth = 200_000;
    const text = "[".repeat(depth) + "]".repeat(depth);
    expect(jsonSyntaxErrorAt(text)).toBeUndefined();
    expect(jsonSyntaxErrorAt(text.slice(0, -1))).toBe(2 * depth - 1);
    expect(jsonSyntaxErrorAt(`${"[".repeat(depth)}1,]${"]".repeat(depth - 1)}`)).toBe(depth + 2);
  });
});
