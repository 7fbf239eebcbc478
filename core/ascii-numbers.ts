/**
 * Numbers written as ASCII bytes straight into a growing buffer, for the big text answers (CSV, LAS):
 * no string per number, no UTF-8 encoding afterwards. Each writer gives exactly the text of its
 * ECMAScript counterpart (ECMA-262 Number::toString, Number.prototype.toPrecision), which the tests check
 * on random doubles; the fast paths cover the values logs hold, anything else goes through the counterpart.
 */

import { INT_POW10, POW10 } from "./exact-doubles.js";
import { MAX_SHORTEST_BYTES, writeShortestDecimal } from "./shortest-decimal.js";

/** Significant digits that every double carries through a decimal round trip (IEEE 754 binary64: 15, C's DBL_DIG). */
export const MAX_EXACT_DIGITS = 15;

/** POW10 as a plain array: the writers below index it per digit, and read a plain array of doubles faster. */
const POWERS = Array.from(POW10);

/** Below this magnitude Number::toString writes an exponent (1e-7), and so do these writers. */
const SMALLEST_PLAIN = 1e-6;
/** Integers below this are exact doubles and are unique at 15 digits: m / 10^k reads back as one double only. */
const LARGEST_MANTISSA = 1e15;
const ZERO = 48;
const DOT = 46;
const MINUS = 45;
const SPACE = 32;

const UTF8 = new TextEncoder();
const ASCII = new TextDecoder("ascii");

/** Bytes that hold ASCII only, as a string. */
export const asciiString = (bytes: Uint8Array): string => ASCII.decode(bytes);

/** An ASCII text built byte by byte; `bytes()` hands out what was written. */
export class AsciiText {
  private buffer: Uint8Array;
  length = 0;

  constructor(capacity = 1 << 16) {
    this.buffer = new Uint8Array(capacity);
  }

  private ensure(extra: number): void {
    if (this.length + extra <= this.buffer.length) return;
    const larger = new Uint8Array(Math.max(this.buffer.length * 2, this.length + extra));
    larger.set(this.buffer.subarray(0, this.length));
    this.buffer = larger;
  }

  /** Appends text that is pure ASCII (callers pass only digits, signs, separators and ASCII names). */
  ascii(text: string): void {
    this.ensure(text.length);
    for (let i = 0; i < text.length; i++) this.buffer[this.length++] = text.charCodeAt(i);
  }

  byte(code: number): void {
    this.ensure(1);
    this.buffer[this.length++] = code;
  }

  /** Moves the text written since `from` right by `count` bytes and fills the gap with blanks (right-aligned columns). */
  padFrom(from: number, count: number): void {
    if (count <= 0) return;
    this.ensure(count);
    // Byte loops, not copyWithin and fill: a number's few bytes move faster than a built-in call is made.
    const buffer = this.buffer;
    for (let i = this.length - 1; i >= from; i--) buffer[i + count] = buffer[i];
    for (let i = from; i < from + count; i++) buffer[i] = SPACE;
    this.length += count;
  }

  /** Appends any text, UTF-8 encoded (header lines may hold names in any script). */
  utf8(text: string): void {
    this.append(UTF8.encode(text));
  }

  /** Appends `bytes[start..end)`, which must be ASCII. */
  copy(bytes: Uint8Array, start: number, end: number): void {
    this.ensure(end - start);
    const buffer = this.buffer;
    let at = this.length;
    for (let i = start; i < end; i++) buffer[at++] = bytes[i];
    this.length = at;
  }

  /** Appends the text of `String(value)` (writeShortestDecimal). */
  shortest(value: number): void {
    this.ensure(MAX_SHORTEST_BYTES);
    this.length = writeShortestDecimal(this.buffer, this.length, value);
  }

  /** Appends bytes as they are. */
  append(bytes: Uint8Array): void {
    this.ensure(bytes.length);
    this.buffer.set(bytes, this.length);
    this.length += bytes.length;
  }

  /** The bytes written so far, copied out, and the text emptied. */
  take(): Uint8Array {
    const bytes = this.buffer.slice(0, this.length);
    this.length = 0;
    return bytes;
  }

