import type { Alternative } from "../model/types.js";
import { checkSolution } from "../solver/index.js";
import type { PlanResult } from "./planProgramme.js";
import { summariseSelection, type ProgrammeTotals } from "./summariseSelection.js";
import type { RankingComparison } from "./traditionalRanking.js";

/** One step the extended ranking takes: funding a site that was out, or upgrading a funded site to a dearer alternative. */
export interface RankingStep {
  readonly site: string;
  /** Treatments before the step; null when the site was not funded. */
  readonly fromTreatments: readonly string[] | null;
  readonly toTreatments: readonly string[];
  /** Extra capital cost: what the step takes from the budget. */
  readonly extraCost: number;
  readonly extraLifecycleCostPV: number;
  readonly extraBenefitPV: number;
  /** ΔBenefit PV ÷ ΔLifecycle cost PV; Infinity when the step costs nothing more over the life. */
  readonly incrementalBcRatio: number;
}

/** The B/C ranking carried on down by incremental B/C until nothing more fits the budget, against the optimal list. */
export interface ExtendedRanking {
  readonly definition: string;
  /** The steps after the ranking's own list, in the order taken. */
  readonly steps: readonly RankingStep[];
  /** Alternative index per site of the prepared plan (null: not funded). */
  readonly choice: readonly (number | null)[];
  /** Funded sites, in the prepared plan's site order. */
  readonly sites: readonly string[];
  readonly totals: ProgrammeTotals;
  /** Whether the list meets every policy rule (side constraints); the optimal list does. */
  readonly meetsRules: boolean;
  /** Optimal K+A crashes avoided (at the plan's budget) minus the extended ranking's. */
  readonly extraKsiAvoided: number;
  readonly extraBenefitPV: number;
}

export const EXTENDED_RANKING_DEFINITION =
  "B/C ranking carried on by incremental B/C: start from the B/C ranking's list; then, while a step fits the money left, take the step with the " +
  "highest incremental B/C (extra benefit PV ÷ extra lifecycle cost PV): upgrade a funded site to a dearer alternative that benefits more, or fund a " +
  "site still out (from doing nothing, so the ratio is the alternative's own B/C); ties go to the smaller extra capital cost, then the site first in " +
  "the scenario. Every step adds benefit and costs no less capital; steps with an incremental B/C below 1 are taken too, as the ranking itself funds any " +
  "site with a benefit, so that the ranking spends the budget as far as its steps allow. Method: incremental benefit-cost analysis (doing nothing is the " +
  "base case and each increment of investment is judged by its own ΔB/ΔC; Newnan, Eschenbach and Lavelle, Engineering Economic Analysis, chapter on " +
  "benefit-cost ratios; from memory), applied across sites under one budget as the greedy rule for the multiple-choice knapsack (Sinha and Zoltners 1979). " +
  "Policy rules other than must-fund and never-fund are not applied; whether the result meets them is reported.";

interface Move {
  readonly group: number;
  /** Alternative index before the move, or null for not funded. */
  readonly from: number | null;
  readonly to: number;
  readonly extraCost: number;
  readonly ratio: number;
}

/**
 * Carries the B/C ranking on down (see EXTENDED_RANKING_DEFINITION) until no further step fits
 * the plan's budget, so that it spends about as much as the optimal list and the two can be
 * compared at (nearly) equal spend. Capital spend never exceeds the budget, since every step is
 * checked against the money left; money left only falls, so a step that does not fit now never
 * will, and each site's steps are re-offered from its new alternative. Cost O(S·m² log(S·m)) for S sites
 * of at most m alternatives.
 */
