import type { LasHeaderItem } from "./las-document.js";

/** Words a LAS 1.2 file writes in the value position of `~Well` items whose real value follows the colon. */
const LABELS: Record<string, readonly string[]> = {
  COMP: ["COMPANY"],
  WELL: ["WELL", "WELL NAME"],
  FLD: ["FIELD"],
  LOC: ["LOCATION"],
  PROV: ["PROVINCE"],
  CNTY: ["COUNTY"],
  STAT: ["STATE"],
  CTRY: ["COUNTRY"],
  SRVC: ["SERVICE COMPANY", "SERVICE"],
  DATE: ["DATE", "LOG DATE"],
  UWI: ["UWI", "UNIQUE WELL ID", "UNIQUE WELL IDENTIFIER"],
  API: ["API", "API NUMBER"],
};

const normalise = (text: string): string => text.toUpperCase().replace(/\s+/g, " ").trim();

const isLabel = (mnemonic: string, text: string): boolean => {
  const word = normalise(text);
  return word === mnemonic || (LABELS[mnemonic]?.includes(word) ?? false);
};

/**
 * A LAS 1.2 `~Well` item written as `WELL.  WELL : NORTH RIDGE 7` (label before the colon, value
 * after it, CWLS LAS 1.2, 1990) with value and description put back in their LAS 2.0 places;
 * undefined when the item does not look swapped.
 */
export const recoverLegacyWellItem = (item: LasHeaderItem): LasHeaderItem | undefined => {
  const mnemonic = item.mnemonic.toUpperCase();
  if (item.description === "" || !isLabel(mnemonic, item.value) || isLabel(mnemonic, item.description)) {
    return undefined;
  }
  return { ...item, value: item.description, description: item.value };
};
