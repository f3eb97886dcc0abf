/** The longest 1, 2 or 5 × 10^n km length not above `maxKm`. */
export function scaleBarKm(maxKm: number): number {
  const magnitude = 10 ** Math.floor(Math.log10(maxKm));
  const step = [5, 2, 1].find((factor) => factor * magnitude <= maxKm) ?? 1;
  return Number((step * magnitude).toPrecision(6));
}
