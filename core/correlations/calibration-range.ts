/** Range of a quantity in a source's data set, bounds included, in the unit stated beside it; ±Infinity leaves a side open. */
export interface CalibrationRange {
  readonly min: number;
  readonly max: number;
}

/**
 * Relative slack at each bound, so that a value given exactly at a bound in another unit (30 GPa as Mpsi,
 * a slowness as a velocity) is not flagged for the last-digit rounding of the conversion.
 */
export const BOUND_TOLERANCE = 1e-9;

/** True when `value` lies outside `range`; a bound itself is inside, and NaN or a missing range is never outside. */
export const isOutsideRange = (value: number, range: CalibrationRange | undefined): boolean =>
  range !== undefined &&
  (value < range.min - BOUND_TOLERANCE * Math.abs(range.min) || value > range.max + BOUND_TOLERANCE * Math.abs(range.max));
