import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { isInputIssues } from "../../../core/input-issues.js";
import { findCorrelation } from "../../../core/correlations/catalogue.js";

/** Pascals in one Mpsi (NIST SP 811, B.8: 1 psi = 6 894.757 293 168 Pa). */
const PA_PER_MPSI = 6894.757293168362e6;
const rickman = () => findCorrelation("brittleness.rickman2008")!;
const rock = (pairs: [number, number][]) => ({
  staticYoungsModulusPascals: Float64Array.from(pairs, ([mpsi]) => mpsi * PA_PER_MPSI),
  poissonsRatio: Float64Array.from(pairs, ([, nu]) => nu),
});

describe("brittleness.rickman2008", () => {
  it("BI = 50·((E − 1)/(8 − 1) + (0.40 − ν)/(0.40 − 0.15)) in % with E in Mpsi (Rickman et al. 2008, SPE 115258, default bounds from memory)", () => {
    const { values } = rickman().evaluate(rock([[4.5, 0.275], [3, 0.3]]));
    // 50·(3.5/7 + 0.125/0.25) = 50·(0.5 + 0.5) = 50 %
    expect(values[0]).toBeCloseTo(50, 10);
    // 50·(2/7 + 0.1/0.25) = 50·(0.285714 + 0.4) = 34.2857 %
    expect(values[1]).toBeCloseTo(34.2857, 4);
  });

  it("is 100 % for the stiffest, lowest-ratio rock and 0 % for the softest, highest-ratio rock (Rickman et al. 2008 normalisation)", () => {
    const { values } = rickman().evaluate(rock([[8, 0.15], [1, 0.4]]));
    expect(values[0]).toBeCloseTo(100, 10);
    expect(values[1]).toBeCloseTo(0, 10);
  });

  it("rises with E and falls with ν for random rocks inside the bounds (Rickman et al. 2008)", () => {
    fc.assert(
      fc.property(
        fc.double({ min: 1, max: 7.9, noNaN: true }),
        fc.double({ min: 0.15, max: 0.39, noNaN: true }),
        (mpsi, nu) => {
          const [base, stiffer, higherRatio] = rickman().evaluate(rock([[mpsi, nu], [mpsi + 0.1, nu], [mpsi, nu + 0.01]])).values;
          return stiffer > base && higherRatio < base;
        },
      ),
    );
  });

  it("flags E just outside 1–8 Mpsi and ν just outside 0.15–0.40, not at the bounds, and keeps the unclipped value (Rickman et al. 2008 default bounds)", () => {
    const { values, outsideCalibration } = rickman().evaluate(
      rock([[0.999, 0.3], [1, 0.3], [8, 0.3], [8.001, 0.3], [4, 0.1499], [4, 0.15], [4, 0.4], [4, 0.4001]]),
    );
    expect([...outsideCalibration]).toEqual([1, 0, 0, 1, 1, 0, 0, 1]);
    // 50·(7.001/7 + 0.1/0.25) = 50·(1.000143 + 0.4) = 70.0071 %: the E term exceeds 1 and is not clipped
    expect(values[3]).toBeCloseTo(50 * (7.001 / 7 + 0.1 / 0.25), 10);
  });

  it("uses bounds given as options for the value and for the flags (Rickman et al. 2008: bounds are per play)", () => {
    const options = { e_min_mpsi: 2, e_max_mpsi: 10, nu_min: 0.1, nu_max: 0.35 };
    const { values, outsideCalibration } = rickman().evaluate(rock([[6, 0.225], [9, 0.2]]), options);
    // 50·(4/8 + 0.125/0.25) = 50 %
    expect(values[0]).toBeCloseTo(50, 10);
    // 9 Mpsi lies inside 2–10 though outside the default 1–8
    expect([...outsideCalibration]).toEqual([0, 0]);
  });

  it("rejects bounds whose minimum is not below the maximum, and unknown or non-finite options", () => {
    const inputs = rock([[4, 0.25]]);
    const issuesOf = (options: Record<string, number>) => {
      try {
        rickman().evaluate(inputs, options);
      } catch (error) {
        if (isInputIssues(error)) return error.issues.map((issue) => issue.field);
        throw error;
      }
      return [];
    };
    expect(issuesOf({ e_min_mpsi: 8 })).toEqual(["e_min_mpsi"]);
    expect(issuesOf({ nu_min: 0.5 })).toEqual(["nu_min"]);
    expect(issuesOf({ e_min_mpsi: 3, e_max_mpsi: 3 })).toEqual(["e_max_mpsi"]);
    expect(issuesOf({ nu_minimum: 0.1 })).toEqual(["nu_minimum"]);
    expect(issuesOf({ e_max_mpsi: Number.POSITIVE_INFINITY })).toEqual(["e_max_mpsi"]);
  });
});
