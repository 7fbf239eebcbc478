import { describe, expect, it } from "vitest";
import { parseLasHeaderLine } from "../../../core/las/las-header-line.js";
import { parseLasNumber } from "../../../core/las/las-number.js";

describe("parseLasHeaderLine", () => {
  it("splits MNEM.UNIT VALUE : DESCRIPTION at the first dot, the first blank after it and the colon (CWLS LAS 2.0, Appendix 1 Part 3)", () => {
    expect(parseLasHeaderLine(" STRT.M      1500.0000 : START DEPTH", 4)).toEqual({
      mnemonic: "STRT",
      unit: "M",
      value: "1500.0000",
      description: "START DEPTH",
      line: 4,
    });
  });

  it("allows blanks before the mnemonic and between the mnemonic and the dot (CWLS LAS 2.0, Appendix 1 Part 3)", () => {
    expect(parseLasHeaderLine("   DEPT   .M   : DEPTH", 1)).toMatchObject({ mnemonic: "DEPT", unit: "M", value: "" });
  });

  it("reads a unit that holds a dot, since only the first dot ends the mnemonic (CWLS LAS 2.0 update, delimiters clarification)", () => {
    expect(parseLasHeaderLine("CALI .0.1IN   : CALIPER", 1)).toMatchObject({ mnemonic: "CALI", unit: "0.1IN", value: "" });
  });

  it("reads an absent unit when a blank follows the dot (CWLS LAS 2.0, Appendix 1 Part 3: units directly after the dot)", () => {
    expect(parseLasHeaderLine("NULL.   -999.25 : NULL VALUE", 1)).toMatchObject({ unit: "", value: "-999.25" });
    expect(parseLasHeaderLine("DEPT.  : DEPTH", 1)).toMatchObject({ unit: "", value: "", description: "DEPTH" });
  });

  it("keeps colons inside a value and takes the last colon as the delimiter (CWLS LAS 2.0 update, delimiters clarification)", () => {
    expect(parseLasHeaderLine("DATE. 13:45:00 12/01/2026 : LOG DATE", 1)).toMatchObject({
      unit: "",
      value: "13:45:00 12/01/2026",
      description: "LOG DATE",
    });
  });

  it("reads a line without a description colon as all value, even when the value is a time (ours: a colon between two digits is part of a time)", () => {
    expect(parseLasHeaderLine("RUN .  1", 1)).toMatchObject({ value: "1", description: "" });
    expect(parseLasHeaderLine("TIME. 13:45:00", 1)).toMatchObject({ value: "13:45:00", description: "" });
  });

  it("keeps a time in the description (ours: a colon between two digits is part of a time)", () => {
    expect(parseLasHeaderLine("DATE. 2026-01-12 : LOGGED AT 13:45", 1)).toMatchObject({
      value: "2026-01-12",
      description: "LOGGED AT 13:45",
    });
  });

  it("reads a colon right after the unit as the delimiter (common practice: `DEPT.M: DEPTH`)", () => {
    expect(parseLasHeaderLine("DEPT.M: DEPTH", 1)).toMatchObject({ mnemonic: "DEPT", unit: "M", value: "", description: "DEPTH" });
  });

  it("treats tabs as blanks (common practice)", () => {
    expect(parseLasHeaderLine("DT\t.US/F\t60 520 32 00\t: SONIC", 1)).toMatchObject({
      mnemonic: "DT",
      unit: "US/F",
      value: "60 520 32 00",
      description: "SONIC",
    });
  });

  it("refuses a line without a dot, or whose mnemonic is empty or has blanks (CWLS LAS 2.0, Appendix 1 Part 3: no internal spaces)", () => {
    expect(parseLasHeaderLine("WELL  NORTH RIDGE : WELL", 1)).toBeUndefined();
    expect(parseLasHeaderLine(".M 12 : NOTHING", 1)).toBeUndefined();
    expect(parseLasHeaderLine("WELL NAME. NORTH : WELL", 1)).toBeUndefined();
  });
});

describe("parseLasNumber", () => {
  it("reads the number forms real LAS files hold: leading dot, signs, exponents (common practice)", () => {
    expect(parseLasNumber(".3665")).toBe(0.3665);
    expect(parseLasNumber("-.5")).toBe(-0.5);
    expect(parseLasNumber("+2")).toBe(2);
    expect(parseLasNumber("1.2E+03")).toBe(1200);
    expect(parseLasNumber("1.2e-3")).toBe(0.0012);
    expect(parseLasNumber("-999.25")).toBe(-999.25);
    expect(parseLasNumber("7.")).toBe(7);
  });

  it("refuses what is not a decimal number, which Number() would accept or misread", () => {
    for (const token of ["", "0x1F", "Infinity", "NaN", "1,5", "1.2.3", "e5", "-", "12a", "\uFFFD"]) {
      expect(parseLasNumber(token)).toBeUndefined();
    }
  });
});
