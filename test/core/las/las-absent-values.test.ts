/**
 * Absent values and short rows in ~A: an absent index is no depth to the index checks, `NaN` is an absent value,
 * and a short row of a WRAP NO file is told in its own terms. Data from our own fictional well, Marram Bank 7.
 */
import { describe, expect, it } from "vitest";
import { parseLas } from "../../../core/las/las-reader.js";
import { wellFileFailure } from "../../helpers/well-file-failure.js";
import { marramBankLas } from "../../helpers/marram-bank-las.js";

/** Header on lines 1–14, `~A` on line 15, samples from line 16. */
const lasWith = (...rows: string[]): string => marramBankLas({ start: "1510.0", stop: "1511.0", step: "0.5" }, ...rows);

const failureOf = (text: string) => wellFileFailure(parseLas, text);

describe("an absent index (the ~Well NULL) is no depth to the index checks (CWLS LAS 2.0, Appendix 1 Part 4, ~W NULL, STRT, STOP, STEP)", () => {
  it("a NULL depth between regular ones raises no STEP mismatch, and one warning says the index is absent", () => {
    const document = parseLas(lasWith("1510.0 95 170 2.45", "-999.25 96 172 2.44", "1511.0 97 174 2.43"));
    expect(document.table.columns[0]).toEqual(new Float64Array([1510, -999.25, 1511]));
    expect(document.warnings).toEqual([{ line: 17, message: "the index (first curve) of this sample is absent (the null value or NaN)" }]);
  });

  it("a NULL first or last depth is not compared with STRT or STOP: the first and last depths given are", () => {
    const document = parseLas(lasWith("-999.25 94 168 2.46", "1510.0 95 170 2.45", "1510.5 96 172 2.44", "1511.0 97 174 2.43", "-999.25 98 176 2.42"));
    expect(document.warnings.map((warning) => warning.message)).toEqual([
      "the index (first curve) of this sample is absent (the null value or NaN) (and 1 more place)",
    ]);
  });

  it("the file's own NULL is the one passed over; a request's null value can override it", () => {
    const text = lasWith("1510.0 95 170 2.45", "-9999 96 172 2.44", "1511.0 97 174 2.43").replace("NULL. -999.25", "NULL. -9999");
    expect(parseLas(text).warnings.map((warning) => warning.message)).toEqual(["the index (first curve) of this sample is absent (the null value or NaN)"]);
    expect(parseLas(text, { nullValue: -1 }).warnings.map((warning) => warning.message)[0]).toMatch(/^STEP says 0.5 but the index changes by -11509 \(from 1510 to -9999\)/);
  });

  it("a file without NULL passes over -999.25, the usual LAS null (common practice), with the warning that NULL is missing", () => {
    const text = lasWith("1510.0 95 170 2.45", "-999.25 96 172 2.44", "1511.0 97 174 2.43").replace("NULL. -999.25 : NULL VALUE\n", "");
    expect(parseLas(text).warnings.map((warning) => warning.message)).toEqual([
      "~Well has no NULL item",
      "the index (first curve) of this sample is absent (the null value or NaN)",
    ]);
  });
});

describe("NaN in ~A is an absent value, with one warning per file (LAS 2.0 marks absent values with the ~Well NULL; from memory)", () => {
  it("reads NaN in any case, and -nan, as NaN, and warns once naming the first line and how many more", () => {
    const document = parseLas(lasWith("1510.0 NaN 170 2.45", "1510.5 96 nan 2.44", "1511.0 97 174 -NAN"));
    expect(document.table.columns[1]).toEqual(new Float64Array([NaN, 96, 97]));
    expect(document.table.columns[2]).toEqual(new Float64Array([170, NaN, 174]));
    expect(document.table.columns[3]).toEqual(new Float64Array([2.45, 2.44, NaN]));
    expect(document.warnings).toEqual([
      { line: 16, message: "NaN in ~A read as an absent value (and 2 more); LAS 2.0 marks an absent value with the ~Well NULL value instead" },
    ]);
  });

  it("a NaN index is an absent depth to the index checks too", () => {
    const document = parseLas(lasWith("1510.0 95 170 2.45", "NaN 96 172 2.44", "1511.0 97 174 2.43"));
    expect(document.warnings.map((warning) => warning.message)).toEqual([
      "NaN in ~A read as an absent value; LAS 2.0 marks an absent value with the ~Well NULL value instead",
      "the index (first curve) of this sample is absent (the null value or NaN)",
    ]);
  });

  it("other words stay unreadable numbers (las_invalid_number)", () => {
    for (const word of ["NaNa", "N/A", "Infinity", "null", "-"]) {
      const failure = failureOf(lasWith("1510.0 95 170 2.45", `1510.5 ${word} 172 2.44`));
      expect(failure).toMatchObject({ code: "las_invalid_number", line: 17 });
    }
  });
});

describe("a short row of a WRAP NO file is told in the file's own terms (CWLS LAS 2.0, Appendix 1 Part 4, ~V WRAP NO: one line per depth step)", () => {
  it("a short first row followed by whole rows names the first row and its count of values, not wrapped data", () => {
    const failure = failureOf(lasWith("1510.0 95 170", "1510.5 96 172 2.44", "1511.0 97 174 2.43"));
    expect(failure).toMatchObject({ code: "las_too_few_values", line: 16 });
    expect(failure.message).toBe("line 16: 3 values on a data line but ~Curve describes 4 curves (the file says WRAP NO)");
  });

  it("a file of one short row says the same", () => {
    const failure = failureOf(lasWith("1510.0 95 170"));
    expect(failure).toMatchObject({ code: "las_too_few_values", line: 16 });
    expect(failure.message).toBe("line 16: 3 values on a data line but ~Curve describes 4 curves (the file says WRAP NO)");
  });

  it("a file read as wrapped from its short first line, whose later row runs past a sample's end, says WRAP NO and why it was read as wrapped", () => {
    const failure = failureOf(lasWith("1510.0", "95 170 2.45", "1510.5 96 172", "2.44 1511.0 97 174 2.43"));
    expect(failure).toMatchObject({ code: "las_too_many_values", line: 19 });
    expect(failure.message).toBe(
      "line 19: 5 values on a data line but ~Curve describes 4 curves, running past the end of the sample begun at line 18; " +
        "the file says WRAP NO, but its first data line (line 16) held only 1 value, so it was read as wrapped",
    );
  });

  it("a WRAP YES file keeps the message of wrapped data", () => {
    const failure = failureOf(lasWith("1510.0", "95 170 2.45 1510.5", "96 172 2.44").replace("WRAP. NO", "WRAP. YES"));
    expect(failure).toMatchObject({ code: "las_too_many_values", line: 17 });
    expect(failure.message).toContain("in wrapped data each sample starts on a new line");
  });
});
