/**
 * Round axis tick values covering [min, max]: steps of 1, 2 or 5 × 10^k chosen so that about
 * `count` ticks fall in the range (the usual "nice numbers" rule, as in Heckbert, Graphics Gems, 1990).
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!(max > min)) return [min];
  const rough = (max - min) / Math.max(1, count);
  const magnitude = 10 ** Math.floor(Math.log10(rough));
  const step = [1, 2, 5, 10].map((m) => m * magnitude).find((candidate) => candidate >= rough) ?? 10 * magnitude;
  const ticks: number[] = [];
  for (let tick = Math.ceil(min / step) * step; tick <= max + step * 1e-9; tick += step) ticks.push(Math.round(tick / step) * step);
  return ticks;
}
