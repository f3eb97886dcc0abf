import type { FrontierLevel } from "./budgetFrontier.js";
import type { SolveStatus } from "../solver/index.js";

/** The budget step the marginal rates are scaled to: one million currency units. */
export const MILLION = 1_000_000;

/** One budget level of the frontier, as reported. */
export interface FrontierRow {
  readonly budget: number;
  readonly status: SolveStatus;
  readonly spend: number;
  readonly projects: number;
  readonly ksiAvoided: number;
  readonly benefitPV: number;
  readonly bcRatio: number;
  /**
   * Extra KSI avoided per extra 1M of budget since the previous level:
   * (KSI here − KSI there) / ((budget here − budget there) / 1M). Null on the first level, on a
   * level with the same budget as the previous one, and next to a level without a solved list.
   */
  readonly marginalKsiPerMillion: number | null;
  /** This step buys less than half of the "first 1M" rate (`referenceKsiPerMillion`). */
  readonly diminishing: boolean;
}

/** The frontier table with its diminishing-returns reading. */
export interface FrontierSummary {
  readonly rows: readonly FrontierRow[];
  /**
   * The "first 1M" rate, KSI avoided per extra 1M, measured from the first feasible level: from the
   * lowest budget level with a list (optimal or time-limit) to the next higher budget level with a
   * list, skipping levels without one in between. Levels below the must-fund sites' cost have no
   * list, so when level 0 is infeasible the rate starts at the first level that can pay for them
   * (`referenceFromBudget` says which). Null when fewer than two budgets have a list.
   */
  readonly referenceKsiPerMillion: number | null;
  /** Budget of the level the "first 1M" rate is measured from (the first feasible level), or null. */
  readonly referenceFromBudget: number | null;
  /** Budget of the level it is measured to (the next higher level with a list), or null. */
  readonly referenceToBudget: number | null;
  /**
   * The budget level past which every further step buys less than half the reference rate per 1M
   * (the level at the start of the first step of an unbroken diminishing run to the end), or null.
   */
  readonly diminishingFrom: number | null;
}

/**
 * Reads a solved frontier: per level the spend, projects, KSI avoided, benefit PV and B/C of the
 * optimal list, the marginal KSI avoided per extra 1M since the previous level, and which steps
 * buy less than half of what the "first 1M" bought per 1M (diminishing returns), that rate being
 * measured from the first feasible level (see `referenceKsiPerMillion`).
 */
export function summariseFrontier(frontier: readonly FrontierLevel[]): FrontierSummary {
  const first = frontier.findIndex(isSolved);
  const next = first < 0 ? -1 : frontier.findIndex((level, index) => index > first && isSolved(level) && level.budget > frontier[first]!.budget);
  const from = frontier[first];
  const to = frontier[next];
  const reference = from !== undefined && to !== undefined ? (to.plan.totals.ksiAvoided - from.plan.totals.ksiAvoided) / ((to.budget - from.budget) / MILLION) : null;
  const partial = frontier.map((level, index) => {
    const previous = index > 0 ? frontier[index - 1] : undefined;
    const rise = previous === undefined ? 0 : level.budget - previous.budget;
    // A level with no list (infeasible below the must-fund cost, or unsolved) has no rate to or from it.
    const comparable = previous !== undefined && isSolved(previous) && isSolved(level);
    const marginal = comparable && rise > 0 ? (level.plan.totals.ksiAvoided - previous.plan.totals.ksiAvoided) / (rise / MILLION) : null;
    const { totals } = level.plan;
    return {
      budget: level.budget,
      status: level.plan.solution.status,
      spend: totals.cost,
      projects: totals.projects,
      ksiAvoided: totals.ksiAvoided,
      benefitPV: totals.benefitPV,
      bcRatio: totals.bcRatio,
      marginalKsiPerMillion: marginal,
    };
  });
  const ref: number | null = reference;
  const rows: FrontierRow[] = partial.map((row) => ({
    ...row,
    diminishing: ref !== null && ref > 0 && row.marginalKsiPerMillion !== null && row.marginalKsiPerMillion < 0.5 * ref,
  }));
  let diminishingFrom: number | null = null;
  for (let index = rows.length - 1; index >= 1; index -= 1) {
    const row = rows[index]!;
    if (row.marginalKsiPerMillion === null) continue;
    if (!row.diminishing) break;
    diminishingFrom = rows[index - 1]!.budget;
  }
  return { rows, referenceKsiPerMillion: ref, referenceFromBudget: from !== undefined && to !== undefined ? from.budget : null, referenceToBudget: to?.budget ?? null, diminishingFrom };
}

function isSolved(level: FrontierLevel): boolean {
  return level.plan.solution.status === "optimal" || level.plan.solution.status === "time-limit";
}
