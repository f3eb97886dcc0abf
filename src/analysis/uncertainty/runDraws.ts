import { prepareProgramme } from "../../solver/index.js";
import { buildProgramme } from "../buildProgramme.js";
import type { PreparedPlan } from "../preparePlan.js";
import type { DrawSettings } from "./drawSettings.js";
import { buildDrawTables } from "./drawTables.js";
import { evaluateDraw, type DrawOutcome } from "./evaluateDraw.js";

/**
 * Runs the draws with the given indices one after another in this thread, reporting each as it
 * finishes. One prepared programme and one set of draw tables serve every draw: only option
 * values (and value-dependent rules) change between draws, so the site order, budget layout and
 * draw tables are built once.
 */
export async function runDraws(
  prepared: PreparedPlan,
  planChoice: readonly (number | null)[],
  drawIndices: readonly number[],
  settings: DrawSettings,
  onDraw: (outcome: DrawOutcome) => void = () => {},
): Promise<DrawOutcome[]> {
  const outcomes: DrawOutcome[] = [];
  const tables = buildDrawTables(prepared, settings.sampleBaselines);
  const solver = prepareProgramme(buildProgramme(prepared.sites, prepared.scenario.rules, prepared.objective, settings.budget), settings.solveOptions);
  for (const drawIndex of drawIndices) {
    const outcome = await evaluateDraw(prepared, tables, solver, planChoice, drawIndex, settings);
    outcomes.push(outcome);
    onDraw(outcome);
  }
  return outcomes;
}
