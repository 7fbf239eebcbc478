import { describe, expect, it } from "vitest";
import { findHeaderItem, type LasDocument } from "../../../core/las/las-document.js";
import { parseLas } from "../../../core/las/las-reader.js";
import { lasFixture } from "../../fixtures/las/read-fixture.js";

const column = (document: LasDocument, mnemonic: string): number[] => {
  const at = document.table.curves.findIndex((curve) => curve.mnemonic === mnemonic);
  expect(at, `curve ${mnemonic}`).toBeGreaterThanOrEqual(0);
  return Array.from(document.table.columns[at]);
};

describe("parseLas on an unwrapped LAS 2.0 file", () => {
  const document = parseLas(lasFixture("unwrapped-metric.las"));

  it("keeps every section in file order with its title line (CWLS LAS 2.0, Appendix 1 Part 2)", () => {
    expect(document.sections.map(({ kind, title, line }) => ({ kind, title, line }))).toEqual([
      { kind: "version", title: "~VERSION INFORMATION", line: 4 },
      { kind: "well", title: "~WELL INFORMATION", line: 7 },
      { kind: "curve", title: "~Curve Information Block", line: 21 },
      { kind: "parameter", title: "~Parameter Information", line: 27 },
      { kind: "other", title: "~Other", line: 31 },
      { kind: "data", title: "~A  DEPT     DT      RHOB    CALI   FLAG", line: 34 },
    ]);
  });

  it("reads VERS and WRAP from ~Version (CWLS LAS 2.0, Appendix 1 Part 4, ~V)", () => {
    expect(document.version).toBe("2.0");
    expect(document.wrapped).toBe(false);
  });

  it("reads the required ~Well items, numbers as numbers (CWLS LAS 2.0, Appendix 1 Part 4, ~W)", () => {
    expect(document.well).toEqual({
      startIndex: 1500,
      stopIndex: 1500.75,
      step: 0.25,
      indexUnit: "M",
      nullValue: -999.25,
      wellName: "MARROWGATE 1",
      company: "HOLLOWAY BASIN EXPLORATION",
      field: "MARROWGATE",
      location: "LOT 7 CONCESSION 3",
      serviceCompany: "TALLOWAY LOGGING",
      date: "13:45:00 12/01/2026",
      uniqueWellId: "FX-0001-MG",
    });
  });

  it("keeps ~Parameter items, a line without a description colon included, and ~Other as raw lines (CWLS LAS 2.0, Appendix 1 Part 4, ~P and ~O)", () => {
    expect(findHeaderItem(document, "parameter", "BS")).toMatchObject({ unit: "MM", value: "215.9000", description: "BIT SIZE", line: 28 });
    expect(findHeaderItem(document, "parameter", "run")).toMatchObject({ value: "1", description: "", line: 30 });
    const other = document.sections.find((section) => section.kind === "other");
    expect(other !== undefined && "lines" in other ? other.lines : undefined).toEqual([
      { text: "   Sampled every quarter metre over a short test interval.", line: 32 },
      { text: "   Second remark line: values with colons are fine.", line: 33 },
    ]);
  });

  it("describes the curves of ~Curve in order, units as written, a unit with a dot and an absent one included (CWLS LAS 2.0, Appendix 1 Part 4, ~C)", () => {
    expect(document.table.curves).toEqual([
      { mnemonic: "DEPT", unit: "M", description: "1  DEPTH" },
      { mnemonic: "DT", unit: "US/F", description: "2  SONIC TRANSIT TIME" },
      { mnemonic: "RHOB", unit: "G/C3", description: "3  BULK DENSITY" },
      { mnemonic: "CALI", unit: "0.1IN", description: "4  CALIPER IN TENTHS OF AN INCH" },
      { mnemonic: "FLAG", unit: "", description: "5  A CURVE WITHOUT A UNIT" },
    ]);
    expect(findHeaderItem(document, "curve", "DT")?.value).toBe("60 520 32 00");
  });

  it("reads .3665, -.5, 1.2E+03, 1.2e-3 and +2, separated by blanks or tabs, and keeps the null value as written (common practice)", () => {
    expect(column(document, "DEPT")).toEqual([1500, 1500.25, 1500.5, 1500.75]);
    expect(column(document, "DT")).toEqual([0.3665, -0.5, 1200, 88.125]);
    expect(column(document, "RHOB")).toEqual([2.35, 2.401, -999.25, 2.45]);
    expect(column(document, "FLAG")).toEqual([0, 1, 0.0012, 2]);
    expect(document.table.nullValue).toBe(-999.25);
  });

  it("has no warning for a file that keeps to the standard", () => {
    expect(document.warnings).toEqual([]);
  });

  it("gives Float64Array columns trimmed to the number of samples", () => {
    for (const values of document.table.columns) {
      expect(values).toBeInstanceOf(Float64Array);
      expect(values.length).toBe(4);
    }
  });
});

