/**
 * Exact arithmetic on doubles, shared by the number reader and writers and by the elastic kernel: the powers of ten
 * a double holds exactly, Dekker's split (T. J. Dekker, 1971, "A floating-point technique for extending the
 * available precision", Numerische Mathematik 18) and Knuth's two-sum (The Art of Computer Programming vol. 2, §4.2.2).
 */

/** 10^k for k = 0..22, every one an exact double. */
export const POW10 = Float64Array.from({ length: 23 }, (_, k) => 10 ** k);
/** 10^k for k = 0..9, the powers of ten below 2^31, as 32-bit integers (for integer arithmetic). */
export const INT_POW10 = Int32Array.from({ length: 10 }, (_, k) => 10 ** k);

/** 2^27 + 1: splits a double into two halves of 26 bits whose products are exact. */
const SPLITTER = 134217729;

/** The high half of Dekker's split of `a`; `a - splitHigh(a)` is the low half, exactly. */
export const splitHigh = (a: number): number => {
  const t = SPLITTER * a;
  return t - (t - a);
};

/** What `square = a * a` rounded off, exactly: a² = square + squareError(a, square) (Dekker's product). */
export const squareError = (a: number, square: number): number => {
  const high = splitHigh(a);
  const low = a - high;
  return high * high - square + 2 * high * low + low * low;
};

/** The rounding error of `sum = x + y`, exactly (Knuth's two-sum). */
export const sumError = (x: number, y: number, sum: number): number => {
  const back = sum - x;
  return x - (sum - back) + (y - back);
};
