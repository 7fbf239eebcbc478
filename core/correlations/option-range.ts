import type { InputIssue } from "../input-issues.js";

/** Values a correlation option accepts, each bound included or not; ±Infinity leaves a side open (the value stays finite). */
export interface OptionRange {
  readonly min: number;
  readonly minIncluded: boolean;
  readonly max: number;
  readonly maxIncluded: boolean;
}

/** A Young's modulus bound: any finite stiffness above zero. */
export const POSITIVE_MODULUS: OptionRange = Object.freeze({ min: 0, minIncluded: false, max: Infinity, maxIncluded: false });

/**
 * A Poisson's ratio bound: −1 < ν ≤ 0.5, what isotropic elasticity allows. ν = (3K − 2G)/(2(3K + G)) with bulk
 * modulus K > 0 and shear modulus G ≥ 0 (positive strain energy); ν = 0.5 when G = 0 (a fluid), ν → −1 only as K → 0.
 * Landau & Lifshitz, Theory of Elasticity, §5 (from memory).
 */
export const ISOTROPIC_POISSONS_RATIO: OptionRange = Object.freeze({ min: -1, minIncluded: false, max: 0.5, maxIncluded: true });

/**
 * Least span between a lower and an upper bound option, relative to the largest in size of the two bounds and of
 * their defaults (the defaults stand for the values the index normalises, so bounds near zero still need a span
 * that matters against those values). Bounds closer than this agree in their first three significant digits,
 * finer than a log-derived modulus or ratio is known (logs carry three or four, common practice): an index
 * normalised between them would turn the last digit of an input into tens of percent, and a span of a few ulps
 * into an index of 1e15 % (or an overflow).
 */
export const MIN_RELATIVE_SPAN = 1e-3;

export const isInOptionRange = (value: number, range: OptionRange): boolean =>
  Number.isFinite(value) &&
  (range.minIncluded ? value >= range.min : value > range.min) &&
  (range.maxIncluded ? value <= range.max : value < range.max);

const withUnit = (value: number, unit: string): string => (unit === "1" ? String(value) : `${value} ${unit}`);

/** The range in words, e.g. `a finite number above 0 Mpsi`, `a number above -1 and at most 0.5`. */
export const optionRangeText = (range: OptionRange, unit: string): string => {
  const sides: string[] = [];
  if (Number.isFinite(range.min)) sides.push(`${range.minIncluded ? "at least" : "above"} ${withUnit(range.min, unit)}`);
  if (Number.isFinite(range.max)) sides.push(`${range.maxIncluded ? "at most" : "below"} ${withUnit(range.max, unit)}`);
  const open = !Number.isFinite(range.min) || !Number.isFinite(range.max);
  return [`a ${open ? "finite " : ""}number`, sides.join(" and ")].filter((part) => part !== "").join(" ");
};

const SPAN_RULE = `by at least ${MIN_RELATIVE_SPAN * 100} % of the largest in size of the two bounds and their defaults`;

/** What an option accepts, in words: its range and, for a bound of a pair, the span it keeps to the other. */
export const acceptsText = (
  option: { readonly name: string; readonly unit: string; readonly accepted: OptionRange; readonly below?: string },
  declared: readonly { readonly name: string; readonly below?: string }[],
): string => {
  const above = declared.find((other) => other.below === option.name)?.name;
  const pair = option.below !== undefined ? `, below ${option.below}` : above !== undefined ? `, above ${above}` : "";
  return `${optionRangeText(option.accepted, option.unit)}${pair === "" ? "" : `${pair} ${SPAN_RULE}`}`;
};

/** One bound of a pair as a request resolved it. */
export interface ResolvedBound {
  readonly name: string;
  readonly unit: string;
  readonly value: number;
  readonly defaultValue: number;
  /** Set by the request, not taken by default. */
  readonly given: boolean;
}

/** The least span `high.value − low.value` may have (see MIN_RELATIVE_SPAN). */
export const leastSpan = (low: ResolvedBound, high: ResolvedBound): number =>
  MIN_RELATIVE_SPAN * Math.max(Math.abs(low.value), Math.abs(high.value), Math.abs(low.defaultValue), Math.abs(high.defaultValue));

/**
 * The issue with a pair of bound options, if any: the difference must be finite and at least leastSpan. It names
 * the option the request set (the lower one when only it was given, else the upper one); a default says so.
 */
export const spanIssue = (low: ResolvedBound, high: ResolvedBound): InputIssue | undefined => {
  const span = high.value - low.value;
  const least = leastSpan(low, high);
  if (Number.isFinite(span) && span > 0 && span >= least) return undefined;
  const said = (bound: ResolvedBound) => `${bound.value}${bound.given ? "" : ", its default"}`;
  const by = `by at least ${withUnit(Number(least.toPrecision(6)), high.unit)} (${MIN_RELATIVE_SPAN * 100} % of the largest in size of the two bounds and their defaults)`;
  return low.given && !high.given
    ? { field: low.name, message: `must be below ${high.name} (${said(high)}) ${by}; got ${low.value}` }
    : { field: high.name, message: `must exceed ${low.name} (${said(low)}) ${by}; got ${high.value}` };
};
