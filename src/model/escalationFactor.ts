/**
 * Factor that brings an amount from one price year to another at a constant annual rate:
 * (F/P, r, n) = (1 + r)^n with n = toYear − fromYear (negative n deflates). The single-payment
 * compound-amount factor of engineering economics (e.g. Newnan, Engineering Economic Analysis,
 * interest tables).
 * @example 3% a year from 2016 to 2026: (1.03)^10 = 1.3439.
 */
export function escalationFactorFromRate(annualRate: number, fromYear: number, toYear: number): number {
  if (!(annualRate > -1)) throw new RangeError(`escalation rate must be above -1, got ${annualRate}`);
  return Math.pow(1 + annualRate, toYear - fromYear);
}

/**
 * Factor that brings an amount between price years by a price index: index in the target year ÷
 * index in the base year (common practice, e.g. a consumer price or employment cost index).
 */
export function escalationFactorFromIndex(baseIndex: number, targetIndex: number): number {
  if (!(baseIndex > 0 && targetIndex > 0)) throw new RangeError(`price indices must be positive, got ${baseIndex} and ${targetIndex}`);
  return targetIndex / baseIndex;
}
