/**
 * Input ~Parameter items named like the ones a writer adds (an answer sent back in) are renamed as curves are, so no
 * two items of one name contradict each other. Data from our own fictional well, Kestrel Bight 2.
 */
import { describe, expect, it } from "vitest";
import { findHeaderItem, isItemSection, type LasSection } from "../../../core/las/las-document.js";
import { parseLas } from "../../../core/las/las-reader.js";
import { lasCurvesOf, writeLas } from "../../../core/las/las-writer.js";

const INPUT = [
  "~Version",
  "VERS. 2.0 : CWLS LOG ASCII STANDARD - VERSION 2.0",
  "WRAP. NO : ONE LINE PER DEPTH STEP",
  "~Well",
  "STRT.M 2200.0 : START DEPTH",
  "STOP.M 2200.5 : STOP DEPTH",
  "STEP.M 0.5 : STEP",
  "NULL. -999.25 : NULL VALUE",
  "WELL. KESTREL BIGHT 2 : WELL",
  "~Curve",
  "DEPT.M : DEPTH",
  "DTC.US/F : COMPRESSIONAL SLOWNESS",
  "~Parameter",
  "BS.MM 215.9 : BIT SIZE",
  "EL_NEG_PR. INVALID : VP/VS BELOW SQRT2 HANDLING",
  "el_version. 0.0.9 : ELASTILOG VERSION",
  "EL_NEG_PR_2. OLDER : AN EARLIER ANSWER'S OWN RENAMED ITEM",
  "~Other",
  "EL_NEG_PR was INVALID in the first answer.",
  "~A",
  "2200.0 95",
  "2200.5 96",
  "",
].join("\n");

const parametersOf = (sections: readonly LasSection[]) =>
  sections.flatMap((section) => (isItemSection(section) && section.kind === "parameter" ? section.items : [])).map(({ mnemonic, value, description }) => ({ mnemonic, value, description }));

describe("writeLas with parameters whose names the input's ~Parameter already holds", () => {
  const input = parseLas(INPUT);
  const written = [...writeLas({
    header: input.sections,
    curves: lasCurvesOf(input),
    nullValue: -999.25,
    parameters: [
      { mnemonic: "EL_VERSION", value: "0.1.0", description: "ELASTILOG VERSION" },
      { mnemonic: "EL_NEG_PR", value: "KEEP", description: "VP/VS BELOW SQRT2 HANDLING" },
    ],
  })].join("");
  const back = parseLas(written);

  it("renames the input's clashing items with _2, _3 … (any case, past names the input already has), keeping their values and noting the original name (CWLS LAS 2.0, Appendix 1 Part 3: one mnemonic, one item; from memory)", () => {
    expect(parametersOf(back.sections)).toEqual([
      { mnemonic: "BS", value: "215.9", description: "BIT SIZE" },
      { mnemonic: "EL_NEG_PR_3", value: "INVALID", description: 'VP/VS BELOW SQRT2 HANDLING; INPUT NAME "EL_NEG_PR"' },
      { mnemonic: "el_version_2", value: "0.0.9", description: 'ELASTILOG VERSION; INPUT NAME "el_version"' },
      { mnemonic: "EL_NEG_PR_2", value: "OLDER", description: "AN EARLIER ANSWER'S OWN RENAMED ITEM" },
      { mnemonic: "EL_VERSION", value: "0.1.0", description: "ELASTILOG VERSION" },
      { mnemonic: "EL_NEG_PR", value: "KEEP", description: "VP/VS BELOW SQRT2 HANDLING" },
    ]);
    const names = parametersOf(back.sections).map((item) => item.mnemonic.toUpperCase());
    expect(new Set(names).size).toBe(names.length);
    expect(findHeaderItem(back, "parameter", "EL_NEG_PR")?.value).toBe("KEEP");
  });

  it("leaves ~Other as it was, and a header without clashes unchanged", () => {
    expect(written).toContain("EL_NEG_PR was INVALID in the first answer.");
    const plain = [...writeLas({ header: input.sections, curves: lasCurvesOf(input), nullValue: -999.25, parameters: [{ mnemonic: "EL_OTHER", value: "1" }] })].join("");
    expect(parametersOf(parseLas(plain).sections).slice(0, 4)).toEqual(parametersOf(input.sections));
  });

  it("renames in every ~Parameter section, the items of a second one too", () => {
    const twice = INPUT.replace("~Other", "~Parameter\nEL_VERSION. 0.0.8 : A SECOND SECTION\n~Other");
    const document = parseLas(twice);
    const text = [...writeLas({ header: document.sections, curves: lasCurvesOf(document), nullValue: -999.25, parameters: [{ mnemonic: "EL_VERSION", value: "0.1.0" }] })].join("");
    const names = parametersOf(parseLas(text).sections).map((item) => item.mnemonic);
    expect(names).toEqual(["BS", "EL_NEG_PR", "el_version_2", "EL_NEG_PR_2", "EL_VERSION", "EL_VERSION_3"]);
  });
});
