import type { RandomSource } from "./pcg32.js";

/** Means above this are split into parts, so exp(−mean) stays far from underflow and the running sum stays exact enough. */
const LARGEST_PART = 30;

/**
 * One Poisson(mean) variate by inversion with sequential search (L. Devroye, "Non-Uniform Random
 * Variate Generation", 1986, ch. X.3): one uniform u, then the smallest k with F(k) ≥ u, walking
 * p(k) = p(k − 1) · mean / k up from p(0) = exp(−mean). A mean above 30 is split into equal parts
 * and their draws summed, exact since sums of independent Poisson variates are Poisson.
 * Expected cost about mean + 1 steps: meant for the crash counts of simulations, not huge means.
 */
export function samplePoisson(random: RandomSource, mean: number): number {
  if (!(mean >= 0) || !Number.isFinite(mean)) throw new RangeError(`Poisson needs a finite mean >= 0, got ${mean}`);
  const parts = Math.max(1, Math.ceil(mean / LARGEST_PART));
  const partMean = mean / parts;
  let total = 0;
  for (let part = 0; part < parts; part += 1) total += samplePoissonPart(random, partMean);
  return total;
}

function samplePoissonPart(random: RandomSource, mean: number): number {
  const u = random.nextUnitFloat();
  let k = 0;
  let probability = Math.exp(-mean);
  let cumulative = probability;
  // Stops when the tail's probabilities have underflowed too, should rounding keep the sum below u.
  while (u > cumulative && probability > 0) {
    k += 1;
    probability *= mean / k;
    cumulative += probability;
  }
  return k;
}
