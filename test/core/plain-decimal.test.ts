/**
 * plainDecimal must give exactly what ECMA-262 StringToNumber (`Number(text)`) gives for a plain decimal, or NaN
 * to hand the token to the slow reader: checked on random digit strings and on the decimals logs hold.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { plainDecimal } from "../../core/plain-decimal.js";

const PLAIN = /^[+-]?(?:\d+\.?\d*|\.\d+)$/;

/** Sign, digits, at most one point: what a log's data lines hold, and strings close to it. */
const token = fc
  .tuple(
    fc.constantFrom("", "-", "+"),
    fc.string({ unit: fc.constantFrom("0", "1", "2", "5", "7", "9"), maxLength: 24 }),
    fc.constantFrom("", "."),
    fc.string({ unit: fc.constantFrom("0", "3", "4", "6", "8", "9"), maxLength: 24 }),
  )
  .map(([sign, whole, point, fraction]) => `${sign}${whole}${point}${fraction}`);
const noise = fc.string({ unit: fc.constantFrom("0", "1", ".", "-", "+", "e", "E", " ", "x", "9"), maxLength: 12 });

describe("plainDecimal (Clinger's fast path: exact integer over exact power of ten)", () => {
  it("is Number(text), bit for bit, or NaN (hand over); never NaN for a plain decimal of at most 15 digits", () => {
    fc.assert(
      fc.property(fc.oneof(token, noise), (text) => {
        const value = plainDecimal(text);
        if (value === value) {
          expect(PLAIN.test(text), text).toBe(true);
          expect(Object.is(value, Number(text)), `${text}: ${value} against ${Number(text)}`).toBe(true);
        } else if (PLAIN.test(text) && text.replace(/[^0-9]/g, "").replace(/^0+/, "").length <= 15 && text.length < 20) {
          expect.unreachable(`${text} is plain and short but was handed over`);
        }
      }),
      { numRuns: 20000 },
    );
  });

  it("reads the text String() gives of decimals a log holds, and its negative zero", () => {
    fc.assert(
      fc.property(fc.integer({ min: -1e12, max: 1e12 }), fc.integer({ min: 0, max: 9 }), (mantissa, decimals) => {
        const text = (mantissa / 10 ** decimals).toFixed(decimals);
        expect(Object.is(plainDecimal(text), Number(text))).toBe(true);
      }),
    );
    expect(Object.is(plainDecimal("-0.0"), -0)).toBe(true);
    expect(plainDecimal(".3665")).toBe(0.3665);
    expect(plainDecimal("7.")).toBe(7);
  });

  it("reads a token where it stands in a line, from start to end", () => {
    const line = " 2150.1524  -104.24 .5 1.2E+03";
    expect(plainDecimal(line, 1, 10)).toBe(2150.1524);
    expect(plainDecimal(line, 12, 19)).toBe(-104.24);
    expect(plainDecimal(line, 20, 22)).toBe(0.5);
    expect(plainDecimal(line, 23, 30)).toBeNaN();
    expect(plainDecimal(line, 0, 10)).toBeNaN();
  });

  it("hands over what it does not read: exponents, blanks, empty text, a lone sign or point, two points, too many digits", () => {
    for (const text of ["1.2E+03", " 12", "", "-", ".", "1.2.3", "123456789012345678", "0x1F", "Infinity"]) {
      expect(plainDecimal(text), text).toBeNaN();
    }
  });
});
