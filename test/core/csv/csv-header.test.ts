import { describe, expect, it } from "vitest";
import { detectDelimiter } from "../../../core/csv/csv-delimiter.js";
import { curvesFromHeader, splitHeaderCell } from "../../../core/csv/csv-header.js";
import { uniqueMnemonics } from "../../../core/unique-mnemonics.js";

describe("splitHeaderCell", () => {
  it("takes only a bracket or parenthesis group at the very end as the unit", () => {
    expect(splitHeaderCell("RHOB (corrected) [g/cm3]")).toEqual({ mnemonic: "RHOB (corrected)", unit: "g/cm3" });
    expect(splitHeaderCell("DT(us/ft)")).toEqual({ mnemonic: "DT", unit: "us/ft" });
    expect(splitHeaderCell("A[1] B")).toEqual({ mnemonic: "A[1] B", unit: "" });
    expect(splitHeaderCell("  GR  ")).toEqual({ mnemonic: "GR", unit: "" });
    expect(splitHeaderCell("NPHI []")).toEqual({ mnemonic: "NPHI", unit: "" });
  });
});

describe("curvesFromHeader", () => {
  it("names unnamed cells COL<n> and gives every curve an empty description", () => {
    expect(curvesFromHeader(["", "[m]", "DTC"])).toEqual([
      { mnemonic: "COL1", unit: "", description: "" },
      { mnemonic: "COL2", unit: "m", description: "" },
      { mnemonic: "DTC", unit: "", description: "" },
    ]);
  });
});

describe("uniqueMnemonics", () => {
  it("suffixes :2, :3 … to later repeats, ignoring case", () => {
    expect(uniqueMnemonics(["DT", "RHOB", "DT", "Dt", "rhob"])).toEqual(["DT", "RHOB", "DT:2", "Dt:3", "rhob:2"]);
  });

  it("never makes a name that the file already uses", () => {
    expect(uniqueMnemonics(["DT", "DT", "DT:2"])).toEqual(["DT", "DT:3", "DT:2"]);
    expect(uniqueMnemonics(["DT:2", "DT", "DT"])).toEqual(["DT:2", "DT", "DT:3"]);
  });
});

describe("detectDelimiter", () => {
  it("takes the commonest of comma, semicolon and tab outside quotes", () => {
    expect(detectDelimiter("DEPT;DTC;RHOB")).toBe(";");
    expect(detectDelimiter("DEPT\tDTC\tRHOB")).toBe("\t");
    expect(detectDelimiter('"A;B;C",D,E')).toBe(",");
    expect(detectDelimiter("A;B,C;D")).toBe(";");
  });

  it("breaks ties comma first, then semicolon, and reads a one-column header with comma", () => {
    expect(detectDelimiter("A,B;C")).toBe(",");
    expect(detectDelimiter("A;B\tC")).toBe(";");
    expect(detectDelimiter("DEPT")).toBe(",");
  });
});
