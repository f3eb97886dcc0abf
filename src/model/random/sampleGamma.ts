import type { RandomSource } from "./pcg32.js";
import { sampleStandardNormal } from "./sampleStandardNormal.js";

/**
 * One Gamma(shape, rate) variate (mean shape / rate, variance shape / rate²) by the
 * Marsaglia–Tsang squeeze method (G. Marsaglia and W. W. Tsang, "A Simple Method for Generating
 * Gamma Variables", ACM TOMS 26(3), 2000). For shape < 1 it uses their boost:
 * Gamma(shape) = Gamma(shape + 1) × U^(1/shape). Expected cost: about 1.05 normals per variate.
 */
export function sampleGamma(random: RandomSource, shape: number, rate: number): number {
  if (!(shape > 0) || !(rate > 0) || !Number.isFinite(shape) || !Number.isFinite(rate)) {
    throw new RangeError(`gamma needs shape > 0 and rate > 0, got shape ${shape}, rate ${rate}`);
  }
  if (shape < 1) {
    const boost = Math.pow(1 - random.nextUnitFloat(), 1 / shape);
    return sampleGamma(random, shape + 1, rate) * boost;
  }
  const d = shape - 1 / 3;
  const c = 1 / Math.sqrt(9 * d);
  for (;;) {
    let x: number;
    let v: number;
    do {
      x = sampleStandardNormal(random);
      v = 1 + c * x;
    } while (v <= 0);
    v = v * v * v;
    const u = 1 - random.nextUnitFloat();
    const xSquared = x * x;
    if (u < 1 - 0.0331 * xSquared * xSquared) return (d * v) / rate;
    if (Math.log(u) < 0.5 * xSquared + d * (1 - v + Math.log(v))) return (d * v) / rate;
  }
}
