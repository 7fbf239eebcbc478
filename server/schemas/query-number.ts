import { z } from "zod";

/** A decimal number as written in a query string: digits, optional sign, point and exponent; no hex, no blanks. */
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * The issue message of a query number, quoting the text as written. (A parameter given twice arrives as an array;
 * the app's error handler words that case for every query parameter alike.)
 */
const numberIssue = (issue: { code?: string; input?: unknown; minimum?: unknown; maximum?: unknown; inclusive?: boolean }): string => {
  const input = issue.input;
  if (input === undefined) return "is empty: give a decimal number, or leave the parameter out";
  if (issue.code === "too_small") return `must be ${issue.inclusive ? "at least" : "above"} ${String(issue.minimum)}, got ${String(input)}`;
  if (issue.code === "too_big") return `must be ${issue.inclusive ? "at most" : "below"} ${String(issue.maximum)}, got ${String(input)}`;
  if (typeof input === "string") {
    return DECIMAL.test(input.trim())
      ? `expected a finite decimal number, got ${JSON.stringify(input)}, which is beyond a 64-bit float`
      : `expected a finite decimal number (digits, an optional sign, point and exponent; no hex, units or other text), got ${JSON.stringify(input)}`;
  }
  return `expected a finite decimal number, got ${String(input)}`;
};

/**
 * A number read from a query string. `Number()` alone would read an empty value (`dtc=`) as 0 and `0x10` as 16:
 * here an empty value is absent and anything but a decimal number is refused, quoting the text sent.
 */
const decimalNumber = () => z.number({ error: numberIssue });

/** `queryNumber(decimalNumber().positive())` for a bound that must be positive. */
export { decimalNumber };

export const queryNumber = (schema: z.ZodNumber = decimalNumber()) =>
  z.preprocess((value) => {
    if (typeof value !== "string") return value;
    const text = value.trim();
    if (text === "") return undefined;
    const number = Number(text);
    // Text that is not a finite decimal stays text, so the issue can quote it.
    return DECIMAL.test(text) && Number.isFinite(number) ? number : value;
  }, schema);
