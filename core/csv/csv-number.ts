import { plainDecimal } from "../plain-decimal.js";

/** Cell spellings that mean "no value" (compared case-insensitively after trimming). Common practice. */
export const CSV_MISSING_SPELLINGS: readonly string[] = ["", "na", "nan", "null", "-"];

const MISSING = new Set(CSV_MISSING_SPELLINGS);
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const INFINITY = /^[+-]?Infinity$/;

/**
 * The number a CSV cell holds: a decimal such as `12`, `-3.5`, `.3665`, `+1.2E+03`;
 * NaN for an empty or missing cell (see `CSV_MISSING_SPELLINGS`); ±Infinity for the spelling
 * `String()` gives it, so that whatever the writer writes reads back. `undefined` for anything else.
 */
export const readCsvNumber = (cell: string): number | undefined => {
  const plain = plainDecimal(cell);
  if (plain === plain) return plain;
  const text = cell.trim();
  if (DECIMAL.test(text) || INFINITY.test(text)) return Number(text);
  return MISSING.has(text.toLowerCase()) ? NaN : undefined;
};
