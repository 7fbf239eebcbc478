/**
 * The `percent`-th percentile (0–100) of values sorted ascending, by linear interpolation between
 * the closest ranks (Hyndman & Fan 1996, definition 7; the default of numpy.percentile and R's quantile).
 * NaN when there are no values.
 */
export const percentileOfSorted = (sorted: Float64Array, percent: number): number => {
  const n = sorted.length;
  if (n === 0) return NaN;
  const position = ((n - 1) * percent) / 100;
  const below = Math.floor(position);
  if (below >= n - 1) return sorted[n - 1];
  return sorted[below] + (position - below) * (sorted[below + 1] - sorted[below]);
};
