import type { RandomSource } from "./pcg32.js";
import { sampleStandardNormal } from "./sampleStandardNormal.js";

/** Parameters of ln X ~ Normal(mu, sigma²). */
export interface LognormalParameters {
  readonly mu: number;
  readonly sigma: number;
}

/**
 * The lognormal whose MEAN is `mean` and standard deviation `sd` (method of moments):
 * sigma² = ln(1 + (sd/mean)²), mu = ln(mean) − sigma²/2, since E[X] = exp(mu + sigma²/2) and
 * Var[X] = (exp(sigma²) − 1) exp(2mu + sigma²) (e.g. Johnson, Kotz and Balakrishnan,
 * Continuous Univariate Distributions, vol. 1, ch. 14). A CMF drawn this way stays positive and
 * averages to the published value.
 */
export function lognormalFromMeanSd(mean: number, sd: number): LognormalParameters {
  if (!(mean > 0) || !(sd >= 0) || !Number.isFinite(mean) || !Number.isFinite(sd)) {
    throw new RangeError(`lognormal needs mean > 0 and sd >= 0, got mean ${mean}, sd ${sd}`);
  }
  const sigmaSquared = Math.log(1 + (sd / mean) ** 2);
  return { mu: Math.log(mean) - sigmaSquared / 2, sigma: Math.sqrt(sigmaSquared) };
}

/** One draw of exp(mu + sigma z), z standard normal (Box–Muller). */
export function sampleLognormal(random: RandomSource, parameters: LognormalParameters): number {
  return Math.exp(parameters.mu + parameters.sigma * sampleStandardNormal(random));
}
