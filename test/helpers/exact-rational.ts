/**
 * Exact rational arithmetic on BigInts, for checking floating-point results against the exact value of a formula.
 * Every finite double is a rational number m·2^e (IEEE 754-2019 §3.3), so a formula evaluated on doubles has one
 * exact value; `nearestDouble` rounds it once, to nearest with ties to even (IEEE 754-2019 §4.3.1).
 */
export type Rational = readonly [numerator: bigint, denominator: bigint];

const bits = new DataView(new ArrayBuffer(8));

/** The exact value of a finite double. */
export const exactly = (x: number): Rational => {
  if (!Number.isFinite(x)) throw new RangeError(`${x} has no exact rational value`);
  bits.setFloat64(0, x);
  const word = bits.getBigUint64(0);
  const biased = Number((word >> 52n) & 0x7ffn);
  const fraction = word & ((1n << 52n) - 1n);
  const significand = biased === 0 ? fraction : fraction | (1n << 52n);
  const exponent = biased === 0 ? -1074 : biased - 1075;
  const signed = word >> 63n === 1n ? -significand : significand;
  return exponent >= 0 ? [signed << BigInt(exponent), 1n] : [signed, 1n << BigInt(-exponent)];
};

export const plus = (x: Rational, y: Rational): Rational => [x[0] * y[1] + y[0] * x[1], x[1] * y[1]];
export const minus = (x: Rational, y: Rational): Rational => [x[0] * y[1] - y[0] * x[1], x[1] * y[1]];
export const times = (x: Rational, y: Rational): Rational => [x[0] * y[0], x[1] * y[1]];
export const over = (x: Rational, y: Rational): Rational => {
  if (y[0] === 0n) throw new RangeError("division by zero");
  return y[0] < 0n ? [-x[0] * y[1], x[1] * -y[0]] : [x[0] * y[1], x[1] * y[0]];
};

const bitLength = (x: bigint): number => x.toString(2).length;

/** The double nearest to an exact value in the normal range, ties to even. */
export const nearestDouble = ([numerator, denominator]: Rational): number => {
  if (numerator === 0n) return 0;
  const negative = numerator < 0n;
  const magnitude = negative ? -numerator : numerator;
  // Scale so that the quotient has exactly 53 bits: 2^52 ≤ q < 2^53.
  let exponent = bitLength(magnitude) - bitLength(denominator) - 53;
  let top = exponent < 0 ? magnitude << BigInt(-exponent) : magnitude;
  let bottom = exponent > 0 ? denominator << BigInt(exponent) : denominator;
  let quotient = top / bottom;
  if (quotient >= 1n << 53n) {
    exponent++;
    bottom <<= 1n;
    quotient = top / bottom;
  } else if (quotient < 1n << 52n) {
    exponent--;
    top <<= 1n;
    quotient = top / bottom;
  }
  const twiceRemainder = 2n * (top - quotient * bottom);
  if (twiceRemainder > bottom || (twiceRemainder === bottom && (quotient & 1n) === 1n)) quotient++;
  if (exponent < -1074 + 52 || exponent > 1023 - 52) throw new RangeError("outside the normal range of doubles");
  const value = Number(quotient) * 2 ** exponent;
  return negative ? -value : value;
};

/** How many doubles apart two finite doubles of the same sign are (units in the last place). */
export const ulpsApart = (x: number, y: number): number => {
  if (x === y) return 0;
  bits.setFloat64(0, x);
  const xBits = bits.getBigInt64(0);
  bits.setFloat64(0, y);
  const yBits = bits.getBigInt64(0);
  if ((xBits < 0n) !== (yBits < 0n)) return Infinity;
  const gap = xBits - yBits;
  return Number(gap < 0n ? -gap : gap);
};
