import { buildCrashMatrix } from "./crashMatrix.js";
import type { CrashMatrix } from "./types.js";

/** Expected crashes per year from the observed counts alone: count / years in the window. */
export function observedCrashesPerYear(observed: CrashMatrix, windowYears: number): CrashMatrix {
  if (!(windowYears > 0)) throw new RangeError(`crash window must cover at least one year, got ${windowYears}`);
  return buildCrashMatrix((type, severity) => observed[type][severity] / windowYears);
}
