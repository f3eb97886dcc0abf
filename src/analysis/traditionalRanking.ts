import type { Alternative } from "../model/types.js";
import { checkSolution } from "../solver/index.js";
import type { PlanResult } from "./planProgramme.js";
import { summariseSelection, type ProgrammeTotals } from "./summariseSelection.js";
import { byBcRatioDescending } from "../model/benefitCostRatio.js";

/** The list a B/C ranking would fund at the same budget, against the optimal list. */
export interface RankingComparison {
  readonly definition: string;
  /** Sites the ranking funds, in the order it funded them. */
  readonly rankingSites: readonly string[];
  /** The ranking's alternative index per site of the prepared plan (null: not funded). */
  readonly rankingChoice: readonly (number | null)[];
  readonly rankingTotals: ProgrammeTotals;
  /** The optimal list's totals at the plan's budget, so both lists' spend sit side by side. */
  readonly optimalTotals: ProgrammeTotals;
  /** Optimal K+A crashes avoided minus the ranking's (positive: the optimal list avoids more). */
  readonly extraKsiAvoided: number;
  readonly extraBenefitPV: number;
  /** Whether the ranking's list also meets every policy rule (side constraints); the optimal list does. */
  readonly rankingMeetsRules: boolean;
}

export const RANKING_DEFINITION =
  "B/C ranking: take each site's alternative with the highest B/C (benefit PV ÷ lifecycle cost PV; the cheaper on a tie); " +
  "fund must-fund sites first (their best-B/C allowed alternative); then go down the other sites sorted by that B/C, highest first " +
  "(ties by site id), funding each whose capital cost fits the money left and skipping any that does not; sites whose best B/C is 0 " +
  "(no benefit) are not funded. Policy rules other than must-fund and never-fund are not applied; whether the result meets them is reported.";

/**
 * The traditional B/C ranking at the plan's budget (see RANKING_DEFINITION), and how many more K+A
 * crashes the optimal list avoids than it does. It stops where the next site does not fit, so it
 * usually spends less than the optimal list: see `optimumAtRankingSpend` and `extendedRanking` for
 * the comparisons at equal spend.
 */
export function traditionalRanking(result: PlanResult): RankingComparison {
  const { prepared, programme } = result;
  const best = prepared.sites.map((entry) => {
    let index: number | null = null;
    entry.alternatives.forEach((alternative, a) => {
      if (index === null || better(alternative, entry.alternatives[index]!)) index = a;
    });
    return index;
  });
  const choice: (number | null)[] = prepared.sites.map(() => null);
  let left = result.budget;
  const order: string[] = [];
  const fund = (g: number) => {
    const a = best[g];
    if (a === null || a === undefined) return;
    const cost = prepared.sites[g]!.alternatives[a]!.cost;
    if (cost > left) return;
    choice[g] = a;
    left -= cost;
    order.push(prepared.sites[g]!.site.id);
  };
  prepared.sites.forEach((entry, g) => {
    if (entry.required) fund(g);
  });
  const rest = prepared.sites
    .map((entry, g) => ({ entry, g }))
    .filter(({ entry, g }) => !entry.required && best[g] !== null && entry.alternatives[best[g]!]!.bcRatio > 0)
    .sort((x, y) => byBcRatioDescending(x.entry.alternatives[best[x.g]!]!.bcRatio, y.entry.alternatives[best[y.g]!]!.bcRatio) || (x.entry.site.id < y.entry.site.id ? -1 : 1));
  for (const { g } of rest) fund(g);
  const chosen = choice.flatMap((a, g) => (a === null ? [] : [prepared.sites[g]!.alternatives[a]!]));
  const totals = summariseSelection(chosen);
  return {
    definition: RANKING_DEFINITION,
    rankingSites: order,
    rankingChoice: choice,
    rankingTotals: totals,
    optimalTotals: result.totals,
    extraKsiAvoided: result.totals.ksiAvoided - totals.ksiAvoided,
    extraBenefitPV: result.totals.benefitPV - totals.benefitPV,
    rankingMeetsRules: checkSolution({ ...programme, budget: result.budget }, choice).feasible,
  };
}

function better(x: Alternative, y: Alternative): boolean {
  return x.bcRatio > y.bcRatio || (x.bcRatio === y.bcRatio && x.cost < y.cost);
}
