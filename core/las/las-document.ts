import type { WellTable } from "../well-table.js";

/** One `MNEM.UNIT VALUE : DESCRIPTION` line of a header section, as read. */
export interface LasHeaderItem {
  mnemonic: string;
  unit: string;
  value: string;
  description: string;
  /** 1-based line of the file. */
  line: number;
}

/** A free-text line of `~Other` (or of a section this reader does not know), right-trimmed. */
export interface LasTextLine {
  text: string;
  line: number;
}

export type LasItemSectionKind = "version" | "well" | "curve" | "parameter";

/** One section of a LAS file; `title` is the whole `~…` line as written, `line` where it is. */
export type LasSection = LasItemSection | LasTextSection | { kind: "data"; title: string; line: number };
export interface LasItemSection {
  kind: LasItemSectionKind;
  title: string;
  line: number;
  items: LasHeaderItem[];
}
export interface LasTextSection {
  kind: "other" | "unknown";
  title: string;
  line: number;
  lines: LasTextLine[];
}

export const isItemSection = (section: LasSection): section is LasItemSection => "items" in section;

/** Something in the file the analyst should know about, though it did not stop the reading. */
export interface LasWarning {
  line: number;
  message: string;
}

/** The `~Well` items most callers need, with numbers already read; `undefined` where absent or unreadable. */
export interface LasWellSummary {
  startIndex: number | undefined;
  stopIndex: number | undefined;
  /** 0 means irregular sampling. */
  step: number | undefined;
  /** Unit of STRT/STOP/STEP as written (`M`, `FT`, `S` …). */
  indexUnit: string;
  nullValue: number | undefined;
  wellName: string | undefined;
  company: string | undefined;
  field: string | undefined;
  location: string | undefined;
  serviceCompany: string | undefined;
  date: string | undefined;
  /** UWI, or API number when the file gives that instead. */
  uniqueWellId: string | undefined;
}

/**
 * Everything read from a LAS file. Header sections are kept in file order (with any LAS 1.2
 * well values already moved to the value position); the samples are in `table`.
 */
export interface LasDocument {
  /** `VERS` as written (`2.0`, `1.20` …). */
  version: string;
  wrapped: boolean;
  sections: LasSection[];
  well: LasWellSummary;
  table: WellTable;
  warnings: LasWarning[];
}

/** The first item with this mnemonic (case-insensitive) in sections of this kind, if any. */
export const findHeaderItem = (
  document: { readonly sections: readonly LasSection[] },
  kind: LasItemSectionKind,
  mnemonic: string,
): LasHeaderItem | undefined => {
  const wanted = mnemonic.toUpperCase();
  for (const section of document.sections) {
    if (!isItemSection(section) || section.kind !== kind) continue;
    const item = section.items.find((candidate) => candidate.mnemonic.toUpperCase() === wanted);
    if (item !== undefined) return item;
  }
  return undefined;
};
