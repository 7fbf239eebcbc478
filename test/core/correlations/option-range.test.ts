import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { CORRELATIONS, findCorrelation } from "../../../core/correlations/catalogue.js";
import type { CorrelationOptions } from "../../../core/correlations/correlation.js";
import { defineCorrelation } from "../../../core/correlations/define-correlation.js";
import { describeCorrelation } from "../../../core/correlations/describe-correlation.js";
import { isInOptionRange, MIN_RELATIVE_SPAN, POSITIVE_MODULUS } from "../../../core/correlations/option-range.js";
import { isInputIssues, type InputIssue } from "../../../core/input-issues.js";

/** Pascals in one Mpsi (NIST SP 811, B.8: 1 psi = 6 894.757 293 168 Pa). */
const PA_PER_MPSI = 6894.757293168362e6;
const rickman = () => findCorrelation("brittleness.rickman2008")!;
/** A shale of our own: static E 4 Mpsi, ν 0.25 (inside Rickman et al. 2008's default bounds). */
const SHALE = { staticYoungsModulusPascals: Float64Array.of(4 * PA_PER_MPSI), poissonsRatio: Float64Array.of(0.25) };

const issuesOf = (options: CorrelationOptions): InputIssue[] => {
  try {
    rickman().evaluate(SHALE, options);
  } catch (error) {
    if (isInputIssues(error)) return error.issues;
    throw error;
  }
  return [];
};
const fieldsOf = (options: CorrelationOptions) => issuesOf(options).map((issue) => issue.field);

describe("accepted ranges of brittleness.rickman2008's options (Rickman et al. 2008, SPE 115258: bounds per play)", () => {
  it("refuses Young's modulus bounds that are not positive and finite, saying the accepted range (the probe's ±1.7e308 overflowed Emax − Emin)", () => {
    const issues = issuesOf({ e_min_mpsi: -1.7e308, e_max_mpsi: 1.7e308 });
    expect(issues).toEqual([{ field: "e_min_mpsi", message: "must be a finite number above 0 Mpsi; got -1.7e+308" }]);
    expect(fieldsOf({ e_min_mpsi: 0 })).toEqual(["e_min_mpsi"]);
    expect(fieldsOf({ e_max_mpsi: Number.POSITIVE_INFINITY })).toEqual(["e_max_mpsi"]);
    expect(fieldsOf({ e_max_mpsi: Number.NaN })).toEqual(["e_max_mpsi"]);
  });

  it("refuses Poisson's ratio bounds outside (−1, 0.5], what isotropic elasticity allows (Landau & Lifshitz, Theory of Elasticity §5, from memory)", () => {
    const issues = issuesOf({ nu_min: -5, nu_max: 7 });
    expect(issues).toEqual([
      { field: "nu_min", message: "must be a number above -1 and at most 0.5; got -5" },
      { field: "nu_max", message: "must be a number above -1 and at most 0.5; got 7" },
    ]);
    expect(fieldsOf({ nu_min: -1 })).toEqual(["nu_min"]);
    expect(fieldsOf({ nu_max: 0.5000001 })).toEqual(["nu_max"]);
    // ν = 0.5 (G = 0) and just above −1 are inside.
    expect(fieldsOf({ nu_min: -0.999, nu_max: 0.5 })).toEqual([]);
  });

  it("refuses a span too small for the index: e_max_mpsi 1.0000000000000002 over the default e_min_mpsi 1 gave BI ≈ −9e15 %", () => {
    const issues = issuesOf({ e_max_mpsi: 1.0000000000000002 });
    expect(issues).toEqual([
      {
        field: "e_max_mpsi",
        message: "must exceed e_min_mpsi (1, its default) by at least 0.008 Mpsi (0.1 % of the largest in size of the two bounds and their defaults); got 1.0000000000000002",
      },
    ]);
  });

  it("checks each pair after defaults and names the bound the request set", () => {
    // Only the lower bound given, above the default upper one: it is the one to fix.
    expect(issuesOf({ e_min_mpsi: 8 })).toEqual([
      { field: "e_min_mpsi", message: "must be below e_max_mpsi (8, its default) by at least 0.008 Mpsi (0.1 % of the largest in size of the two bounds and their defaults); got 8" },
    ]);
    expect(fieldsOf({ nu_max: 0.15 })).toEqual(["nu_max"]);
    expect(fieldsOf({ nu_min: 0.3, nu_max: 0.2 })).toEqual(["nu_max"]);
    // Both pairs wrong: both named.
    expect(fieldsOf({ e_min_mpsi: 9, nu_min: 0.45 })).toEqual(["e_min_mpsi", "nu_min"]);
  });

  it("accepts bounds whose span is just at the margin, and refuses them just below it", () => {
    expect(fieldsOf({ e_min_mpsi: 999, e_max_mpsi: 1000 })).toEqual([]); // span 1 = 0.1 % of 1000
    expect(fieldsOf({ e_min_mpsi: 999.01, e_max_mpsi: 1000 })).toEqual(["e_max_mpsi"]);
    // Near zero the defaults set the scale: ν bounds 0 and 1e-300 are a span of nothing against ν ≈ 0.4.
    expect(fieldsOf({ nu_min: 0, nu_max: 0.0004 })).toEqual([]); // 0.1 % of the default 0.4
    expect(fieldsOf({ nu_min: 0, nu_max: 1e-300 })).toEqual(["nu_max"]);
    expect(fieldsOf({ e_min_mpsi: 1e-310, e_max_mpsi: 1e-300 })).toEqual(["e_max_mpsi"]);
  });

  it("gives a finite index for every accepted set of bounds and a finite sample, and refuses every other set with the option named", () => {
    const bound = fc.oneof(
      fc.double({ noNaN: false }),
      fc.double({ min: -1, max: 20, noNaN: true }),
      fc.double({ min: -1e-300, max: 1e-300, noNaN: true }),
      fc.constantFrom(-1, 0, 0.5, 1, 8, 1.7e308, -1.7e308, 1.0000000000000002, 5e-324),
    );
    fc.assert(
      fc.property(bound, bound, bound, bound, (eMin, eMax, nuMin, nuMax) => {
        const options = { e_min_mpsi: eMin, e_max_mpsi: eMax, nu_min: nuMin, nu_max: nuMax };
        const issues = issuesOf(options);
        const inRange = isInOptionRange(eMin, POSITIVE_MODULUS) && isInOptionRange(eMax, POSITIVE_MODULUS) && nuMin > -1 && nuMin <= 0.5 && nuMax > -1 && nuMax <= 0.5;
        if (issues.length === 0) {
          expect(inRange).toBe(true);
          expect(eMax - eMin).toBeGreaterThanOrEqual(MIN_RELATIVE_SPAN * Math.max(eMax, 8));
          expect(nuMax - nuMin).toBeGreaterThanOrEqual(MIN_RELATIVE_SPAN * 0.4);
          expect(Number.isFinite(rickman().evaluate(SHALE, options).values[0])).toBe(true);
        } else {
          for (const issue of issues) expect(Object.keys(options)).toContain(issue.field);
        }
      }),
    );
  });
});