describe("parseLas on other files real wells produce", () => {
  it("reads wrapped data: the index alone on its line, values running over several lines, a comment line above ~A and a blank line in it skipped (CWLS LAS 2.0, Appendix 1 Part 4, ~V WRAP and ~A)", () => {
    const document = parseLas(lasFixture("wrapped.las"));
    expect(document.wrapped).toBe(true);
    expect(document.table.columns.map((values) => Array.from(values))).toEqual([
      [920, 919.75, 919.5],
      [92.5, 93, -999.25],
      [171.25, 172, -999.25],
      [2.481, 2.479, 2.47],
      [98.1, 97.25, 96],
      [0.271, 0.269, 0.265],
      [3.1, 3.05, 3.02],
    ]);
    expect(document.warnings).toEqual([]);
  });

  it("recovers LAS 1.2 ~Well values written after the colon, with a warning (CWLS LAS 1.2, 1990, ~W layout; from memory)", () => {
    const document = parseLas(lasFixture("las12-swapped.las"));
    expect(document.version).toBe("1.2");
    expect(document.well).toMatchObject({
      startIndex: 4000,
      stopIndex: 4001,
      step: 0.5,
      nullValue: -999.25,
      wellName: "NORTH RIDGE 7",
      company: "FENWICK RIVER OIL",
      field: "NORTH RIDGE",
      location: "SECTION 9",
      serviceCompany: "ASHGROVE WIRELINE",
      date: "03-MAR-91",
      uniqueWellId: "NR-7",
    });
    expect(findHeaderItem(document, "well", "WELL")).toMatchObject({ value: "NORTH RIDGE 7", description: "WELL", line: 10 });
    expect(document.warnings).toEqual([
      {
        line: 9,
        message: "LAS 1.2 value/description swap detected in ~Well (COMP, WELL, FLD, LOC, SRVC, DATE, UWI): values taken from after the colon",
      },
    ]);
  });

  it("leaves ~Well alone in a LAS 2.0 file even where a value looks like a label", () => {
    const text = lasFixture("las12-swapped.las").replace("1.2:   CWLS LOG ASCII STANDARD - VERSION 1.2", "2.0 : CWLS");
    const document = parseLas(text);
    expect(document.well.wellName).toBe("WELL");
    expect(document.warnings).toEqual([]);
  });

  it("reads decreasing depth with a negative STEP, sections in any order after ~V and titles in any case, NULL -9999 (CWLS LAS 2.0, Appendix 1 Parts 2 and 4)", () => {
    const document = parseLas(lasFixture("decreasing-depth.las"));
    expect(document.sections.map((section) => section.kind)).toEqual(["version", "parameter", "curve", "well", "data"]);
    expect(document.well).toMatchObject({ startIndex: 2001, stopIndex: 2000, step: -0.5, nullValue: -9999 });
    expect(document.table.nullValue).toBe(-9999);
    expect(Array.from(document.table.columns[1])).toEqual([300.5, -9999, 310.25]);
    expect(document.warnings).toEqual([]);
  });

  it("accepts a variable index when STEP is 0 (CWLS LAS 2.0, Appendix 1 Part 4, ~W STEP)", () => {
    const document = parseLas(lasFixture("irregular-step.las"));
    expect(document.well.step).toBe(0);
    expect(Array.from(document.table.columns[0])).toEqual([100, 100.3, 101.1, 101.7]);
    expect(document.warnings).toEqual([]);
  });

  it("warns, and keeps every sample, when the index does not follow STEP or STOP (CWLS LAS 2.0 update: depth divided by step is a whole number)", () => {
    const document = parseLas(lasFixture("step-mismatch.las"));
    expect(document.table.columns[0].length).toBe(6);
    expect(document.warnings).toEqual([
      { line: 16, message: "STEP says 0.1524 but the index changes by 0.5 (from 1000.3048 to 1000.8048) (and 1 more place)" },
      { line: 18, message: "STOP says 1001.2 (line 6) but the last sample's index is 1001.4572" },
    ]);
  });

  it("warns when an irregular index turns back (ours)", () => {
    const text = lasFixture("irregular-step.las").replace("101.1 55", "100.2 55");
    expect(parseLas(text).warnings).toEqual([
      { line: 15, message: "the index does not keep to one direction: it goes from 100.3 to 100.2" },
    ]);
  });

  it("warns when STRT is not the first index or STEP has the wrong sign (CWLS LAS 2.0, Appendix 1 Part 4, ~W STEP)", () => {
    const text = lasFixture("decreasing-depth.las").replace("STRT.M 2001.0", "STRT.M 2002.0").replace("STEP.M -0.5", "STEP.M 0.5");
    expect(parseLas(text).warnings).toEqual([
      { line: 13, message: "STEP 0.5 goes the wrong way from STRT 2002 to STOP 2000" },
      { line: 17, message: "STRT says 2002 (line 11) but the first sample's index is 2001" },
      { line: 18, message: "STEP says 0.5 but the index changes by -0.5 (from 2001 to 2000.5) (and 1 more place)" },
    ]);
  });

  it("keeps repeated mnemonics as separate columns named DT, DT:2, DT:3 and warns (ours, as core/well-table.ts names them)", () => {
    const document = parseLas(lasFixture("duplicate-mnemonics.las"));
    expect(document.table.curves.map((curve) => curve.mnemonic)).toEqual(["DEPT", "DT", "DT:2", "DT:3"]);
    expect(Array.from(document.table.columns[3])).toEqual([92, 95]);
    expect(document.warnings).toEqual([
      { line: 12, message: "curve DT is described again (first at line 11); this column is named DT:2" },
      { line: 13, message: "curve DT is described again (first at line 11); this column is named DT:3" },
    ]);
  });

  it("reads a file that says WRAP NO but wraps every sample the same way, with a warning (common practice)", () => {
    const document = parseLas(lasFixture("wrap-no-but-wrapped.las"));
    expect(document.wrapped).toBe(true);
    expect(document.table.columns.map((values) => Array.from(values))).toEqual([
      [50, 50.5],
      [80, 81],
      [140, 141],
      [2.3, 2.31],
    ]);
    expect(document.warnings).toEqual([
      { line: 15, message: "the file says WRAP NO but its first data line holds 1 of 4 values; read as wrapped data" },
    ]);
  });

  it("reads on through U+FFFD left by invalid UTF-8 in the header, with a warning (ours)", () => {
    const document = parseLas(lasFixture("replacement-character.las"));
    expect(document.well.wellName).toBe("K\uFFFDNIGSMOOR 4");
    expect(document.warnings).toEqual([
      { line: 9, message: "the header has bytes that are not valid UTF-8 (shown as \uFFFD); read as they are" },
    ]);
  });

  it("reads CRLF and lone CR line ends and a UTF-8 byte-order mark like LF (common practice)", () => {
    const text = lasFixture("unwrapped-metric.las");
    const expected = parseLas(text);
    expect(parseLas(text.replaceAll("\n", "\r\n"))).toEqual(expected);
    expect(parseLas(text.replaceAll("\n", "\r"))).toEqual(expected);
    expect(parseLas(`\uFEFF${text}`)).toEqual(expected);
  });

  it("warns about missing VERS, WRAP and ~Well items and ignores a header line that is not an item (ours)", () => {
    const text = "~V\nNOTE SOMETHING\n~C\nDEPT.M : DEPTH\n~A\n1\n2\n";
    const document = parseLas(text);
    expect(document.version).toBe("2.0");
    expect(document.table.nullValue).toBeUndefined();
    expect(document.warnings).toEqual([
      { line: 1, message: "~Version has no VERS item; read as LAS 2.0" },
      { line: 1, message: "~Version has no WRAP item; read as WRAP NO" },
      { line: 1, message: "the file has no ~Well section" },
      { line: 2, message: "\"NOTE SOMETHING\" is not a MNEM.UNIT VALUE : DESCRIPTION line; ignored" },
    ]);
  });

  it("warns about an unreadable NULL, an odd WRAP and an unknown VERS (ours)", () => {
    const text = "~V\nVERS. 2.5 : ?\nWRAP. MAYBE : ?\n~W\nSTRT.M 1 : S\nSTOP.M 1 : S\nSTEP.M 0 : S\nNULL. none : N\n~C\nDEPT.M : D\n~A\n1\n";
    const document = parseLas(text);
    expect(document.table.columns[0].length).toBe(1);
    expect(document.well.nullValue).toBeUndefined();
    expect(document.warnings).toEqual([
      { line: 3, message: "WRAP \"MAYBE\" is neither YES nor NO; read as NO" },
      { line: 8, message: "NULL \"none\" is not a number; ignored" },
    ]);
    expect(parseLas(text.replace("VERS. 2.5", "VERS. 4.0")).warnings[0]).toEqual({
      line: 2,
      message: "VERS \"4.0\" is not a LAS version this reader knows; read as LAS 2.0",
    });
  });
});
