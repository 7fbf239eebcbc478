import { plainDecimal } from "../plain-decimal.js";

/** Cell spellings that mean "no value" (compared case-insensitively after trimming). Common practice. */
export const CSV_MISSING_SPELLINGS: readonly string[] = ["", "na", "nan", "null", "-"];

const MISSING = new Set(CSV_MISSING_SPELLINGS);
const DECIMAL = /^[+-]?(?:\d+\.?\d*|\.\d+)(?:[eE][+-]?\d+)?$/;
const INFINITY = /^[+-]?Infinity$/;
const DECIMAL_COMMA = /^[+-]?\d*,\d+(?:[eE][+-]?\d+)?$/;

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

/**
 * Whether a cell is a number written with a decimal comma (`90,5`, `-0,25`, `,5`), as spreadsheets set to a
 * decimal-comma locale export numbers (common practice; such files usually take the semicolon as delimiter).
 * `readCsvNumber` refuses these: a CSV number here has a decimal point.
 */
export const isDecimalCommaNumber = (cell: string): boolean => DECIMAL_COMMA.test(cell.trim());
