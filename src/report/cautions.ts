/** The professional cautions every output carries. */
export const CAUTIONS: readonly string[] = [
  "CMFs are estimates from studies elsewhere; they carry uncertainty and may not transfer to local conditions.",
  "Expected crashes from a few years of counts are noisy; high-crash sites tend to improve on their own (regression to the mean).",
  "This list supports, and never replaces, engineering judgement, local standards and licensed professional practice. Every project needs a site study before it is built.",
];
