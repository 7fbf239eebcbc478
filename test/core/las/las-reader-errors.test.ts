import { describe, expect, it } from "vitest";
import { parseLas } from "../../../core/las/las-reader.js";
import { WellFileError } from "../../../core/well-file-error.js";

const HEADER = [
  "~Version",
  "VERS. 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0",
  "WRAP. NO : ONE LINE PER DEPTH STEP",
  "~Well",
  "STRT.M 10.0 : START DEPTH",
  "STOP.M 10.5 : STOP DEPTH",
  "STEP.M 0.5 : STEP",
  "NULL. -999.25 : NULL VALUE",
  "~Curve",
  "DEPT.M : DEPTH",
  "DTC.US/F : COMPRESSIONAL SLOWNESS",
  "RHOB.G/C3 : BULK DENSITY",
];
/** Our small file: header on lines 1–12, `~A` on line 13, samples from line 14. */
const lasWith = (...dataLines: string[]): string => [...HEADER, "~A", ...dataLines].join("\n");

const failureOf = (text: string): { code: string; line: number | undefined; message: string } => {
  try {
    parseLas(text);
  } catch (error) {
    expect(error).toBeInstanceOf(WellFileError);
    const { code, line, message } = error as WellFileError;
    return { code, line, message };
  }
  throw new Error("the file was read without an error");
};

