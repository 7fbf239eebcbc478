import type { CurveInfo } from "../well-table.js";
import { uniqueMnemonics } from "../unique-mnemonics.js";

const NAME_AND_UNIT = /^(.*?)\s*(?:\[([^\]]*)\]|\(([^)]*)\))$/;

/**
 * Splits a header cell into mnemonic and unit: `DTC[us/ft]`, `DTC [us/ft]`, `DTC (us/ft)`
 * or a bare `DTC` (unit ""). Only a bracket or parenthesis group at the very end is a unit.
 */
export const splitHeaderCell = (cell: string): { mnemonic: string; unit: string } => {
  const text = cell.trim();
  const match = NAME_AND_UNIT.exec(text);
  if (match === null) return { mnemonic: text, unit: "" };
  return { mnemonic: match[1], unit: (match[2] ?? match[3]).trim() };
};

/**
 * Curves described by a CSV header line. A cell with no name gets `COL<n>` (n its 1-based
 * column), as the index column some programs write has an empty header; repeated names are
 * made unique (`DT`, `DT:2`).
 */
export const curvesFromHeader = (cells: readonly string[]): CurveInfo[] => {
  const parts = cells.map(splitHeaderCell);
  const names = uniqueMnemonics(parts.map((part, column) => part.mnemonic || `COL${column + 1}`));
  return parts.map((part, column) => ({ mnemonic: names[column], unit: part.unit, description: "" }));
};
