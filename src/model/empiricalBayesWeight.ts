/**
 * The Empirical Bayes weight on the SPF prediction: w = 1 / (1 + k · Σ predicted), where the sum
 * is the crashes predicted over the whole observation window (Hauer, Harwood, Council, Griffith,
 * "Estimating safety by the Empirical Bayes method: a tutorial", TRR 1784, 2002; Highway Safety
 * Manual Part C, Appendix A). Between 0 and 1: near 1 when the SPF is reliable
 * (small k) or the site sees few crashes, near 0 when the site's own record is long and rich.
 * @example empiricalBayesWeight(0.5, 10) === 1 / 6
 */
export function empiricalBayesWeight(overdispersion: number, predictedOverWindow: number): number {
  if (!(overdispersion >= 0) || !(predictedOverWindow >= 0)) throw new RangeError("overdispersion and predicted crashes must be zero or more");
  return 1 / (1 + overdispersion * predictedOverWindow);
}

/** Expected crashes over the window: w × predicted + (1 − w) × observed (HSM Part C, Appendix A). */
export function empiricalBayesEstimate(weight: number, predictedOverWindow: number, observedOverWindow: number): number {
  return weight * predictedOverWindow + (1 - weight) * observedOverWindow;
}
