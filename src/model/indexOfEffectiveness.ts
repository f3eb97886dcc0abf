import type { BeforeAfterMethod, EffectEstimate } from "./beforeAfterTypes.js";

/** Standard normal quantile for a two-sided 95 % interval (common practice). */
const Z_95 = 1.96;

/**
 * The index of effectiveness θ of a before-after study and its precision, from λ (crashes observed
 * after), π̂ (crashes expected after without the treatment) and Var(π̂). This is the last step
 * every before-after method shares (Hauer, "Observational Before-After Studies in Road Safety",
 * 1997, ch. 4 "four-step"; Highway Safety Manual 2010, Part B, ch. 9 and Appendix 9A, eqs. 9A.1-8
 * and 9A.1-11):
 *
 *   θ = (λ / π̂) / (1 + Var(π̂)/π̂²), which removes the first-order bias of the ratio λ/π̂ caused
 *   by the noise in π̂;
 *   Var(θ) = θ² [1/λ + Var(π̂)/π̂²] / (1 + Var(π̂)/π̂²)², λ taken as Poisson (Var(λ) = λ);
 *   95 % interval θ ± 1.96 SE, the lower end clipped at 0; percentChange = 100 (θ − 1).
 *
 * Returns null, "no estimate", when λ = 0 or π̂ = 0. With λ = 0 the formula gives θ = 0 with
 * variance 0 (θ²/λ → 0), a zero-width interval that claims certainty the data cannot give; with
 * π̂ = 0 the sites were expected to see no crashes at all, so there is nothing to compare with.
 * Inputs must be finite and at least 0 (RangeError otherwise).
 * @example indexOfEffectiveness("naive", 1, 40, 50, 25): θ = 0.8 / 1.01 = 0.79208.
 */
export function indexOfEffectiveness(
  method: BeforeAfterMethod,
  sites: number,
  observedAfter: number,
  expectedAfter: number,
  expectedAfterVariance: number,
): EffectEstimate | null {
  for (const [name, value] of [["observed after", observedAfter], ["expected after", expectedAfter], ["variance of expected after", expectedAfterVariance]] as const) {
    if (!(value >= 0) || !Number.isFinite(value)) throw new RangeError(`${name} must be a finite number >= 0, got ${value}`);
  }
  if (observedAfter === 0 || expectedAfter === 0) return null;
  const relativeVariance = expectedAfterVariance / expectedAfter ** 2;
  const theta = observedAfter / expectedAfter / (1 + relativeVariance);
  const variance = (theta ** 2 * (1 / observedAfter + relativeVariance)) / (1 + relativeVariance) ** 2;
  const standardError = Math.sqrt(variance);
  return {
    method,
    sites,
    observedAfter,
    expectedAfter,
    expectedAfterVariance,
    theta,
    standardError,
    lower95: Math.max(0, theta - Z_95 * standardError),
    upper95: theta + Z_95 * standardError,
    percentChange: 100 * (theta - 1),
  };
}
