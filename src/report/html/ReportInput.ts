import type { Evaluation } from "../../analysis/evaluateBuiltProjects.js";
import type { FrontierLevel } from "../../analysis/budgetFrontier.js";
import type { PlanCase } from "../../analysis/casePlan.js";
import type { PlanResult } from "../../analysis/planProgramme.js";
import type { UncertaintyResult } from "../../analysis/uncertainty/analyseUncertainty.js";
import type { SensitivityResult } from "../../analysis/uncertainty/oneAtATimeSensitivity.js";

/** A data-quality warning as the report shows it: where, what, and what to do. */
export interface ReportWarning {
  /** Location, e.g. "scenarios/demo.yaml:12:5 sites[3].crashes". */
  readonly where: string;
  readonly message: string;
  readonly hint?: string;
}

/** The uncertainty analysis of the same list: Monte Carlo draws and one-at-a-time sensitivity. */
export interface ReportUncertainty {
  /** From `analyseUncertainty` at the report's budget; its plan is the report's list. */
  readonly draws: UncertaintyResult;
  readonly sensitivity: SensitivityResult;
}

/**
 * Everything the HTML report shows. The uncertainty analysis is optional (it costs many solves);
 * its sections and column render only when it is given.
 */
export interface ReportInput {
  /** The optimal list at the chosen budget (one of the frontier's levels). */
  readonly plan: PlanResult;
  /** The case for that list: justification with entry thresholds, incremental B/C, the B/C ranking comparison, also at equal spend (`await casePlan(plan)`). */
  readonly planCase: PlanCase;
  /** Optimal lists at rising budget levels, for the chart and the slider. */
  readonly frontier: readonly FrontierLevel[];
  readonly warnings: readonly ReportWarning[];
  /** File name offered by the embedded "download CSV" link. */
  readonly csvFileName: string;
  readonly uncertainty?: ReportUncertainty;
  /** A before-after evaluation of built projects, shown as "Evidence from our own projects". */
  readonly evaluation?: Evaluation;
}
