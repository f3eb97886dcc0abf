import { solveProgramme, type SolveOptions } from "../solver/index.js";
import { assemblePlan, type PlanResult } from "./planProgramme.js";
import type { RankingComparison } from "./traditionalRanking.js";

/** The optimal list solved again with the budget set to what the B/C ranking spent, against the ranking's list. */
export interface OptimumAtRankingSpend {
  readonly definition: string;
  /** The budget it was solved at: the ranking's capital spend. */
  readonly budget: number;
  /** The plan at that budget (status, diagnosis, funded projects and totals). */
  readonly plan: PlanResult;
  /** Its K+A crashes avoided minus the ranking's; null when no list exists at that budget. */
  readonly extraKsiAvoided: number | null;
  readonly extraBenefitPV: number | null;
}

export const OPTIMUM_AT_RANKING_SPEND_DEFINITION =
  "The optimal list solved again with the budget set to the B/C ranking's capital spend, with the same objective and the same policy rules " +
  "(a rule's amount, share or count is unchanged; shares are of the list's own spend), so that any difference comes from the choice of projects, " +
  "not from spending more. When the ranking's list meets the rules it is one of the lists the optimiser could have chosen at that budget, so a " +
  "proven optimum never falls below it on the objective (K+A crashes avoided, or benefit PV).";

/**
 * Re-solves the plan's programme at the ranking's spend (see OPTIMUM_AT_RANKING_SPEND_DEFINITION).
 * The programme's side constraints do not depend on the budget, so only the budget row changes.
 */
export async function optimumAtRankingSpend(result: PlanResult, ranking: RankingComparison, solveOptions: Partial<SolveOptions> = {}): Promise<OptimumAtRankingSpend> {
  const budget = ranking.rankingTotals.cost;
  const programme = { ...result.programme, budget };
  const plan = assemblePlan(result.prepared, budget, programme, await solveProgramme(programme, solveOptions));
  const listed = plan.solution.status === "optimal" || plan.solution.status === "time-limit";
  return {
    definition: OPTIMUM_AT_RANKING_SPEND_DEFINITION,
    budget,
    plan,
    extraKsiAvoided: listed ? plan.totals.ksiAvoided - ranking.rankingTotals.ksiAvoided : null,
    extraBenefitPV: listed ? plan.totals.benefitPV - ranking.rankingTotals.benefitPV : null,
  };
}
