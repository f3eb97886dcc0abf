import { drawRandomSource } from "../../model/random/drawRandomSource.js";
import { checkSolution, type PreparedProgramme, type SolveStatus } from "../../solver/index.js";
import { buildProgramme, type SiteFigures } from "../buildProgramme.js";
import type { PreparedPlan } from "../preparePlan.js";
import { drawFigures, type DrawnFigures } from "./drawFigures.js";
import type { DrawSettings } from "./drawSettings.js";
import type { DrawTables } from "./drawTables.js";

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
 * Draws every alternative's figures (drawFigures on `tables`), evaluates the chosen list
 * `planChoice` on them, and re-solves `solver` (the scenario's programme, prepared once) with the
 * draw's values and rules for the draw's best list. Costs and lifecycle costs do not change
 * between draws, so they are read from the plan's own alternatives.
 */
export async function evaluateDraw(
  prepared: PreparedPlan,
  tables: DrawTables,
  solver: PreparedProgramme,
  planChoice: readonly (number | null)[],
  drawIndex: number,
  settings: DrawSettings,
): Promise<DrawOutcome> {
  // A K+A objective needs benefits only for the plan's own list (its benefit in the draw).
  let benefitNeeded: Uint8Array | undefined;
  if (prepared.objective === "ksi") {
    benefitNeeded = new Uint8Array(tables.offsets[tables.offsets.length - 1]!);
    planChoice.forEach((index, group) => {
      if (index !== null) benefitNeeded![tables.offsets[group]! + index] = 1;
    });
  }
  const drawn = drawFigures(tables, prepared.scenario.economics, drawRandomSource(settings.seed, drawIndex), benefitNeeded);
  const figures = prepared.objective === "ksi" ? drawn.ksiAvoided : drawn.benefitPV;
  const values = prepared.sites.map((_entry, group) => Array.from(figures.subarray(tables.offsets[group]!, tables.offsets[group + 1]!)));
  // Only a K+A share floor's coefficients follow the drawn values; every other rule is the plan's.
  const constraints = prepared.scenario.rules.some((rule) => rule.kind === "ksi-share-floor")
    ? buildProgramme(drawnSites(prepared, tables, drawn), prepared.scenario.rules, prepared.objective, settings.budget).constraints
    : solver.programme.constraints;
  const solution = await solver.solve({ values, constraints });
  let planKsiAvoided = 0;
  let planBenefitPV = 0;
  let planLifecycleCostPV = 0;
  let planObjective = 0;
  planChoice.forEach((index, group) => {
    if (index === null) return;
    const at = tables.offsets[group]! + index;
    planKsiAvoided += drawn.ksiAvoided[at]!;
    planBenefitPV += drawn.benefitPV[at]!;
    planLifecycleCostPV += prepared.sites[group]!.alternatives[index]!.lifecycleCostPV;
    planObjective += figures[at]!;
  });
  // Costs are the plan's, so only the constraints can make the plan's list break a rule in a draw.
  const check = checkSolution({ ...solver.programme, constraints }, planChoice);
  return {
    draw: drawIndex,
    status: solution.status,
    choice: solution.choice,
    optimumObjective: solution.objective,
    planKsiAvoided,
    planBenefitPV,
    planLifecycleCostPV,
    planObjective,
    planFeasible: check.feasible,
  };
}

/** The sites with this draw's figures, for the rules whose coefficients follow them. */
function drawnSites(prepared: PreparedPlan, tables: DrawTables, drawn: DrawnFigures): SiteFigures[] {
  return prepared.sites.map((entry, group) => {
    const first = tables.offsets[group]!;
    return {
      site: entry.site,
      required: entry.required,
      alternatives: entry.alternatives.map((alternative, index) => ({
        cost: alternative.cost,
        ksiAvoided: drawn.ksiAvoided[first + index]!,
        benefitPV: drawn.benefitPV[first + index]!,
      })),
    };
  });
}