describe("parseLas errors", () => {
  it("refuses a file that does not start with ~Version, naming the first line that is not a comment (CWLS LAS 2.0, Appendix 1 Part 2; ours: ~V first)", () => {
    expect(failureOf("# comment\n\n~Well\nSTRT.M 1 : S\n")).toMatchObject({ code: "las_missing_version_section", line: 3 });
    expect(failureOf("# comment\nDEPT 1 2 3\n~Version\n")).toMatchObject({ code: "las_missing_version_section", line: 2 });
    expect(failureOf("# only a comment\n")).toMatchObject({ code: "las_missing_version_section", line: 1 });
    expect(failureOf("")).toMatchObject({ code: "las_missing_version_section", line: 1 });
  });

  it("refuses LAS 3.0 and says to convert to 2.0 (CWLS LAS 3.0, 2000, is a different layout)", () => {
    const failure = failureOf(lasWith("10.0 90 2.4").replace("VERS. 2.0", "VERS. 3.0"));
    expect(failure).toMatchObject({ code: "las_version_3_unsupported", line: 2 });
    expect(failure.message).toContain("LAS 3.0 is not supported; convert the file to LAS 2.0");
  });

  it("refuses a header with no ~A section, naming the last line (CWLS LAS 2.0, Appendix 1 Part 2: ~A is always there, last)", () => {
    expect(failureOf(HEADER.join("\n") + "\n")).toMatchObject({ code: "las_no_data_section", line: 12 });
  });

  it("refuses ~A when no ~Curve describes a curve (CWLS LAS 2.0, Appendix 1 Part 4, ~C is mandatory)", () => {
    const noCurves = [...HEADER.slice(0, 9), "~A", "10.0 90 2.4"].join("\n");
    expect(failureOf(noCurves)).toMatchObject({ code: "las_no_curves", line: 10 });
    const noCurveSection = [...HEADER.slice(0, 8), "~A", "10.0"].join("\n");
    expect(failureOf(noCurveSection)).toMatchObject({ code: "las_no_curves", line: 9 });
  });

  it("refuses a ~Curve line that is not MNEM.UNIT VALUE : DESCRIPTION, since the columns would not match (CWLS LAS 2.0, Appendix 1 Part 3)", () => {
    const text = lasWith("10.0 90 2.4").replace("RHOB.G/C3 : BULK DENSITY", "RHOB G/C3 BULK DENSITY");
    expect(failureOf(text)).toMatchObject({ code: "las_bad_curve_line", line: 12 });
  });

  it("refuses a data line with more values than curves (CWLS LAS 2.0, Appendix 1 Part 4, ~C: curves in the order of the data)", () => {
    expect(failureOf(lasWith("10.0 90 2.4", "10.5 91 2.5 7"))).toMatchObject({ code: "las_too_many_values", line: 15 });
    expect(failureOf(lasWith("10.0 90 2.4 7"))).toMatchObject({ code: "las_too_many_values", line: 14 });
    const longLine = Array.from({ length: 40 }, (_, i) => String(i)).join(" ");
    expect(failureOf(lasWith(longLine))).toMatchObject({ code: "las_too_many_values", line: 14 });
  });

  it("refuses an unwrapped data line with fewer values than curves (CWLS LAS 2.0, Appendix 1 Part 4, ~V WRAP NO: one line per depth step)", () => {
    const failure = failureOf(lasWith("10.0 90 2.4", "", "10.5 91"));
    expect(failure).toMatchObject({ code: "las_too_few_values", line: 16 });
    expect(failure.message).toBe("line 16: 2 values on a data line but ~Curve describes 3 curves (the file says WRAP NO)");
  });

  it("refuses wrapped values that run past the end of a sample onto the next index's line (CWLS LAS 2.0, Appendix 1 Part 4, ~A: in wrap mode depth is on its own line)", () => {
    const text = lasWith("10.0", "90 2.4 10.5", "91 2.5").replace("WRAP. NO", "WRAP. YES");
    expect(failureOf(text)).toMatchObject({ code: "las_too_many_values", line: 15 });
  });

  it("refuses a last wrapped sample that is incomplete, naming the line where it begins (CWLS LAS 2.0, Appendix 1 Part 4, ~A)", () => {
    const text = lasWith("10.0", "90 2.4", "10.5", "91").replace("WRAP. NO", "WRAP. YES");
    const failure = failureOf(text);
    expect(failure).toMatchObject({ code: "las_incomplete_sample", line: 16 });
    expect(failure.message).toBe("line 16: the last sample, begun at line 16, has 2 of 3 values");
  });

  it("refuses a token in ~A that is not a number, U+FFFD from a bad byte included (CWLS LAS 2.0, Appendix 1 Part 4, ~A)", () => {
    expect(failureOf(lasWith("10.0 90 2.4", "10.5 9l 2.5"))).toMatchObject({ code: "las_invalid_number", line: 15 });
    expect(failureOf(lasWith("10.0 90 2.4", "10.5 91 2.\uFFFD"))).toMatchObject({ code: "las_invalid_number", line: 15 });
    expect(failureOf(lasWith("10.0,90,2.4"))).toMatchObject({ code: "las_invalid_number", line: 14 });
  });

  it("refuses a section after ~A (CWLS LAS 2.0, Appendix 1 Part 2: the last section must always be the log data)", () => {
    expect(failureOf(lasWith("10.0 90 2.4", "~Other", "note"))).toMatchObject({ code: "las_section_after_data", line: 15 });
  });

  it("refuses a # comment line inside ~A, naming it and saying to delete it or move it above ~A (CWLS LAS 2.0: comment lines only above ~A; from memory)", () => {
    // Four samples, the second commented out: read as three before, a sample dropped without a word.
    const failure = failureOf(lasWith("10.0 90 2.4", "# 10.5 91 2.5", "11.0 92 2.6", "11.5 93 2.7"));
    expect(failure).toMatchObject({ code: "las_comment_in_data", line: 15 });
    expect(failure.message).toMatch(/^line 15: a # comment line inside ~A.*delete the line.*move the comment above ~A$/);
    expect(failureOf(lasWith("  # indented, before any sample", "10.0 90 2.4"))).toMatchObject({ code: "las_comment_in_data", line: 14 });
    expect(failureOf(lasWith("10.0 90 2.4", "#").replaceAll("\n", "\r\n"))).toMatchObject({ code: "las_comment_in_data", line: 15 });
    // Above ~A a comment is fine (CWLS LAS 2.0; from memory).
    expect(parseLas(lasWith("10.0 90 2.4").replace("~A", "# a remark\n~A")).table.columns[0]).toEqual(new Float64Array([10]));
  });

  it("refuses an ~A section with no data rows, naming the ~A line, as a CSV header with no rows is refused (README: a header-only file is a 422)", () => {
    for (const text of [lasWith(), lasWith(""), lasWith("", "   ", "\t")]) {
      const failure = failureOf(text);
      expect(failure).toMatchObject({ code: "las_no_rows", line: 13 });
      expect(failure.message).toBe("line 13: the ~A section holds no data rows (a header with no samples): add the samples after ~A");
    }
    const wrapped = failureOf(lasWith().replace("WRAP. NO", "WRAP. YES"));
    expect(wrapped).toMatchObject({ code: "las_no_rows", line: 13 });
  });

  it("names the line also when the text arrives with CRLF line ends", () => {
    const text = lasWith("10.0 90 2.4", "10.5 91 2.5 7").replaceAll("\n", "\r\n");
    expect(failureOf(text)).toMatchObject({ code: "las_too_many_values", line: 15 });
  });
});
