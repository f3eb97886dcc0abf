import type { PreparedPlan } from "../preparePlan.js";
import type { DrawSettings } from "./drawSettings.js";
import { evaluateDraw, type DrawOutcome } from "./evaluateDraw.js";

/** Runs the draws with the given indices one after another in this thread, reporting each as it finishes. */
export async function runDraws(
  prepared: PreparedPlan,
  planChoice: readonly (number | null)[],
  drawIndices: readonly number[],
  settings: DrawSettings,
  onDraw: (outcome: DrawOutcome) => void = () => {},
): Promise<DrawOutcome[]> {
  const outcomes: DrawOutcome[] = [];
  for (const drawIndex of drawIndices) {
    const outcome = await evaluateDraw(prepared, planChoice, drawIndex, settings);
    outcomes.push(outcome);
    onDraw(outcome);
  }
  return outcomes;
}
