/**
 * The vocabulary of a before-after evaluation of built projects: plain data, as the estimators
 * read it and return it. Counts are crashes over a whole period; periods are in years.
 */

/** One treated site's crashes of one crash group over the before and after periods. */
export interface TreatedSiteCounts {
  readonly site: string;
  readonly beforeYears: number;
  readonly afterYears: number;
  readonly beforeObserved: number;
  readonly afterObserved: number;
  /**
   * The SPF's predicted crashes of the group over each period (AADT of each period, times the
   * SPF's share of the group), and the site's overdispersion k; absent when the site has no SPF
   * or no AADT, so it cannot enter an Empirical Bayes estimate.
   */
  readonly spf?: {
    readonly beforePredicted: number;
    readonly afterPredicted: number;
    readonly overdispersion: number;
  };
}

/** An untreated comparison site's crashes of one crash group over the same two periods. */
export interface ComparisonSiteCounts {
  readonly site: string;
  readonly beforeYears: number;
  readonly afterYears: number;
  readonly beforeObserved: number;
  readonly afterObserved: number;
}

export type BeforeAfterMethod = "empirical-bayes" | "comparison-group" | "naive";

/**
 * The estimated effect of a treatment on one crash group, summed over its sites: λ crashes
 * observed after, π̂ expected after had the sites not been treated, and the index of
 * effectiveness θ = (λ / π̂) / (1 + Var(π̂) / π̂²) (Hauer 1997): the local CMF.
 */
export interface EffectEstimate {
  readonly method: BeforeAfterMethod;
  readonly sites: number;
  /** λ: crashes observed in the after period. */
  readonly observedAfter: number;
  /** π̂: crashes expected in the after period without the treatment. */
  readonly expectedAfter: number;
  readonly expectedAfterVariance: number;
  /** θ, bias-corrected: the CMF the sites' own record supports. */
  readonly theta: number;
  readonly standardError: number;
  /** θ ± 1.96 standard errors, the lower end not below 0. */
  readonly lower95: number;
  readonly upper95: number;
  /** 100 (θ − 1): negative is a reduction. */
  readonly percentChange: number;
}

/** A CMF with its standard error, as evidence to pool. */
export interface CmfEvidence {
  readonly cmf: number;
  readonly standardError: number;
}
