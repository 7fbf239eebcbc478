import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { findCorrelation } from "../../../core/correlations/catalogue.js";
import { fillGaps } from "../../../core/correlations/fill-gaps.js";
import { isInputIssues } from "../../../core/input-issues.js";

const col = (...values: number[]) => Float64Array.from(values);

describe("fillGaps", () => {
  it("in nulls mode fills only the NaN samples of the target and counts them", () => {
    const result = fillGaps(col(1, NaN, 3, NaN), col(10, 20, 30, 40), "nulls");
    expect([...result.values]).toEqual([1, 20, 3, 40]);
    expect([...result.filled]).toEqual([0, 1, 0, 1]);
    expect(result.count).toBe(2);
  });

  it("in all mode replaces the whole curve, measured samples included", () => {
    const result = fillGaps(col(1, NaN, 3), col(10, 20, 30), "all");
    expect([...result.values]).toEqual([10, 20, 30]);
    expect([...result.filled]).toEqual([1, 1, 1]);
    expect(result.count).toBe(3);
  });

  it("does not count a sample as filled where the prediction is NaN; in all mode that sample becomes NaN", () => {
    const nulls = fillGaps(col(NaN, 2), col(NaN, NaN), "nulls");
    expect([...nulls.values]).toEqual([NaN, 2]);
    expect(nulls.count).toBe(0);
    const all = fillGaps(col(1, 2), col(NaN, 5), "all");
    expect([...all.values]).toEqual([NaN, 5]);
    expect([...all.filled]).toEqual([0, 1]);
    expect(all.count).toBe(1);
  });

  it("never changes a measured sample in nulls mode, and count equals the filled samples, for random curves", () => {
    const sample = fc.oneof(fc.constant(NaN), fc.double({ min: -1e6, max: 1e6, noNaN: true }));
    fc.assert(
      fc.property(fc.array(fc.tuple(sample, sample), { maxLength: 50 }), (pairs) => {
        const target = Float64Array.from(pairs, ([t]) => t);
        const predicted = Float64Array.from(pairs, ([, p]) => p);
        const { values, filled, count } = fillGaps(target, predicted, "nulls");
        return (
          pairs.every(([t, p], i) => (Number.isNaN(t) ? Object.is(values[i], p) : values[i] === t)) &&
          count === filled.reduce((sum, bit) => sum + bit, 0) &&
          filled.every((bit, i) => bit === (Number.isNaN(target[i]) && !Number.isNaN(predicted[i]) ? 1 : 0))
        );
      }),
    );
  });

  it("fills a Vs curve from the mudrock line where the shear log is absent (Castagna et al. 1985)", () => {
    const vp = col(3000, 3000, 4500);
    const vs = col(1500, NaN, NaN);
    const predicted = findCorrelation("vs.castagna1985")!.evaluate({ vpMetresPerSecond: vp }).values;
    const { values, count } = fillGaps(vs, predicted, "nulls");
    expect(values[0]).toBe(1500);
    // (3 − 1.36)/1.16 = 1.413793 km/s; (4.5 − 1.36)/1.16 = 2.706897 km/s
    expect(values[1]).toBeCloseTo(1413.793, 2);
    expect(values[2]).toBeCloseTo(2706.897, 2);
    expect(count).toBe(2);
  });

  it("rejects curves of different lengths", () => {
    let fields: string[] = [];
    try {
      fillGaps(col(1, 2), col(1), "nulls");
    } catch (error) {
      if (isInputIssues(error)) fields = error.issues.map((issue) => issue.field);
    }
    expect(fields).toEqual(["predicted"]);
  });
});
