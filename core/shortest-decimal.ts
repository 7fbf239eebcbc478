/**
 * The shortest decimal text that reads back as the same double, written as ASCII bytes: the text of `String(value)`
 * (ECMA-262 Number::toString, radix 10), without making a string per number.
 *
 * The method is that of the shortest-digit writers (Steele & White's "free-format" output, as in Ryū and Schubfach):
 * scale the value by a power of ten so that it has 17 digits before the point, take the interval of reals that
 * round to the same double, and keep as few digits as leave the result inside it, choosing the nearest such
 * decimal. Here the arithmetic is done with doubles and error-free transformations (Dekker's exact product,
 * exact sums and remainders) instead of 128-bit integers, so every decision is exact: for a value between 1e-6
 * and 1e17 (what a log or a modulus holds) whose power of ten is an exact double. Any value outside that range,
 * a power of two (whose interval is lopsided), an exact tie, or a result of one or two digits is written by
 * `String` instead, so the text is Number::toString's in every case.
 */

import { INT_POW10, POW10, splitHigh } from "./exact-doubles.js";

/**
 * Room to leave for one value: "-0.00000" and 17 digits are 25 bytes; String's longest, "-2.2250738585072014e-308", 24.
 * The writer may put digits past the end of its text, within this room.
 */
export const MAX_SHORTEST_BYTES = 25;

const ZERO = 48;
const DOT = 46;
const MINUS = 45;

/** Dekker's split of each 10^k into a high and a low half of 26 bits each. */
const POW10_HIGH = POW10.map(splitHigh);
const POW10_LOW = POW10.map((p, k) => p - POW10_HIGH[k]);
/** 2^(b - 1076) for every biased exponent b: half a unit in the last place of a double with that exponent. */
const HALF_ULP = Float64Array.from({ length: 2048 }, (_, b) => 2 ** (b - 1076));
/** floor(log10(2^(b - 1023))) estimates the decimal exponent from the binary one to within one. */
const LOG10_2 = Math.log10(2);

const bits = new Float64Array(1);
const words = new Uint32Array(bits.buffer);
/** Index of the high word of a double in `words`: 1 on little-endian machines. */
const HIGH = new Uint8Array(new Uint16Array([1]).buffer)[0] === 1 ? 1 : 0;
const LOW = 1 - HIGH;

/** Pairs of decimal digits "00".."99" as byte codes. */
const PAIRS = Uint8Array.from({ length: 200 }, (_, i) => ZERO + (i % 2 === 0 ? Math.floor(i / 20) : (i >> 1) % 10));

/** Writes the last 2 * pairs digits of `value` (a 32-bit integer) to end at out[end - 1], two at a time; returns the digits left. */
const putPairs = (out: Uint8Array, end: number, value: number, pairs: number): number => {
  let v = value;
  for (let at = end - 2, last = end - 2 * pairs; at >= last; at -= 2) {
    const next = (v / 100) | 0;
    const pair = (v - next * 100) << 1;
    out[at] = PAIRS[pair];
    out[at + 1] = PAIRS[pair + 1];
    v = next;
  }
  return v;
};

/** Writes the 17 digits of top * 1e8 + bottom (top < 1e9, bottom < 1e8) at out[at..at+17). */
const putSeventeen = (out: Uint8Array, at: number, top: number, bottom: number): void => {
  putPairs(out, at + 17, bottom | 0, 4);
  out[at] = ZERO + putPairs(out, at + 9, top | 0, 4);
};

/**
 * Exact comparison of the real `a + f` (a an integer of at most 2^53, |f| ≤ 0.5) with the double `bound`:
 * negative, zero or positive. A rounded sum lies on the same side of a double as the exact one, or on it;
 * only then does the sum's rounding error decide.
 */
const compareSum = (a: number, f: number, bound: number): number => {
  const s = a + f;
  if (s !== bound) return s < bound ? -1 : 1;
  const shifted = s - a;
  const error = a - (s - shifted) + (f - shifted);
  return error < 0 ? -1 : error > 0 ? 1 : 0;
};

/** True when a decimal at distance `a + f` from the value (a ≥ 0) lies inside the half-interval `half`. */
const within = (a: number, f: number, half: number, inclusive: boolean): boolean => {
  if (a > 16) return false; // half < 12 and |f| ≤ 0.5
  const side = compareSum(a, f, half);
  return side < 0 || (side === 0 && inclusive);
};

/** Appends String(value) as ASCII: the slow path, and every value the fast path leaves. */
const writeString = (out: Uint8Array, at: number, value: number): number => {
  const text = String(value);
  for (let i = 0; i < text.length; i++) out[at + i] = text.charCodeAt(i);
  return at + text.length;
};

/**
 * Writes the text of `String(value)` at `out[at]` and returns the index after it. The caller leaves
 * MAX_SHORTEST_BYTES of room. NaN and ±Infinity come out as String writes them too (JSON writers test for them first).
 */
