/**
 * Single-payment present-worth factor (P/F, i, n) = (1 + i)^-n: what one unit received
 * n years from now is worth today at discount rate i (a fraction).
 * Reference: any engineering-economics interest table, e.g. Newnan, Engineering Economic Analysis.
 */
export function singlePaymentPresentWorth(rate: number, years: number): number {
  if (!(rate > -1)) throw new RangeError(`discount rate must be above -1, got ${rate}`);
  return Math.pow(1 + rate, -years);
}
