import type { NetworkScreening } from "../model/screenSites.js";
import { sitesWithoutCandidates } from "../model/sitesWithoutCandidates.js";
import { CAUTIONS } from "./cautions.js";
import { jsonNumber } from "./formatNumber.js";

/** The screening as a plain JSON-ready object: every site's figures and ranks, the proposal, the cautions. */
export function screenJson(screening: NetworkScreening, scenarioName: string): unknown {
  const optional = (x: number | undefined) => (x === undefined ? null : jsonNumber(x));
  return {
    scenario: scenarioName,
    measure: "excess expected K+A crashes per year (KSI crashes: Empirical Bayes expected minus SPF predicted; crashes of severity K or A, not people)",
    proposed: screening.proposed,
    sitesWithoutCandidates: sitesWithoutCandidates(screening.sites.map((entry) => entry.site)),
    sites: screening.sites.map((e) => ({
      site: e.site.id,
      name: e.site.name,
      kind: e.site.kind,
      district: e.site.district,
      excessRank: e.excessRank,
      observedRank: e.observedRank,
      ksiPerYearObserved: jsonNumber(e.observedKsiPerYear),
      ksiPerYearPredicted: optional(e.predictedKsiPerYear),
      ksiPerYearExpected: optional(e.expectedKsiPerYear),
      excessKsiPerYear: optional(e.excessKsiPerYear),
      ...(e.note !== undefined && { note: e.note }),
    })),
    cautions: CAUTIONS,
  };
}
