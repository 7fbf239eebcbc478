import { findHeaderItem, type LasSection, type LasWarning, type LasWellSummary } from "./las-document.js";
import type { LasNumberItem } from "./las-index-check.js";
import { parseLasNumber } from "./las-number.js";

const NUMERIC_ITEMS = ["STRT", "STOP", "STEP", "NULL"] as const;
type NumericItem = (typeof NUMERIC_ITEMS)[number];

/**
 * The `~Well` items every LAS 2.0 file must have (CWLS LAS 2.0, Appendix 1 Part 4, ~W), with STRT,
 * STOP, STEP and NULL read as numbers. An absent or unreadable number is a warning, never an error.
 */
export const summariseWell = (
  sections: readonly LasSection[],
): { well: LasWellSummary; numbers: Record<NumericItem, LasNumberItem>; warnings: LasWarning[] } => {
  const document = { sections };
  const wellSection = sections.find((section) => section.kind === "well");
  const sectionLine = wellSection?.line ?? 1;
  const warnings: LasWarning[] = [];
  if (wellSection === undefined) warnings.push({ line: 1, message: "the file has no ~Well section" });

  const numbers = {} as Record<NumericItem, LasNumberItem>;
  for (const mnemonic of NUMERIC_ITEMS) {
    const item = findHeaderItem(document, "well", mnemonic);
    const value = item === undefined ? undefined : parseLasNumber(item.value);
    numbers[mnemonic] = { value, line: item?.line ?? sectionLine };
    if (wellSection !== undefined && item === undefined) {
      warnings.push({ line: sectionLine, message: `~Well has no ${mnemonic} item` });
    } else if (item !== undefined && value === undefined) {
      warnings.push({ line: item.line, message: `${mnemonic} ${JSON.stringify(item.value)} is not a number; ignored` });
    }
  }

  const text = (...mnemonics: string[]): string | undefined => {
    for (const mnemonic of mnemonics) {
      const value = findHeaderItem(document, "well", mnemonic)?.value;
      if (value !== undefined && value !== "") return value;
    }
    return undefined;
  };

  const well: LasWellSummary = {
    startIndex: numbers.STRT.value,
    stopIndex: numbers.STOP.value,
    step: numbers.STEP.value,
    indexUnit: findHeaderItem(document, "well", "STRT")?.unit ?? "",
    nullValue: numbers.NULL.value,
    wellName: text("WELL"),
    company: text("COMP"),
    field: text("FLD"),
    location: text("LOC"),
    serviceCompany: text("SRVC"),
    date: text("DATE"),
    uniqueWellId: text("UWI", "API"),
  };
  return { well, numbers, warnings };
};
