import { checkSolution, type PreparedProgramme, type SolveStatus } from "../../solver/index.js";
import { buildProgramme } from "../buildProgramme.js";
import type { PreparedPlan } from "../preparePlan.js";
import type { DrawSettings } from "./drawSettings.js";
import { drawSites } from "./drawSites.js";

/** What one draw says about the chosen list and about the best list for that draw. */
export interface DrawOutcome {
  readonly draw: number;
  /** Status of the re-optimisation in this draw. */
  readonly status: SolveStatus;
  /** Best list for this draw: chosen alternative index per site, or null. */
  readonly choice: readonly (number | null)[];
  /** Objective of the best list (KSI avoided or benefit PV, as the plan's objective). */
  readonly optimumObjective: number;
  /** The chosen (plan) list evaluated in this draw. */
  readonly planKsiAvoided: number;
  readonly planBenefitPV: number;
  readonly planLifecycleCostPV: number;
  readonly planObjective: number;
  /** Whether the chosen list still meets every rule in this draw (KSI-share floors can move). */
  readonly planFeasible: boolean;
}

/**
 * Draws the sites, evaluates the chosen list `planChoice` on them, and re-solves `solver` (the
 * scenario's programme, prepared once) with the draw's values and rules for the draw's best list.
 */
export async function evaluateDraw(
  prepared: PreparedPlan,
  solver: PreparedProgramme,
  planChoice: readonly (number | null)[],
  drawIndex: number,
  settings: DrawSettings,
): Promise<DrawOutcome> {
  const sites = drawSites(prepared, drawIndex, settings);
  const programme = buildProgramme(sites, prepared.scenario.rules, prepared.objective, settings.budget);
  const solution = await solver.solve({
    values: programme.groups.map((group) => group.options.map((option) => option.value)),
    constraints: programme.constraints,
  });
  let planKsiAvoided = 0;
  let planBenefitPV = 0;
  let planLifecycleCostPV = 0;
  planChoice.forEach((index, group) => {
    if (index === null) return;
    const alternative = sites[group]!.alternatives[index]!;
    planKsiAvoided += alternative.ksiAvoided;
    planBenefitPV += alternative.benefitPV;
    planLifecycleCostPV += alternative.lifecycleCostPV;
  });
  const check = checkSolution(programme, planChoice);
  return {
    draw: drawIndex,
    status: solution.status,
    choice: solution.choice,
    optimumObjective: solution.objective,
    planKsiAvoided,
    planBenefitPV,
    planLifecycleCostPV,
    planObjective: check.objective,
    planFeasible: check.feasible,
  };
}
