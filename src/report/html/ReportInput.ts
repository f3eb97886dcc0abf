import type { FrontierLevel } from "../../analysis/budgetFrontier.js";
import type { PlanResult } from "../../analysis/planProgramme.js";

/** A data-quality warning as the report shows it: where, what, and what to do. */
export interface ReportWarning {
  /** Location, e.g. "scenarios/demo.yaml:12:5 sites[3].crashes". */
  readonly where: string;
  readonly message: string;
  readonly hint?: string;
}

/** Results of an uncertainty analysis: how often each site was funded across draws. */
export interface RobustnessInput {
  /** Site id → share of draws (0..1) in which the site was funded. */
  readonly selectionProbability: ReadonlyMap<string, number>;
  readonly draws: number;
  /** What was varied, e.g. "CMFs drawn from their standard errors (lognormal)". */
  readonly method: string;
}

/** One row of a sensitivity analysis: the programme under a changed assumption. */
export interface SensitivityCase {
  /** The changed assumption, e.g. "discount rate 7%". */
  readonly label: string;
  readonly projects: number;
  readonly cost: number;
  readonly ksiAvoided: number;
  /** Sites funded here but not in the base list, plus the reverse. */
  readonly sitesChanged?: number;
}

/** A sensitivity analysis to show beside the base list. */
export interface SensitivityInput {
  readonly description: string;
  readonly cases: readonly SensitivityCase[];
}

/** A simpler selection method at the same budget, to show what optimising gains. */
export interface RankingComparison {
  /** e.g. "fund sites in order of B/C until the budget runs out". */
  readonly method: string;
  readonly projects: number;
  readonly cost: number;
  readonly ksiAvoided: number;
}

/**
 * Everything the HTML report shows. The optional fields come from other analyses; each renders
 * its section (or column, or line) only when present.
 */
export interface ReportInput {
  /** The optimal list at the chosen budget (one of the frontier's levels). */
  readonly plan: PlanResult;
  /** Optimal lists at rising budget levels, for the chart and the slider. */
  readonly frontier: readonly FrontierLevel[];
  readonly warnings: readonly ReportWarning[];
  /** File name offered by the embedded "download CSV" link. */
  readonly csvFileName: string;
  /** Site id → a richer one-line reason, replacing the report's own. */
  readonly reasons?: ReadonlyMap<string, string>;
  readonly robustness?: RobustnessInput;
  readonly sensitivity?: SensitivityInput;
  readonly rankingComparison?: RankingComparison;
}