export const writeShortestDecimal = (out: Uint8Array, at: number, value: number): number => {
  bits[0] = value;
  const high = words[HIGH];
  const low = words[LOW];
  const biased = (high >>> 20) & 0x7ff;
  // Zero, subnormals, NaN, infinities and powers of two (a lopsided interval) go to String.
  if (biased === 0 || biased === 0x7ff || ((high & 0xfffff) === 0 && low === 0)) return writeString(out, at, value);
  const x = Math.abs(value);
  let exponent = Math.floor((biased - 1023) * LOG10_2);
  let scaledHigh = 0;
  let scaledLow = 0;
  let power = 0;
  // At most two rounds: the estimate is the exponent or one below it.
  for (let round = 0; ; round++) {
    power = 16 - exponent;
    if (power < 0 || power > 22 || round > 2) return writeString(out, at, value);
    // x * 10^power = scaledHigh + scaledLow exactly (Dekker's product).
    const p = POW10[power];
    scaledHigh = x * p;
    const xHigh = splitHigh(x);
    const xLow = x - xHigh;
    const pHigh = POW10_HIGH[power];
    const pLow = POW10_LOW[power];
    scaledLow = xHigh * pHigh - scaledHigh + xHigh * pLow + xLow * pHigh + xLow * pLow;
    if (scaledHigh < 1e16 || (scaledHigh === 1e16 && scaledLow < 0)) exponent--;
    else if (scaledHigh > 1e17 || (scaledHigh === 1e17 && scaledLow >= 0)) exponent++;
    else break;
  }
  // The scaled value is now 1e16 ≤ c < 1e17; scaledHigh is an integer (its ulp is at least 2). Split
  // c = top * 1e8 + bottom + fraction: top and bottom integers, bottom in [0, 1e8), fraction in [-0.5, 0.5].
  const whole = Math.round(scaledLow);
  const fraction = scaledLow - whole;
  let top = Math.floor(scaledHigh / 1e8);
  let bottom = scaledHigh - top * 1e8 + whole;
  while (bottom < 0) {
    bottom += 1e8;
    top--;
  }
  while (bottom >= 1e8) {
    bottom -= 1e8;
    top++;
  }
  // Reals within half an ulp of x read back as x, the ends too when x's last bit is 0 (ties to even).
  const half = HALF_ULP[biased] * POW10[16 - exponent];
  const inclusive = (low & 1) === 0;
  // The nearest integer is always inside (half > 0.55); try dropping digits while the nearest multiple of 10^j stays inside.
  // The integer's own trailing zeros can all be dropped (it is inside): start past them. Divisions by a constant
  // 10 in 32-bit integers, which the compiler turns into a multiplication; `quotient` is bottom / 10^chosen, rounded down.
  const integerBottom = bottom | 0;
  let chosen = 0;
  let quotient = integerBottom;
  if (integerBottom === 0) {
    chosen = 8;
    const integerTop = top | 0;
    while (chosen < 14 && integerTop % INT_POW10[chosen - 7] === 0) chosen++;
  } else {
    for (let next = (quotient / 10) | 0; next * 10 === quotient; next = (quotient / 10) | 0) {
      quotient = next;
      chosen++;
    }
  }
  let chosenUp = false;
  let chosenRest = 0;
  for (let j = chosen + 1; j <= 15; j++) {
    const step = POW10[j];
    let rest: number;
    if (j <= 8) {
      quotient = (quotient / 10) | 0;
      rest = integerBottom - quotient * step;
    } else rest = (top - Math.floor(top / POW10[j - 8]) * POW10[j - 8]) * 1e8 + bottom;
    const side = compareSum(rest - step / 2, fraction, 0);
    if (side === 0) return writeString(out, at, value); // an exact tie between two decimals
    const up = side > 0;
    const inside = up ? within(step - rest, -fraction, half, inclusive) : rest === 0 && fraction < 0 ? true : within(rest, fraction, half, inclusive);
    if (!inside) break;
    if (j === 15) return writeString(out, at, value); // one or two digits: rare, left to String
    chosen = j;
    chosenUp = up;
    chosenRest = rest;
  }
  // The chosen decimal: c's digits with the last `chosen` dropped, rounded down or up.
  if (chosen > 0) {
    if (chosen <= 8) bottom -= chosenRest;
    else {
      top -= Math.floor(chosenRest / 1e8);
      bottom = 0;
    }
    if (chosenUp) {
      if (chosen <= 8) bottom += POW10[chosen];
      else top += POW10[chosen - 8];
      if (bottom >= 1e8) {
        bottom -= 1e8;
        top++;
      }
    }
  } else if (fraction === -0.5 && (bottom & 1) === 1) {
    // c lies halfway between two integers (Math.round took the upper, odd one): Number::toString takes the even one.
    bottom--;
  }
  if (top >= 1e9) return writeString(out, at, value); // rounded up to a power of ten
  const count = 17 - chosen;
  // Number::toString: n is the position of the point after the first digit's power of ten.
  const n = exponent + 1;
  let w = at;
  if (value < 0) out[w++] = MINUS;
  if (n <= 0) {
    // 0.000ddd
    out[w++] = ZERO;
    out[w++] = DOT;
    for (let i = n; i < 0; i++) out[w++] = ZERO;
    putSeventeen(out, w, top, bottom);
    return w + count;
  }
  if (n < count) {
    // dd.ddd: all 17 digits one place to the right, then the first n moved back in front of the point.
    putSeventeen(out, w + 1, top, bottom);
    for (let i = 0; i < n; i++) out[w + i] = out[w + i + 1];
    out[w + n] = DOT;
    return w + count + 1;
  }
  // ddd000: the dropped digits are zeros already, and n ≤ 17.
  putSeventeen(out, w, top, bottom);
  return w + n;
};
