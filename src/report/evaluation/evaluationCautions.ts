/** The cautions every evaluation output carries, beside the general ones. */
export const EVALUATION_CAUTIONS: readonly string[] = [
  "A before-after estimate from a few sites and a few years is uncertain: read the interval, not the point value alone.",
  "It credits the treatment with every change at the sites: other works, enforcement, traffic changes, crash reporting changes and spillover to nearby roads are not separated out.",
  "Only the Empirical Bayes and comparison-group estimates correct for regression to the mean; the naive estimate does not, and is shown for contrast.",
  "Have a qualified safety analyst review an evaluation before its results go into the catalogue or a decision.",
];
