import { totalsBySeverity } from "../model/crashMatrix.js";
import { SEVERITIES } from "../model/types.js";
import type { PlanResult } from "./planProgramme.js";

/** How much of a list's benefit rests on single fatal crashes, a near-random event among severe crashes. */
export interface SingleFatalCrashShare {
  /** Share (0–1) of the list's benefit PV from fatal-crash cells at sites with exactly one recorded fatal crash. */
  readonly share: number;
  /** Funded sites with exactly one recorded fatal crash. */
  readonly sites: readonly string[];
  /** Share above which the list is flagged. */
  readonly threshold: number;
  readonly high: boolean;
  readonly definition: string;
}

/** Above a fifth of the benefit, chance deaths are steering the list (averta's threshold; common practice offers none). */
export const SINGLE_FATAL_SHARE_THRESHOLD = 0.2;

export const SINGLE_FATAL_SHARE_DEFINITION =
  "share of the list's benefit PV that comes from avoided fatal (K) crashes at funded sites with exactly one recorded fatal crash: for each such project, its benefit PV × (first-year K crashes avoided × K unit cost ÷ first-year crash costs avoided)";

/**
 * The part of a list's benefit that rests on single fatal crashes (see the definition). With K
 * and A valued at one combined cost, this share is small; valued by severity, one fatal crash can
 * carry a project.
 */
export function singleFatalCrashShare(result: PlanResult): SingleFatalCrashShare {
  const costs = result.prepared.scenario.economics.crashCosts.perCrash;
  let fromSingleFatal = 0;
  const sites: string[] = [];
  for (const { entry, alternative } of result.funded) {
    if (totalsBySeverity(entry.site.crashes).K !== 1) continue;
    sites.push(entry.site.id);
    const avoided = alternative.crashesAvoidedPerYear;
    const firstYearBenefit = SEVERITIES.reduce((total, severity) => total + avoided[severity] * costs[severity], 0);
    if (firstYearBenefit > 0) fromSingleFatal += alternative.benefitPV * ((avoided.K * costs.K) / firstYearBenefit);
  }
  const share = result.totals.benefitPV > 0 ? fromSingleFatal / result.totals.benefitPV : 0;
  return { share, sites, threshold: SINGLE_FATAL_SHARE_THRESHOLD, high: share > SINGLE_FATAL_SHARE_THRESHOLD, definition: SINGLE_FATAL_SHARE_DEFINITION };
}