describe("option declarations", () => {
  it("every catalogue option declares an accepted range that holds its default (checked when the entry is defined)", () => {
    for (const correlation of CORRELATIONS) {
      for (const option of correlation.options) expect(isInOptionRange(option.defaultValue, option.accepted), `${correlation.id}.${option.name}`).toBe(true);
    }
  });

  it("an entry whose default lies outside its range, or whose defaults break a span, is refused when defined", () => {
    const spec = (options: Parameters<typeof defineCorrelation>[0]["options"]) => () =>
      defineCorrelation({
        ...rickman(),
        options,
        compute: () => 0,
      });
    const option = { unit: "Mpsi", description: "test", accepted: POSITIVE_MODULUS };
    expect(spec([{ ...option, name: "a", defaultValue: -1 }])).toThrow(/default lies outside/);
    expect(spec([{ ...option, name: "a", defaultValue: 1, below: "b" }])).toThrow(/unknown option b/);
    expect(spec([{ ...option, name: "a", defaultValue: 2, below: "b" }, { ...option, name: "b", defaultValue: 2 }])).toThrow();
  });

  it("describes each option's range (null for an open side) and pairing for the catalogue, surviving a JSON round trip", () => {
    const [eMin, eMax, nuMin, nuMax] = describeCorrelation(rickman()).options;
    expect(eMin).toMatchObject({ range: { min: 0, minIncluded: false, max: null, maxIncluded: false }, below: "e_max_mpsi" });
    expect(eMin.accepts).toBe("a finite number above 0 Mpsi, below e_max_mpsi by at least 0.1 % of the largest in size of the two bounds and their defaults");
    expect(eMax).toMatchObject({ below: null, accepts: expect.stringContaining("above e_min_mpsi by at least 0.1 %") });
    expect(nuMin.range).toEqual({ min: -1, minIncluded: false, max: 0.5, maxIncluded: true });
    expect(nuMax.accepts).toBe("a number above -1 and at most 0.5, above nu_min by at least 0.1 % of the largest in size of the two bounds and their defaults");
    expect(JSON.parse(JSON.stringify(eMin))).toEqual(eMin);
  });
});
