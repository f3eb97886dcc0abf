import type { SolveOptions } from "../solver/index.js";
import { extendedRanking, type ExtendedRanking } from "./extendedRanking.js";
import { justifyPlan, type PlanJustification } from "./justifyPlan.js";
import { optimumAtRankingSpend, type OptimumAtRankingSpend } from "./optimumAtRankingSpend.js";
import type { PlanResult } from "./planProgramme.js";
import { traditionalRanking, type RankingComparison } from "./traditionalRanking.js";
import { upgradeChecks, type UpgradeCheck } from "./upgradeChecks.js";

/** Everything `plan` says in a project's favour or against it. */
export interface PlanCase {
  readonly justification: PlanJustification;
  readonly upgrades: readonly UpgradeCheck[];
  /** The B/C ranking at the plan's budget, as it stops when the next site does not fit. */
  readonly ranking: RankingComparison;
  /** At equal spend (a): the optimal list solved at the ranking's spend. */
  readonly atRankingSpend: OptimumAtRankingSpend;
  /** At equal spend (b): the ranking carried on by incremental B/C until the budget is used. */
  readonly extendedRanking: ExtendedRanking;
  /** The plan's budget, at which the optimal list, the ranking and the carried-on ranking are drawn up. */
  readonly budget: number;
  readonly currency: string;
  readonly objective: "ksi" | "benefit";
}

/**
 * Gathers the case for a solved list: justification with thresholds, incremental B/C of upgrades,
 * and the B/C ranking comparison, also at equal spend (one more solve, with the same options).
 */
export async function casePlan(result: PlanResult, solveOptions: Partial<SolveOptions> = {}): Promise<PlanCase> {
  const ranking = traditionalRanking(result);
  return {
    justification: justifyPlan(result),
    upgrades: upgradeChecks(result),
    ranking,
    atRankingSpend: await optimumAtRankingSpend(result, ranking, solveOptions),
    extendedRanking: extendedRanking(result, ranking),
    budget: result.budget,
    currency: result.prepared.scenario.currency,
    objective: result.prepared.objective,
  };
}
