import { justifyPlan, type PlanJustification } from "./justifyPlan.js";
import type { PlanResult } from "./planProgramme.js";
import { traditionalRanking, type RankingComparison } from "./traditionalRanking.js";
import { upgradeChecks, type UpgradeCheck } from "./upgradeChecks.js";

/** Everything `plan` says in a project's favour or against it. */
export interface PlanCase {
  readonly justification: PlanJustification;
  readonly upgrades: readonly UpgradeCheck[];
  readonly ranking: RankingComparison;
  readonly currency: string;
  readonly objective: "ksi" | "benefit";
}

/** Gathers the case for a solved list: justification with thresholds, incremental B/C of upgrades, and the B/C ranking comparison. */
export function casePlan(result: PlanResult): PlanCase {
  return {
    justification: justifyPlan(result),
    upgrades: upgradeChecks(result),
    ranking: traditionalRanking(result),
    currency: result.prepared.scenario.currency,
    objective: result.prepared.objective,
  };
}
