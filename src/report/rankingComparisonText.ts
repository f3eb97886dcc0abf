import type { PlanCase } from "../analysis/casePlan.js";
import { formatFixed, formatMoney } from "./formatNumber.js";

/** The ranking comparison in plain sentences, shared by `plan`'s table and the HTML report's summary. */
export interface RankingComparisonText {
  /** Both lists as they stand, with both spends: the gain here mixes better choice with more money. */
  readonly asTheyStand: string;
  /** At equal spend (a): the optimal list solved at the ranking's spend. */
  readonly atRankingSpend: string;
  /** At equal spend (b): the ranking carried on by incremental B/C until the budget is used. */
  readonly extended: string;
  /** How the gain splits into better choice and more money; null when either part is unknown. */
  readonly split: string | null;
}

/**
 * Sentences comparing the optimal list with the B/C ranking: as they stand (both spends), at the
 * ranking's spend, and against the ranking carried on until the budget is used, e.g. "At equal
 * spend (5,660,000 USD) the optimal list avoids 3.2 more K+A crashes than the ranking (…)".
 */
export function rankingComparisonText(planCase: PlanCase): RankingComparisonText {
  const { ranking, atRankingSpend, extendedRanking, currency } = planCase;
  const money = (amount: number) => `${formatMoney(amount)} ${currency}`;
  const rankingTotals = ranking.rankingTotals;
  const optimal = ranking.optimalTotals;
  const extraSpend = optimal.cost - rankingTotals.cost;
  const asTheyStand =
    `The B/C ranking funds ${rankingTotals.projects} project(s) for ${money(rankingTotals.cost)} and avoids ${formatFixed(rankingTotals.ksiAvoided, 2)} K+A crashes; ` +
    `the optimal list funds ${optimal.projects} for ${money(optimal.cost)} (${spendWords(extraSpend, currency)}) and avoids ${moreOrFewer(ranking.extraKsiAvoided)} ` +
    `(benefit PV ${signedMoney(ranking.extraBenefitPV)} ${currency}).` +
    (ranking.rankingMeetsRules ? "" : " The ranking's list breaks at least one policy rule.");
  const atSpendStatus = atRankingSpend.plan.solution.status;
  const atSpend =
    atRankingSpend.extraKsiAvoided === null || atRankingSpend.extraBenefitPV === null
      ? `At the ranking's spend (${money(atRankingSpend.budget)}) no list meets the rules (status ${atSpendStatus}${atRankingSpend.plan.solution.diagnosis ? `: ${atRankingSpend.plan.solution.diagnosis}` : ""}).`
      : `At equal spend, with the budget set to the ranking's ${money(atRankingSpend.budget)}, the optimal list (${atRankingSpend.plan.totals.projects} project(s), ` +
        `${money(atRankingSpend.plan.totals.cost)} spent${atSpendStatus === "optimal" ? "" : `, status ${atSpendStatus}`}) avoids ${moreOrFewer(atRankingSpend.extraKsiAvoided)} than the ranking ` +
        `(benefit PV ${signedMoney(atRankingSpend.extraBenefitPV)} ${currency}): the gain from better choice alone.`;
  const extendedTotals = extendedRanking.totals;
  const extended =
    `Carried on by incremental B/C until nothing more fits (${extendedRanking.steps.length} more step(s)), the ranking funds ${extendedTotals.projects} project(s) ` +
    `for ${money(extendedTotals.cost)} and avoids ${formatFixed(extendedTotals.ksiAvoided, 2)} K+A crashes; at the same budget the optimal list ` +
    `(${money(optimal.cost)} spent) avoids ${moreOrFewer(extendedRanking.extraKsiAvoided)} (benefit PV ${signedMoney(extendedRanking.extraBenefitPV)} ${currency}).` +
    (extendedRanking.meetsRules ? "" : " The carried-on list breaks at least one policy rule.");
  const choice = atRankingSpend.extraKsiAvoided;
  const split =
    choice === null
      ? null
      : `The difference of ${formatFixed(ranking.extraKsiAvoided, 2)} K+A crashes between the lists as they stand splits into ${formatFixed(choice, 2)} from the choice ` +
        `of projects at equal spend and ${formatFixed(ranking.extraKsiAvoided - choice, 2)} from the difference in spend (${spendWords(extraSpend, currency)}).`;
  return { asTheyStand, atRankingSpend: atSpend, extended, split };
}

function moreOrFewer(extra: number): string {
  // Below the shown precision the two lists avoid as many.
  if (Math.abs(extra) < 0.005) return "as many K+A crashes";
  return extra > 0 ? `${formatFixed(extra, 2)} more K+A crashes` : `${formatFixed(-extra, 2)} fewer K+A crashes`;
}

function signedMoney(amount: number): string {
  return `${amount >= 0 ? "+" : "−"}${formatMoney(Math.abs(amount))}`;
}

function spendWords(extraSpend: number, currency: string): string {
  if (extraSpend === 0) return "the same spend";
  return `${formatMoney(Math.abs(extraSpend))} ${currency} ${extraSpend > 0 ? "more" : "less"}`;
}
