import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { lasCurveNames, lasMnemonic } from "../../../core/las/las-curve-names.js";
import { parseLas } from "../../../core/las/las-reader.js";
import { writeLas, type LasCurveToWrite } from "../../../core/las/las-writer.js";
import { uniqueMnemonics } from "../../../core/unique-mnemonics.js";

/** A mnemonic the LAS 2.0 line grammar can carry: printable ASCII, no dot, colon or blank, not starting a section or a comment (CWLS LAS 2.0, Appendix 1 Part 3; from memory). */
const VALID_MNEMONIC = /^[^~#.:\s][^.:\s]*$/;
const isValidMnemonic = (name: string): boolean => VALID_MNEMONIC.test(name) && /^[\x21-\x7e]+$/.test(name);

/** The original kept in a description as `INPUT NAME "…"` (a JSON string), if any. */
const kept = (description: string, what: "NAME" | "UNIT"): string | undefined => {
  const match = new RegExp(`INPUT ${what} ("(?:[^"\\\\]|\\\\.)*")`).exec(description);
  return match === null ? undefined : (JSON.parse(match[1]) as string);
};

const written = (curves: readonly LasCurveToWrite[]): string => [...writeLas({ curves, nullValue: -999.25 })].join("");

const depth: LasCurveToWrite = { mnemonic: "DEPT", unit: "M", description: "DEPTH", values: new Float64Array([1000, 1000.5]) };

describe("lasMnemonic", () => {
  it.each([
    ["GR.RAW", "GR_RAW"],
    ["GR x", "GR_x"],
    ["A B", "A_B"],
    ["DT:2", "DT_2"],
    ["~A", "_A"],
    ["#GR", "_GR"],
    ["", "_"],
    ["\u0394T", "_T"],
    ["\u{1F600}", "_"],
    ["RHOB", "RHOB"],
  ])("writes %j as %j: no blank, dot or colon, no leading ~ or #, printable ASCII only (CWLS LAS 2.0, Appendix 1 Part 3; from memory)", (name, mnemonic) => {
    expect(lasMnemonic(name)).toBe(mnemonic);
    expect(isValidMnemonic(lasMnemonic(name))).toBe(true);
  });
});

describe("lasCurveNames", () => {
  it("changes only names LAS cannot carry, keeping the original name and unit in the description (ours)", () => {
    const curves = lasCurveNames([
      { mnemonic: "DEPT", unit: "m", description: "" },
      { mnemonic: "GR.RAW", unit: "", description: "" },
      { mnemonic: "GR", unit: "a b", description: "GAMMA RAY" },
      { mnemonic: "A:B", unit: "", description: "" },
    ]);
    expect(curves).toEqual([
      { mnemonic: "DEPT", unit: "m", description: "" },
      { mnemonic: "GR_RAW", unit: "", description: 'INPUT NAME "GR.RAW"' },
      { mnemonic: "GR", unit: "a_b", description: 'GAMMA RAY; INPUT UNIT "a b"' },
      { mnemonic: "A_B", unit: "", description: 'INPUT NAME "A\\u003aB"' },
    ]);
    expect(kept(curves[3].description, "NAME")).toBe("A:B");
  });

  it("numbers names that become alike with _2, never taking a valid name a curve has, nor a reserved one (ours)", () => {
    const names = (list: string[], reserved: string[] = []) =>
      lasCurveNames(list.map((mnemonic) => ({ mnemonic, unit: "", description: "" })), reserved).map((curve) => curve.mnemonic);
    expect(names(["GR.RAW", "GR_RAW", "GR RAW"])).toEqual(["GR_RAW_2", "GR_RAW", "GR_RAW_3"]);
    expect(names(["DT", "DT", "dt"])).toEqual(["DT", "DT_2", "dt_3"]);
    expect(names(["EL_E", "el_e", "EL.E", "EL_QC"], ["EL_E", "EL_QC"])).toEqual(["EL_E_2", "el_e_3", "EL_E_4", "EL_QC_2"]);
  });

  it("gives a LAS file the reader reads back for any names and units: same curves, names, values, originals kept (property; CWLS LAS 2.0)", () => {
    const tricky = fc.constantFrom(".", ":", " ", "~", "#", "\t", "\r", "\n", '"', "\\", "\u00e9", "\u00b5", "\u00a0", "\ufeff", "\u2028", "1", "a", "A", "_", "[", "]");
    const anyText = fc.oneof(
      fc.string({ unit: "binary", maxLength: 10 }),
      fc.string({ unit: tricky, maxLength: 8 }),
      fc.constantFrom("", "GR.RAW", "GR x", "A B", "~A", "#GR", "DT:2", "EL_E", "DEPT", "dept"),
    );
    const curve = fc.record({ mnemonic: anyText, unit: anyText });
    fc.assert(
      fc.property(fc.array(curve, { minLength: 1, maxLength: 6 }), (extra) => {
        const given = [depth, ...extra.map((c, i) => ({ ...c, description: "", values: new Float64Array([i + 0.5, -(i + 1.25)]) }))];
        const named = lasCurveNames(given, ["EL_E", "EL_QC"]);
        const back = parseLas(written(named));
        expect(back.table.curves).toHaveLength(given.length);
        expect(back.table.columns).toEqual(given.map((c) => c.values));
        expect(back.warnings).toEqual([]);
        expect(back.table.curves.map((c) => c.mnemonic)).toEqual(named.map((c) => c.mnemonic));
        const upper = back.table.curves.map((c) => c.mnemonic.toUpperCase());
        expect(new Set([...upper, "EL_E", "EL_QC"]).size).toBe(upper.length + 2);
        back.table.curves.forEach((read, c) => {
          expect(isValidMnemonic(read.mnemonic)).toBe(true);
          expect(kept(read.description, "NAME") ?? read.mnemonic).toBe(given[c].mnemonic);
          expect(kept(read.description, "UNIT") ?? read.unit).toBe(given[c].unit);
        });
      }),
      { numRuns: 300 },
    );
  });
});

describe("uniqueMnemonics options", () => {
  it("numbers a name equal to a reserved one, with the separator asked for (ours)", () => {
    expect(uniqueMnemonics(["EL_E", "DT", "el_qc"], { reserved: ["EL_E", "EL_QC"] })).toEqual(["EL_E:2", "DT", "el_qc:2"]);
    expect(uniqueMnemonics(["EL_E", "EL_E_2"], { reserved: ["EL_E"], separator: "_" })).toEqual(["EL_E_3", "EL_E_2"]);
  });
});
