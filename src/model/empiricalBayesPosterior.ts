/** Shape and rate of a gamma distribution (mean shape / rate, variance shape / rate²). */
export interface GammaParameters {
  readonly shape: number;
  readonly rate: number;
}

/**
 * The gamma posterior of a site's expected crashes per year λ behind its Empirical Bayes
 * estimate: with the SPF's prediction μ per year as the mean of a gamma prior of shape 1/k
 * (negative binomial overdispersion k) and n crashes observed over T years,
 * λ | n ~ Gamma(shape = 1/k + n, rate = 1/(kμ) + T) (Hauer 1997, "Observational Before-After
 * Studies in Road Safety", ch. 7; Highway Safety Manual 2010, Part C, Appendix A). Its mean is
 * the EB estimate w·μ + (1 − w)·n/T with w = 1/(1 + kμT), and its variance over the window,
 * T²·shape/rate², is Hauer's (1 − w)·E{window crashes}.
 * @example empiricalBayesPosterior(2, 0.5, 16, 5) is Gamma(18, 6): mean 3 a year (15 over the window, as empiricalBayesEstimate(1/6, 10, 16))
 */
export function empiricalBayesPosterior(predictedPerYear: number, overdispersion: number, observedOverWindow: number, windowYears: number): GammaParameters {
  if (!(predictedPerYear > 0) || !Number.isFinite(predictedPerYear)) throw new RangeError(`the SPF prediction must be a positive number, got ${predictedPerYear}`);
  if (!(overdispersion > 0) || !Number.isFinite(overdispersion)) throw new RangeError(`overdispersion k must be positive for a gamma posterior, got ${overdispersion}`);
  if (!(observedOverWindow >= 0)) throw new RangeError(`observed crashes must be zero or more, got ${observedOverWindow}`);
  if (!(windowYears > 0)) throw new RangeError(`crash window must cover at least one year, got ${windowYears}`);
  return { shape: 1 / overdispersion + observedOverWindow, rate: 1 / (overdispersion * predictedPerYear) + windowYears };
}
