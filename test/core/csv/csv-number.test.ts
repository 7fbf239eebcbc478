import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { readCsvNumber } from "../../../core/csv/csv-number.js";

describe("readCsvNumber", () => {
  it("reads back String(x) for every double x (ECMA-262 Number::toString round trip)", () => {
    fc.assert(
      fc.property(fc.double({ noNaN: true }), (x) => {
        expect(readCsvNumber(String(x))).toBe(Object.is(x, -0) ? 0 : x);
      }),
    );
  });

  it("reads the decimal forms .5, 5., +5, -5e-1 and 1.2E+03", () => {
    expect([".5", "5.", "+5", "-5e-1", "1.2E+03"].map(readCsvNumber)).toEqual([0.5, 5, 5, -0.5, 1200]);
  });

  it("reads the missing-value spellings as NaN, whatever their case and surrounding spaces", () => {
    for (const cell of ["", "  ", "NA", "na", "NaN", "nan", "NULL", "null", " - "]) expect(readCsvNumber(cell)).toBeNaN();
  });

  it("refuses text outside the decimal grammar, which Number() would accept or misread", () => {
    for (const cell of ["0x1F", "0b11", "1_000", "Infinity1", "infinity", "1e", ".", "+", "1,5", "N/A"]) {
      expect(readCsvNumber(cell)).toBeUndefined();
    }
  });
});
