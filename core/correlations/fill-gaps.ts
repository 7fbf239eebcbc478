import { requireEqualLengths } from "../numeric-column.js";

/** `nulls` fills only the absent (NaN) samples of the target; `all` replaces the whole curve by the prediction. */
export type FillMode = "nulls" | "all";

export interface FilledCurve {
  values: Float64Array;
  /** 1 where the value comes from the prediction. */
  filled: Uint8Array;
  /** Number of samples with filled = 1. */
  count: number;
}

/**
 * Fills a curve from a predicted one of the same length (for example Vs from vs.castagna1985).
 * A sample counts as filled only when the prediction there is a number; in `all` mode a sample whose
 * prediction is NaN becomes NaN, since the measured curve is given up entirely.
 */
export const fillGaps = (target: Float64Array, predicted: Float64Array, mode: FillMode): FilledCurve => {
  requireEqualLengths({ target, predicted });
  const values = new Float64Array(target.length);
  const filled = new Uint8Array(target.length);
  let count = 0;
  for (let i = 0; i < target.length; i++) {
    const replace = mode === "all" || Number.isNaN(target[i]);
    values[i] = replace ? predicted[i] : target[i];
    if (replace && !Number.isNaN(predicted[i])) {
      filled[i] = 1;
      count++;
    }
  }
  return { values, filled, count };
};
