import { z } from "zod";

/** A decimal number as written in a query string: digits, optional sign, point and exponent; no hex, no blanks. */
const DECIMAL = /^[+-]?(\d+\.?\d*|\.\d+)([eE][+-]?\d+)?$/;

/**
 * A number read from a query string. `Number()` alone would read an empty value (`dtc=`) as 0 and `0x10` as 16:
 * here an empty value is absent and anything but a decimal number is refused.
 */
const decimalNumber = () => z.number({ error: (issue) => (issue.input === undefined ? "is empty: give a decimal number, or leave the parameter out" : `expected a finite decimal number, got ${String(issue.input)}`) });

/** `queryNumber(decimalNumber().positive())` for a bound that must be positive. */
export { decimalNumber };

export const queryNumber = (schema: z.ZodNumber = decimalNumber()) =>
  z.preprocess((value) => {
    if (typeof value !== "string") return value;
    const text = value.trim();
    if (text === "") return undefined;
    return DECIMAL.test(text) ? Number(text) : Number.NaN;
  }, schema);
