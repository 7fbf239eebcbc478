/**
 * depthOrderNotes: a depth column should keep to one direction without repeats (a log is sampled once per depth;
 * common practice, and the reason CWLS LAS 2.0 gives STEP a sign). The notes name the first place and count the rest.
 */
import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { depthOrderNotes } from "../../core/depth-order.js";

const column = (values: number[]) => Float64Array.from(values);

describe("depthOrderNotes", () => {
  it("says nothing of a column that keeps to one direction, either way, with gaps", () => {
    expect(depthOrderNotes(column([1500, 1500.1524, NaN, 1500.4572, 1500.6096]))).toEqual([]);
    expect(depthOrderNotes(column([1600, 1599.5, 1599]))).toEqual([]);
    expect(depthOrderNotes(column([]))).toEqual([]);
    expect(depthOrderNotes(column([NaN, NaN]))).toEqual([]);
  });

  it("names the first repeated depth and counts the others", () => {
    expect(depthOrderNotes(column([1500, 1500.5, 1500.5, 1501, 1501, 1501]))).toEqual([
      "the depth repeats: data row 3 has the depth of data row 2 (1500.5) (and 2 more places)",
    ]);
  });

  it("names a turn back (logs spliced with an overlap) and compares across an absent depth", () => {
    expect(depthOrderNotes(column([1500, 1501, 1502, NaN, 1501.5, 1502.5, 1503.5]))).toEqual([
      "the depth turns back at data row 5: from 1502 to 1501.5, against the direction the column started in",
    ]);
    expect(depthOrderNotes(column([1, 2, 3, 2, 1, 2]))).toEqual([
      "the depth turns back at data row 4: from 3 to 2, against the direction the column started in (and 1 more place)",
    ]);
  });

  it("is silent exactly when the present depths are strictly monotonic", () => {
    fc.assert(
      fc.property(fc.array(fc.oneof(fc.integer({ min: -50, max: 50 }), fc.constant(NaN)), { maxLength: 30 }), (values) => {
        const present = values.filter((value) => !Number.isNaN(value));
        const increasing = present.every((value, i) => i === 0 || value > present[i - 1]);
        const decreasing = present.every((value, i) => i === 0 || value < present[i - 1]);
        expect(depthOrderNotes(column(values)).length === 0).toBe(increasing || decreasing);
      }),
    );
  });
});
