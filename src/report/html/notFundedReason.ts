import type { FrontierLevel } from "../../analysis/budgetFrontier.js";
import type { SiteAlternatives } from "../../model/buildAlternatives.js";
import type { Alternative } from "../../model/types.js";
import { formatFixed, formatMoney } from "../formatNumber.js";

/** Why a site is not in the list, in the order a reader checks: a rule, no effect, or the budget. */
export type NotFundedCause = "never-fund rule" | "no treatment applies" | "no KSI avoided" | "budget";

/** A site left out of the list, with its cause, its best option and a one-line reason. */
export interface NotFundedSite {
  readonly entry: SiteAlternatives;
  readonly cause: NotFundedCause;
  /** The alternative that avoids the most KSI (the cheaper on a tie), if any. */
  readonly best?: Alternative;
  readonly reason: string;
}

/**
 * Explains why `entry` is not funded: a never-fund rule, no candidate treatment applies, none
 * of its options avoids a KSI crash, or the budget (naming the lowest frontier budget, if any,
 * whose optimal list includes the site).
 */
export function notFundedReason(entry: SiteAlternatives, frontier: readonly FrontierLevel[]): NotFundedSite {
  if (entry.excludedBy !== undefined) return { entry, cause: "never-fund rule", reason: `Excluded by a ${entry.excludedBy}.` };
  if (entry.alternatives.length === 0) return { entry, cause: "no treatment applies", reason: "None of its candidate treatments applies to this kind of site." };
  const best = entry.alternatives.reduce((a, b) => (b.ksiAvoided > a.ksiAvoided || (b.ksiAvoided === a.ksiAvoided && b.cost < a.cost) ? b : a));
  if (!(best.ksiAvoided > 0)) {
    return { entry, cause: "no KSI avoided", best, reason: "None of its options is expected to avoid a KSI crash: its recorded fatal and serious crashes, if any, are not of the types its treatments address." };
  }
  const entersAt = frontier.find((level) => level.plan.funded.some((project) => project.entry.site.id === entry.site.id));
  const where =
    entersAt === undefined ? "It is in none of the optimal lists on the budget chart." : `It enters the optimal list at a budget of ${formatMoney(entersAt.budget)}.`;
  return {
    entry,
    cause: "budget",
    best,
    reason:
      `Outranked within the budget: its best option avoids ${formatFixed(best.ksiAvoided, 1)} KSI for ${formatMoney(best.cost)} ` +
      `(${formatMoney(best.costPerKsi)} lifecycle cost per KSI); the funded projects together avoid more within the budget. ${where}`,
  };
}