  /**
   * Writes the integer `mantissa` (0 ≤ mantissa < 1e15) with a decimal point `decimals` (0–22) places from its right,
   * trailing zeros dropped. Below 2^31, digit by digit in 32-bit integer arithmetic (what logs hold, and fast); a
   * longer mantissa as `String(mantissa / 10^decimals)`, which is the same text: the quotient is the double nearest
   * the decimal, and a decimal of at most 15 significant digits is the shortest that reads back as its double.
   */
  decimal(negative: boolean, mantissa: number, decimals: number): void {
    if (mantissa >= 2147483648) {
      this.ascii(String((negative ? -mantissa : mantissa) / POWERS[decimals]));
      return;
    }
    let m = mantissa | 0;
    let k = decimals | 0;
    while (k > 0) {
      const next = (m / 10) | 0;
      if (m !== next * 10) break;
      m = next;
      k--;
    }
    let digits = 1;
    while (digits < 10 && m >= INT_POW10[digits]) digits++;
    const integerDigits = digits > k ? digits - k : 1;
    const size = (negative ? 1 : 0) + integerDigits + (k > 0 ? 1 + k : 0);
    this.ensure(size);
    const buffer = this.buffer;
    let at = this.length + size;
    this.length = at;
    // Digits from the right, the point after the k-th.
    for (let i = 0; i < k + integerDigits; i++) {
      if (i === k && k > 0) buffer[--at] = DOT;
      const next = (m / 10) | 0;
      buffer[--at] = ZERO + (m - next * 10);
      m = next;
    }
    if (negative) buffer[--at] = MINUS;
  }
}

/**
 * `value` as the shortest text that reads back as the same double: the text of `String(value)`.
 * A decimal of at most 15 significant digits between 1e-6 and 1e15 (what a log holds) is found by trying
 * 0, 1, 2… decimals; any other value is written by writeShortestDecimal.
 */
export const writeShortest = (text: AsciiText, value: number): void => {
  const magnitude = Math.abs(value);
  if (magnitude >= SMALLEST_PLAIN && magnitude < LARGEST_MANTISSA) {
    for (let k = 0; k <= MAX_EXACT_DIGITS; k++) {
      const mantissa = Math.round(magnitude * POWERS[k]);
      if (mantissa >= LARGEST_MANTISSA) break;
      // m / 10^k is correctly rounded (both exact), so equality means the decimal reads back as this double.
      if (mantissa / POWERS[k] === magnitude) {
        text.decimal(value < 0, mantissa, k);
        return;
      }
    }
  }
  text.shortest(value);
};

/** A value so near a rounding tie that the scaled product's own rounding could decide it: left to toPrecision. */
const NEAR_TIE = 1e-6;

/**
 * `magnitude` scaled so that `digits` digits stand before the point (exponent = the power of ten of its first
 * digit) and rounded half up, or -1 when the product's own rounding could decide a near tie.
 */
const roundedMantissa = (magnitude: number, exponent: number, digits: number): number => {
  const decimals = digits - 1 - exponent;
  if (decimals > 22 || decimals < -22) return -1;
  const scaled = decimals >= 0 ? magnitude * POWERS[decimals] : magnitude / POWERS[-decimals];
  const floor = Math.floor(scaled);
  const fraction = scaled - floor;
  if (Math.abs(fraction - 0.5) <= NEAR_TIE) return -1;
  return fraction < 0.5 ? floor : floor + 1;
};

/**
 * `value` rounded to `digits` significant digits (1–15), trailing zeros dropped: the text of
 * `String(Number(value.toPrecision(digits)))`. Fast for magnitudes from 1e-6 to 1e15.
 */
export const writeSignificant = (text: AsciiText, value: number, digits: number): void => {
  const magnitude = Math.abs(value);
  if (magnitude >= SMALLEST_PLAIN && magnitude < LARGEST_MANTISSA && digits >= 1 && digits <= MAX_EXACT_DIGITS) {
    // log10 may miss by one next to a power of ten; the mantissa's digit count settles it.
    let exponent = 0;
    if (magnitude >= 1) while (exponent < 14 && magnitude >= POWERS[exponent + 1]) exponent++;
    else while (exponent > -6 && magnitude * POWERS[-exponent] < 1) exponent--;
    let mantissa = roundedMantissa(magnitude, exponent, digits);
    if (mantissa >= POWERS[digits]) mantissa = roundedMantissa(magnitude, ++exponent, digits);
    else if (mantissa >= 0 && mantissa < POWERS[digits - 1]) mantissa = roundedMantissa(magnitude, --exponent, digits);
    const decimals = digits - 1 - exponent;
    // A mantissa of exactly 10^(digits-1) may come from an exponent one too high (log10 rounded up to a whole
    // number) as well as from a value rounded up to a power of ten: rare either way, left to toPrecision.
    if (mantissa > POWERS[digits - 1] && mantissa < POWERS[digits]) {
      if (decimals >= 0) text.decimal(value < 0, mantissa, decimals);
      else text.decimal(value < 0, mantissa * POWERS[-decimals], 0);
      return;
    }
  }
  text.ascii(String(Number(value.toPrecision(digits))));
};

