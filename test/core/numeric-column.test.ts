import { describe, expect, it } from "vitest";
import { InputIssues, requireEqualLengths, toFloat64Column } from "../../core/index.js";

describe("numeric columns", () => {
  it("toFloat64Column keeps numbers, turns null into NaN, and names the index of anything else", () => {
    expect(Array.from(toFloat64Column([1.5, null, -999.25], "vp"))).toEqual([1.5, NaN, -999.25]);
    try {
      toFloat64Column([1, "2", {}, [3], true], "rho");
      expect.unreachable();
    } catch (error) {
      expect(error).toBeInstanceOf(InputIssues);
      expect((error as InputIssues).issues.map((i) => i.index)).toEqual([1, 2, 3, 4]);
      expect((error as InputIssues).issues[0]).toMatchObject({ field: "rho", message: 'expected a number or null, got the string "2"' });
    }
  });

  it("toFloat64Column lists at most 20 issues", () => {
    const error = (() => {
      try {
        toFloat64Column(Array(100).fill("x"), "vs");
      } catch (e) {
        return e as InputIssues;
      }
    })();
    expect(error?.issues).toHaveLength(20);
  });

  it("requireEqualLengths returns the common length and names every column that differs", () => {
    expect(requireEqualLengths({ vp: [1, 2], vs: [1, 2], depth: undefined })).toBe(2);
    expect(() => requireEqualLengths({ vp: [1, 2], vs: [1], rho: [1, 2, 3] })).toThrow(/vs: has 1 values but vp has 2.*rho: has 3/);
  });
});
