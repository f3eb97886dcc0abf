/**
 * The p-quantile of already sorted values by linear interpolation between order statistics:
 * Hyndman and Fan (1996) definition 7, h = (n − 1) p, the default of R's `quantile` and NumPy's
 * `percentile`. Cost O(1). Example: quantileSorted([1, 2, 3, 4], 0.5) === 2.5.
 */
export function quantileSorted(sorted: readonly number[], p: number): number {
  if (sorted.length === 0) throw new RangeError("quantile of no values");
  if (!(p >= 0 && p <= 1)) throw new RangeError(`quantile level must be within [0, 1], got ${p}`);
  const h = (sorted.length - 1) * p;
  const below = Math.floor(h);
  const above = Math.min(below + 1, sorted.length - 1);
  return sorted[below]! + (h - below) * (sorted[above]! - sorted[below]!);
}
