import type { Alternative } from "../model/types.js";
import { checkSolution } from "../solver/index.js";
import type { PlanResult } from "./planProgramme.js";
import { summariseSelection, type ProgrammeTotals } from "./summariseSelection.js";
import { byBcRatioDescending } from "../model/benefitCostRatio.js";
import type { ProgrammeYears } from "../model/programmeTypes.js";
import { yearBudgets } from "./programmeYearRows.js";

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
  "(no benefit) are not funded. Policy rules other than must-fund and never-fund are not applied; whether the result meets them is reported. " +
  "In a multi-year programme each site's alternatives are read in the first year each can be built, and a funded site goes into the earliest year " +
  "whose budget (with the scenario's carry-over) still has room for it, at that year's cost.";

/**
 * The traditional B/C ranking at the plan's budget (see RANKING_DEFINITION), and how many more K+A
 * crashes the optimal list avoids than it does. It stops where the next site does not fit, so it
 * usually spends less than the optimal list: see `optimumAtRankingSpend` and `extendedRanking` for
 * the comparisons at equal spend.
 */
export function traditionalRanking(result: PlanResult): RankingComparison {
  const { prepared, programme } = result;
  const best = prepared.sites.map((entry) => {
    const earliest = earliestOptions(entry.alternatives);
    let index: number | null = null;
    entry.alternatives.forEach((alternative, a) => {
      if (earliest.has(a) && (index === null || better(alternative, entry.alternatives[index]!))) index = a;
    });
    return index;
  });
  const choice: (number | null)[] = prepared.sites.map(() => null);
  const years = prepared.scenario.programme;
  const room = years === undefined ? undefined : yearRoom(years, result.budget);
  let left = result.budget;
  const order: string[] = [];
  const fund = (g: number) => {
    const a = best[g];
    if (a === null || a === undefined) return;
    const alternatives = prepared.sites[g]!.alternatives;
    // In a programme: the same treatments in the earliest year that still has room.
    const picked = room === undefined ? a : alternatives.findIndex((other) => sameTreatments(other, alternatives[a]!) && room.fits(other));
    if (picked < 0) return;
    const cost = alternatives[picked]!.cost;
    if (cost > left) return;
    room?.take(alternatives[picked]!);
    choice[g] = picked;
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

const sameTreatments = (x: Alternative, y: Alternative) => x.treatments.join("+") === y.treatments.join("+");

/** The options of each treatment set in the first year it can be built (every option in a one-year list). */
function earliestOptions(alternatives: readonly Alternative[]): Set<number> {
  const first = new Map<string, number>();
  alternatives.forEach((alternative, a) => {
    const key = alternative.treatments.join("+");
    const seen = first.get(key);
    if (seen === undefined || (alternative.buildYear ?? 0) < (alternatives[seen]!.buildYear ?? 0)) first.set(key, a);
  });
  return new Set(first.values());
}

/** The programme's year budgets as the ranking fills them: an option fits when every year row (cumulative under carry-over) still holds. */
function yearRoom(programme: ProgrammeYears, budget: number): { fits(alternative: Alternative): boolean; take(alternative: Alternative): void } {
  const budgets = yearBudgets(programme, budget);
  const spent = budgets.map(() => 0);
  const cumulative = programme.carryOver === "unspent";
  const holds = (extra: readonly number[]) => {
    let spend = 0;
    let limit = 0;
    return budgets.every((yearBudget, y) => {
      spend = (cumulative ? spend : 0) + spent[y]! + (extra[y] ?? 0);
      limit = (cumulative ? limit : 0) + yearBudget;
      return spend <= limit;
    });
  };
  return {
    fits: (alternative) => holds(alternative.spendByYear ?? []),
    take: (alternative) => (alternative.spendByYear ?? []).forEach((amount, y) => (spent[y]! += amount)),
  };
}
