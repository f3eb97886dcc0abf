/**
 * Round axis tick values covering [min, max]: steps of 1, 2 or 5 × 10^n chosen so that about
 * `count` ticks result ("nice numbers for graph labels", Heckbert, Graphics Gems, 1990). Ticks are
 * rounded to 12 significant digits so that 3 × 0.2 reads 0.6, not 0.6000000000000001.
 */
export function niceTicks(min: number, max: number, count = 5): number[] {
  if (!(max > min)) return [min];
  const rough = (max - min) / Math.max(1, count);
  const magnitude = 10 ** Math.floor(Math.log10(rough));
  const fraction = rough / magnitude;
  const step = (fraction <= 1 ? 1 : fraction <= 2 ? 2 : fraction <= 5 ? 5 : 10) * magnitude;
  const ticks: number[] = [];
  for (let tick = Math.ceil(min / step) * step; tick <= max + step * 1e-9; tick += step) ticks.push(Number(tick.toPrecision(12)));
  return ticks;
}
