import { POW10 } from "./exact-doubles.js";

/** Integers below this are exact doubles: 2^53. */
const EXACT_INTEGERS = 9007199254740992;

/**
 * The number a plain decimal token spells (`1523.4`, `-0.25`, `.5`, `7.`): an optional sign, digits and at most
 * one point, no exponent. Read as the integer of its digits divided by a power of ten, both exact doubles, so the
 * quotient is correctly rounded (IEEE 754 division) and equals `Number(text)` (Clinger, 1990, "How to read floating
 * point numbers accurately", the fast path). NaN when the token is anything else or needs more than that: the
 * caller then reads it the slow way. Reads `text` from `start` to `end`, so that a line's tokens need not be cut out.
 */
export const plainDecimal = (text: string, start = 0, end = text.length): number => {
  let i = start;
  let negative = false;
  const first = text.charCodeAt(start);
  if (first === 45 || first === 43) {
    negative = first === 45;
    i = start + 1;
  }
  let mantissa = 0;
  let digits = 0;
  let decimals = -1;
  for (; i < end; i++) {
    const code = text.charCodeAt(i);
    if (code >= 48 && code <= 57) {
      mantissa = mantissa * 10 + (code - 48);
      digits++;
      if (decimals >= 0) decimals++;
    } else if (code === 46 && decimals < 0) decimals = 0;
    else return NaN;
  }
  if (digits === 0 || mantissa >= EXACT_INTEGERS || decimals > 22) return NaN;
  const value = decimals > 0 ? mantissa / POW10[decimals] : mantissa;
  return negative ? -value : value;
};
