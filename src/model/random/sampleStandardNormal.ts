import type { RandomSource } from "./pcg32.js";

/**
 * One standard normal variate by the Box–Muller transform (G. E. P. Box and M. E. Muller,
 * "A Note on the Generation of Random Normal Deviates", Ann. Math. Statist. 29(2), 1958):
 * z = sqrt(−2 ln u1) cos(2π u2). Uses two uniforms; the sine partner is dropped so every call
 * consumes the same amount of the stream and no state is carried between calls.
 */
export function sampleStandardNormal(random: RandomSource): number {
  const u1 = 1 - random.nextUnitFloat(); // (0, 1]: keeps ln finite
  const u2 = random.nextUnitFloat();
  return Math.sqrt(-2 * Math.log(u1)) * Math.cos(2 * Math.PI * u2);
}