/** `value` with a fixed number of decimals: the text of `value.toFixed(decimals)` (the QC bit masks use 0). */
export const writeFixed = (text: AsciiText, value: number, decimals: number): void => {
  if (decimals === 0 && Number.isSafeInteger(value) && value >= 0) text.decimal(false, value, 0);
  else text.ascii(value.toFixed(decimals));
};

/**
 * How the samples of one column are written:
 * - `shortest`: the shortest text that reads back as exactly the same double (`String(x)`), the
 *   right choice for values read from a file, which then come back unchanged;
 * - `decimals`: a fixed number of decimals (`toFixed`);
 * - `significant`: that many significant digits, trailing zeros dropped (for computed values).
 * Very large or very small magnitudes may come out with an exponent (`1e-7`), which LAS and CSV readers accept.
 */
export type NumberFormat =
  | { readonly kind: "shortest" }
  | { readonly kind: "decimals"; readonly decimals: number }
  | { readonly kind: "significant"; readonly digits: number };

export const SHORTEST: NumberFormat = { kind: "shortest" };

/** Writes a finite `value` in `format`. */
export const writeNumber = (text: AsciiText, value: number, format: NumberFormat): void => {
  switch (format.kind) {
    case "shortest":
      return writeShortest(text, value);
    case "decimals":
      return writeFixed(text, value, format.decimals);
    case "significant":
      return writeSignificant(text, value, format.digits);
  }
};

const COMMA = 44;

const OPEN_BRACKET = 91;
const CLOSE_BRACKET = 93;

/**
 * A column as the bytes of a JSON array: each finite value as Number::toString writes it (writeShortestDecimal),
 * NaN and ±Infinity as null, which are the bytes JSON.stringify writes for the column's values.
 */
export const columnJsonBytes = (column: Float64Array): Uint8Array => {
  // Room for the longest text of every value; pages never written are never touched.
  const out = new Uint8Array(column.length * (MAX_SHORTEST_BYTES + 1) + 2);
  let at = 0;
  out[at++] = OPEN_BRACKET;
  for (let i = 0; i < column.length; i++) {
    if (i > 0) out[at++] = COMMA;
    const value = column[i];
    if (value - value === 0) at = writeShortestDecimal(out, at, value);
    else {
      out[at++] = 110; // null
      out[at++] = 117;
      out[at++] = 108;
      out[at++] = 108;
    }
  }
  out[at++] = CLOSE_BRACKET;
  return out.subarray(0, at);
};

/** A column as JSON text (columnJsonBytes as a string). */
export const columnJson = (column: Float64Array): string => asciiString(columnJsonBytes(column));

/**
 * Writes the finite `value` in `format`. `fullDouble` (from `fullDoublesOf`) says its column holds full-precision
 * doubles, which go straight to writeShortestDecimal instead of first trying writeShortest's short decimals (the
 * same text either way: the choice is one of speed only).
 */
export const writeColumnValue = (text: AsciiText, value: number, format: NumberFormat, fullDouble: boolean): void => {
  if (fullDouble) text.shortest(value);
  else writeNumber(text, value, format);
};

/** Finite values looked at to judge a column: a decimal as logs hold it has at most this many characters. */
const JUDGED_VALUES = 4;
const SHORT_DECIMAL_CHARACTERS = 15;

/** True when the first finite values of the column are full-precision doubles (computed values, not a log's decimals). */
const holdsFullDoubles = (column: Float64Array): boolean => {
  let judged = 0;
  for (let i = 0; i < column.length && judged < JUDGED_VALUES; i++) {
    if (!Number.isFinite(column[i])) continue;
    if (String(column[i]).length > SHORT_DECIMAL_CHARACTERS) return true;
    judged++;
  }
  return false;
};

/** For each column, true when it is written in the shortest form and its values are full-precision doubles (see writeColumnValue). */
export const fullDoublesOf = (columns: readonly Float64Array[], formats: readonly NumberFormat[]): boolean[] =>
  columns.map((column, c) => formats[c].kind === "shortest" && holdsFullDoubles(column));
