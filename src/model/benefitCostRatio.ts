/**
 * Benefit PV ÷ lifecycle cost PV. At zero cost the ratio is not a number a reader can use:
 * Infinity when something is still gained (JSON null, "∞" in tables), NaN when nothing is
 * (JSON null, blank in CSV, "–" in tables), never a 0 that reads as "worthless".
 */
export function benefitCostRatio(benefitPV: number, lifecycleCostPV: number): number {
  if (lifecycleCostPV > 0) return benefitPV / lifecycleCostPV;
  return benefitPV > 0 ? Infinity : NaN;
}

/** Orders B/C ratios from highest to lowest, with undefined (NaN) ratios last. */
export function byBcRatioDescending(x: number, y: number): number {
  const a = Number.isNaN(x) ? -Infinity : x;
  const b = Number.isNaN(y) ? -Infinity : y;
  return a === b ? 0 : b > a ? 1 : -1;
}