export function extendedRanking(result: PlanResult, ranking: RankingComparison): ExtendedRanking {
  const { prepared, programme } = result;
  const choice = [...ranking.rankingChoice];
  let left = result.budget - ranking.rankingTotals.cost;
  const heap = new MoveHeap();
  const offer = (group: number) => {
    const alternatives = prepared.sites[group]!.alternatives;
    const current = choice[group] ?? null;
    for (const move of movesFrom(group, alternatives, current)) heap.push(move);
  };
  prepared.sites.forEach((_, group) => offer(group));
  const steps: RankingStep[] = [];
  for (let move = heap.pop(); move !== undefined; move = heap.pop()) {
    // A move from an alternative the site has since left is stale; fresh ones were offered.
    if ((choice[move.group] ?? null) !== move.from) continue;
    if (move.extraCost > left) continue;
    const entry = prepared.sites[move.group]!;
    const from = move.from === null ? null : entry.alternatives[move.from]!;
    const to = entry.alternatives[move.to]!;
    steps.push({
      site: entry.site.id,
      fromTreatments: from === null ? null : from.treatments,
      toTreatments: to.treatments,
      extraCost: move.extraCost,
      extraLifecycleCostPV: to.lifecycleCostPV - (from?.lifecycleCostPV ?? 0),
      extraBenefitPV: to.benefitPV - (from?.benefitPV ?? 0),
      incrementalBcRatio: move.ratio,
    });
    choice[move.group] = move.to;
    left -= move.extraCost;
    offer(move.group);
  }
  const chosen = choice.flatMap((a, g) => (a === null ? [] : [prepared.sites[g]!.alternatives[a]!]));
  const totals = summariseSelection(chosen);
  return {
    definition: EXTENDED_RANKING_DEFINITION,
    steps,
    choice,
    sites: choice.flatMap((a, g) => (a === null ? [] : [prepared.sites[g]!.site.id])),
    totals,
    meetsRules: checkSolution({ ...programme, budget: result.budget }, choice).feasible,
    extraKsiAvoided: result.totals.ksiAvoided - totals.ksiAvoided,
    extraBenefitPV: result.totals.benefitPV - totals.benefitPV,
  };
}

/** Every step up from `current` at one site: alternatives that benefit more and cost no less capital. */
function movesFrom(group: number, alternatives: readonly Alternative[], current: number | null): Move[] {
  const base = current === null ? null : alternatives[current]!;
  const moves: Move[] = [];
  alternatives.forEach((alternative, to) => {
    const extraCost = alternative.cost - (base?.cost ?? 0);
    const extraBenefit = alternative.benefitPV - (base?.benefitPV ?? 0);
    if (to === current || extraCost < 0 || !(extraBenefit > 0)) return;
    const extraLifecycle = alternative.lifecycleCostPV - (base?.lifecycleCostPV ?? 0);
    moves.push({ group, from: current, to, extraCost, ratio: extraLifecycle > 0 ? extraBenefit / extraLifecycle : Infinity });
  });
  return moves;
}

// Highest ratio first; then the smaller extra cost, the earlier site, the earlier alternative.
function before(x: Move, y: Move): boolean {
  if (x.ratio !== y.ratio) return x.ratio > y.ratio;
  if (x.extraCost !== y.extraCost) return x.extraCost < y.extraCost;
  if (x.group !== y.group) return x.group < y.group;
  return x.to < y.to;
}

/** A binary heap of moves in `before` order: the ranking takes the best of many pending steps, over and over. */
class MoveHeap {
  private readonly items: Move[] = [];

  push(move: Move): void {
    const items = this.items;
    items.push(move);
    let i = items.length - 1;
    while (i > 0) {
      const parent = (i - 1) >> 1;
      if (!before(items[i]!, items[parent]!)) break;
      [items[i], items[parent]] = [items[parent]!, items[i]!];
      i = parent;
    }
  }

  pop(): Move | undefined {
    const items = this.items;
    const top = items[0];
    const last = items.pop();
    if (items.length === 0 || last === undefined) return top;
    items[0] = last;
    let i = 0;
    for (;;) {
      const l = 2 * i + 1;
      const r = l + 1;
      let best = i;
      if (l < items.length && before(items[l]!, items[best]!)) best = l;
      if (r < items.length && before(items[r]!, items[best]!)) best = r;
      if (best === i) return top;
      [items[i], items[best]] = [items[best]!, items[i]!];
      i = best;
    }
  }
}
