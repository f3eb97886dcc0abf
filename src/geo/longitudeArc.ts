import { positiveModulo } from "./positiveModulo.js";
import { wrapLongitude } from "./wrapLongitude.js";

/**
 * The smallest arc of longitude holding every element: its west end (degrees in [0, 360)) and
 * width, from the largest gap between the elements' own spans; width 360 when they circle the globe.
 */
export function longitudeArc(raw: readonly number[]): { west: number; width: number } {
  const spans: [number, number][] = [];
  for (let i = 0; i < raw.length; i += 4) {
    const dLon = wrapLongitude(raw[i + 2]! - raw[i]!);
    spans.push([positiveModulo(Math.min(raw[i]!, raw[i]! + dLon), 360) % 360, Math.abs(dLon)]);
  }
  spans.sort((a, b) => a[0] - b[0]);
  const first = spans[0]![0];
  let covered = first + spans[0]![1];
  const gaps: [number, number][] = [];
  for (let i = 1; i < spans.length; i++) {
    const [start, width] = spans[i]!;
    if (start > covered) gaps.push([covered, start]);
    covered = Math.max(covered, start + width);
  }
  gaps.push([covered, first + 360]);
  // A span that runs past 360° covers the start of the circle again: only the part of a gap
  // beyond that is open.
  let best: { west: number; width: number } = { west: first, width: 360 };
  let widest = 0;
  for (const [from, to] of gaps) {
    const open = to - Math.max(from, covered - 360);
    if (open > widest) {
      widest = open;
      best = { west: to % 360, width: 360 - open };
    }
  }
  return best;
}
