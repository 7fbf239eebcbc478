/**
 * writeShortestDecimal must write exactly the text of ECMA-262 Number::toString (radix 10), the text of
 * `String(value)`: the shortest decimal that reads back as the same double, the nearest one when several are as
 * short, the even one on a tie, and the layout rules (no exponent from 1e-6 up to 1e21). The reference is V8's own
 * String, which implements that section of the standard. The values: any double, the ranges of logs and moduli,
 * short decimals, and the hard cases of shortest-digit writers (exact ties at 17 digits, neighbours of powers of ten,
 * powers of two, whose rounding interval is lopsided).
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { columnJsonBytes } from "../../core/ascii-numbers.js";
import { MAX_SHORTEST_BYTES, writeShortestDecimal } from "../../core/shortest-decimal.js";

const textOf = (value: number): string => {
  const out = new Uint8Array(MAX_SHORTEST_BYTES + 8);
  const end = writeShortestDecimal(out, 4, value);
  expect(end - 4).toBeLessThanOrEqual(MAX_SHORTEST_BYTES);
  return Buffer.from(out.subarray(4, end)).toString("latin1");
};

/** The double whose bit pattern is `bits`. */
const fromBits = (bits: bigint): number => new Float64Array(new BigUint64Array([bits]).buffer)[0];
const bitsOf = (value: number): bigint => new BigUint64Array(new Float64Array([value]).buffer)[0];
/** The double `steps` representable values away from `value` (same sign). */
const neighbour = (value: number, steps: number): number => fromBits(bitsOf(value) + BigInt(steps));

const anyDouble = fc.double();
/** Doubles with every mantissa pattern at exponents where the writer does its own work (1e-6 to 1e17). */
const fastRange = fc.tuple(fc.bigInt({ min: 0n, max: (1n << 52n) - 1n }), fc.integer({ min: 1003, max: 1079 }), fc.boolean()).map(([mantissa, exponent, negative]) =>
  fromBits((negative ? 1n << 63n : 0n) | (BigInt(exponent) << 52n) | mantissa),
);
/** Decimals with 1 to 16 significant digits, as logs and hand-typed inputs hold them. */
const shortDecimal = fc.tuple(fc.integer({ min: 1, max: 16 }), fc.double({ min: 0, max: 1, noNaN: true }), fc.integer({ min: -8, max: 18 })).map(
  ([digits, fraction, exponent]) => Math.floor(fraction * 10 ** digits) * 10 ** (exponent - digits),
);

describe("writeShortestDecimal (ECMA-262 Number::toString, radix 10)", () => {
  it("equals String(value) for any double, including NaN, infinities, zeros and subnormals", () => {
    fc.assert(fc.property(anyDouble, (value) => {
      expect(textOf(value)).toBe(String(value));
    }), { numRuns: 20_000 });
  });

  it("equals String(value) for every mantissa between 1e-6 and 1e17, either sign", () => {
    fc.assert(fc.property(fastRange, (value) => {
      expect(textOf(value)).toBe(String(value));
    }), { numRuns: 50_000 });
  });

  it("equals String(value) for short decimals and their neighbours one and two values away", () => {
    fc.assert(
      fc.property(shortDecimal, fc.integer({ min: -2, max: 2 }), (value, steps) => {
        const near = value === 0 ? value : neighbour(value, steps);
        expect(textOf(near)).toBe(String(near));
      }),
      { numRuns: 30_000 },
    );
  });

  it("equals String(value) for products and quotients as the kernel makes them (moduli in Pa and GPa, ratios)", () => {
    fc.assert(
      fc.property(fc.double({ min: 1200, max: 7000, noNaN: true }), fc.double({ min: 1.5, max: 3.1, noNaN: true }), (velocity, density) => {
        for (const value of [density * 1000 * velocity * velocity, (density * velocity * velocity) / 1e6, velocity / (velocity / 1.9), 0.5 / density]) {
          expect(textOf(value)).toBe(String(value));
        }
      }),
      { numRuns: 20_000 },
    );
  });

  it("picks the even decimal when the double lies exactly halfway between two 17-digit decimals", () => {
    // 2^-2 steps above 2^50 are exact quarter values: 1145365967924779.25 is halfway between …779.2 and …779.3.
    for (const value of [1145365967924779.25, 1145365967924779.75, -4165999867967.03125, 10198938988799.0625, 2 ** 52 + 0.5]) {
      expect(textOf(value)).toBe(String(value));
    }
  });

  it("equals String(value) at and beside every power of ten from 1e-8 to 1e22, and at powers of two", () => {
    for (let exponent = -8; exponent <= 22; exponent++) {
      const power = Number(`1e${exponent}`);
      for (let steps = -40; steps <= 40; steps++) {
        const value = neighbour(power, steps);
        expect(textOf(value)).toBe(String(value));
      }
    }
    for (let exponent = -30; exponent <= 70; exponent++) {
      for (const value of [2 ** exponent, neighbour(2 ** exponent, 1), neighbour(2 ** exponent, -1)]) expect(textOf(value)).toBe(String(value));
    }
  });
});

describe("columnJsonBytes (a column as JSON.stringify writes its values)", () => {
  it("gives the bytes of JSON.stringify of the values: numbers as String writes them, null for NaN and ±Infinity (ECMA-262 SerializeJSONProperty)", () => {
    const value = fc.oneof(anyDouble, fastRange, shortDecimal, fc.constantFrom(NaN, Infinity, -Infinity, -0, 0));
    fc.assert(
      fc.property(fc.array(value, { maxLength: 60 }), (values) => {
        expect(Buffer.from(columnJsonBytes(Float64Array.from(values))).toString("latin1")).toBe(JSON.stringify(values));
      }),
      { numRuns: 3000 },
    );
  });
});
