/**
 * The byte writers must give exactly the text of their ECMAScript counterparts (ECMA-262: Number::toString for
 * `writeShortest`, Number.prototype.toPrecision for `writeSignificant`, Number.prototype.toFixed for `writeFixed`),
 * checked on random doubles and on the decimals logs hold.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { AsciiText, fullDoublesOf, SHORTEST, writeColumnValue, writeFixed, writeShortest, writeSignificant } from "../../core/ascii-numbers.js";

const written = (write: (text: AsciiText) => void): string => {
  const text = new AsciiText(4);
  write(text);
  return Buffer.from(text.take()).toString("latin1");
};

/** Decimals as a log holds them: up to 15 significant digits, a few decimals, either sign. */
const logDecimal = fc
  .tuple(fc.integer({ min: -1e9, max: 1e9 }), fc.integer({ min: 0, max: 8 }))
  .map(([mantissa, decimals]) => mantissa / 10 ** decimals);
const anyDouble = fc.double({ noNaN: true, noDefaultInfinity: true });
const moduli = fc.double({ min: 1e-7, max: 1e12, noNaN: true }).chain((v) => fc.constantFrom(v, -v));

describe("writeShortest (ECMA-262 Number::toString)", () => {
  it("equals String(value) for decimals of a log, moduli and any double", () => {
    for (const values of [logDecimal, moduli, anyDouble]) {
      fc.assert(fc.property(values, (value) => {
        expect(written((text) => writeShortest(text, value))).toBe(String(value));
      }), { numRuns: 3000 });
    }
  });

  it("edge values: zero, negative zero, 1e-6 and 1e-7 (where the exponent form begins), 1e15, 0.1 + 0.2", () => {
    for (const value of [0, -0, 1e-6, 1e-7, 1e15, 1e15 - 1, 0.1 + 0.2, 2150.1524, -999.25, 5e-324, Number.MAX_VALUE]) {
      expect(written((text) => writeShortest(text, value))).toBe(String(value));
    }
  });

  it("digits on either side of 2^31, where the integer digit writer hands over to String", () => {
    for (const value of [2147483647, 2147483648, -2147483648, 214748.3647, 214748.3648, 21474836.49, 123456789012345, -0.00123456789012345, 999999999.9]) {
      expect(written((text) => writeShortest(text, value))).toBe(String(value));
      expect(written((text) => writeSignificant(text, value, 15))).toBe(String(Number(value.toPrecision(15))));
    }
  });
});

describe("writeColumnValue in the shortest form (ECMA-262 Number::toString), whichever writer fullDoublesOf picks", () => {
  it("gives every finite value the text String(value), for columns of log decimals, of full doubles and of both", () => {
    const value = fc.oneof(anyDouble, logDecimal, fc.constantFrom(-0, 0, 5e-324));
    fc.assert(
      fc.property(fc.array(value, { maxLength: 40 }), (values) => {
        const column = Float64Array.from(values);
        const [judged] = fullDoublesOf([column], [SHORTEST]);
        for (const fullDouble of [judged, true, false]) {
          for (const v of values) expect(written((text) => writeColumnValue(text, v, SHORTEST, fullDouble))).toBe(String(v));
        }
      }),
      { numRuns: 3000 },
    );
  });

  it("judges a column of computed values as full doubles and a column of a log's decimals as not", () => {
    expect(fullDoublesOf([Float64Array.from([14.704529396610424, 0.322399427257403]), Float64Array.from([2150.1524, 104.24, 2.481])], [SHORTEST, SHORTEST])).toEqual([true, false]);
    expect(fullDoublesOf([Float64Array.from([14.704529396610424])], [{ kind: "significant", digits: 8 }])).toEqual([false]);
  });
});

describe("writeSignificant (ECMA-262 Number.prototype.toPrecision, trailing zeros dropped)", () => {
  it("equals String(Number(value.toPrecision(digits))) for digits 1 to 15", () => {
    fc.assert(
      fc.property(fc.oneof(moduli, anyDouble, logDecimal), fc.integer({ min: 1, max: 15 }), (value, digits) => {
        expect(written((text) => writeSignificant(text, value, digits))).toBe(String(Number(value.toPrecision(digits))));
      }),
      { numRuns: 20000 },
    );
  });

  it("ties round half up as toPrecision does, and 9.99… rounds up to the next power of ten", () => {
    for (const [value, digits] of [[0.125, 2], [2.5, 1], [99.99999999, 8], [9.999999999, 8], [999999.95, 7], [1e-6, 3], [23456789012.3, 8], [0.30000000000000004, 15]] as const) {
      expect(written((text) => writeSignificant(text, value, digits))).toBe(String(Number(value.toPrecision(digits))));
    }
  });
  it("values at and next to every power of ten from 1e-6 to 1e15, where the first digit's place changes", () => {
    const below = (x: number) => x - Math.abs(x) * Number.EPSILON;
    const above = (x: number) => x + Math.abs(x) * Number.EPSILON;
    for (let k = -6; k <= 15; k++) {
      const power = Number(`1e${k}`);
      for (const value of [below(below(power)), below(power), power, above(power), above(above(power)), -power, 9.999999999999999 * power]) {
        for (let digits = 1; digits <= 15; digits++) {
          expect(written((text) => writeSignificant(text, value, digits)), `${value} to ${digits} digits`).toBe(String(Number(value.toPrecision(digits))));
        }
      }
    }
  });
});

describe("writeFixed (ECMA-262 Number.prototype.toFixed)", () => {
  it("equals value.toFixed(decimals)", () => {
    fc.assert(
      fc.property(fc.oneof(fc.integer({ min: 0, max: 2 ** 31 }), logDecimal), fc.integer({ min: 0, max: 6 }), (value, decimals) => {
        expect(written((text) => writeFixed(text, value, decimals))).toBe(value.toFixed(decimals));
      }),
    );
  });
});

describe("AsciiText", () => {
  it("grows past its first capacity and right-aligns a field with padFrom", () => {
    const text = new AsciiText(2);
    text.ascii("~A");
    const from = text.length;
    writeShortest(text, 12.5);
    text.padFrom(from, 6 - (text.length - from));
    expect(Buffer.from(text.take()).toString("latin1")).toBe("~A  12.5");
    expect(text.length).toBe(0);
  });
});
