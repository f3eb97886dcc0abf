import { uniformSeriesPresentWorth } from "./uniformSeriesPresentWorth.js";

/**
 * Present worth, at rate i, of amounts G^t received at the end of each year t = start+1 … end:
 * Σ (G / (1 + i))^t. With G = 1 it is (P/A, i, end) − (P/A, i, start); with i = 0 it is the
 * plain sum of the growing amounts. The geometric-gradient series of engineering economics
 * (e.g. Newnan, Engineering Economic Analysis, "geometric gradient"), counted from year 0 = today.
 * Years are whole numbers of years.
 */
export function growingSeriesPresentWorth(rate: number, growth: number, start: number, end: number): number {
  if (!(rate > -1)) throw new RangeError(`discount rate must be above -1, got ${rate}`);
  if (!(growth > 0)) throw new RangeError(`growth factor must be positive, got ${growth}`);
  if (end <= start) return 0;
  if (growth === 1) return uniformSeriesPresentWorth(rate, end) - uniformSeriesPresentWorth(rate, start);
  const q = growth / (1 + rate);
  if (Math.abs(q - 1) < 1e-12) return end - start;
  return (Math.pow(q, start + 1) * (1 - Math.pow(q, end - start))) / (1 - q);
}
