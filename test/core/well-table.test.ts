import { describe, expect, it } from "vitest";
import { absentAsNaN, USUAL_NULL_VALUE } from "../../core/well-table.js";

describe("absentAsNaN: a column's null values as NaN, as input screening reads absent values", () => {
  it("turns every value equal to the null value into NaN and leaves the others (-999.25, the usual LAS NULL; common practice)", () => {
    const depth = new Float64Array([1510, -999.25, 1511, -999.25, NaN]);
    expect(absentAsNaN(depth, USUAL_NULL_VALUE)).toEqual(new Float64Array([1510, NaN, 1511, NaN, NaN]));
    expect(depth[1]).toBe(-999.25);
  });

  it("returns the column itself when it holds no null value", () => {
    const depth = new Float64Array([1510, 1510.5]);
    expect(absentAsNaN(depth, USUAL_NULL_VALUE)).toBe(depth);
    expect(absentAsNaN(depth, NaN)).toBe(depth);
  });
});
