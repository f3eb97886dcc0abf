import { singlePaymentPresentWorth } from "./singlePaymentPresentWorth.js";

/**
 * Uniform-series present-worth factor (P/A, i, n) = ((1 + i)^n - 1) / (i (1 + i)^n):
 * what one unit received at the end of each of n years is worth today at rate i (a fraction).
 * At i = 0 it is n. Non-integer n is allowed (a partial final year is discounted continuously in n).
 * Reference: any engineering-economics interest table, e.g. Newnan, Engineering Economic Analysis.
 */
export function uniformSeriesPresentWorth(rate: number, years: number): number {
  if (!(rate > -1)) throw new RangeError(`discount rate must be above -1, got ${rate}`);
  if (years <= 0) return 0;
  if (Math.abs(rate) < 1e-12) return years;
  return (1 - singlePaymentPresentWorth(rate, years)) / rate;
}
