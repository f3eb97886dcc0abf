import type { SolveOptions } from "../../solver/index.js";
import { planProgramme, type PlanResult } from "../planProgramme.js";
import { preparePlan } from "../preparePlan.js";
import { summariseSelection } from "../summariseSelection.js";
import { sensitivityVariations } from "./sensitivityVariations.js";

/** The chosen list, and the re-optimised list, with one parameter moved. */
export interface SensitivityCase {
  readonly label: string;
  /** The chosen list's KSI avoided and B/C with the parameter moved, and their change from base. */
  readonly ksiAvoided: number;
  readonly ksiAvoidedChange: number;
  readonly bcRatio: number;
  readonly bcRatioChange: number;
  /** Whether re-optimising with the parameter moved picks a different list. */
  readonly listChanges: boolean;
  /** Site-alternatives that enter and leave the list when re-optimised. */
  readonly entering: readonly string[];
  readonly leaving: readonly string[];
}

/** One parameter's low and high cases. */
export interface SensitivityRow {
  readonly parameter: string;
  readonly base: string;
  readonly low: SensitivityCase;
  readonly high: SensitivityCase;
}

/** One-at-a-time sensitivity of the chosen list, widest KSI swing first (then widest B/C swing). */
export interface SensitivityResult {
  readonly baseKsiAvoided: number;
  readonly baseBcRatio: number;
  readonly rows: readonly SensitivityRow[];
}

function projectKey(plan: PlanResult, group: number, index: number): string {
  const entry = plan.prepared.sites[group]!;
  return `${entry.site.id}: ${entry.alternatives[index]!.treatments.join(" + ")}`;
}

/**
 * Moves each parameter of `sensitivityVariations` to its low and high value, re-evaluates the
 * chosen list of `plan` with the model's own functions and re-solves the programme at the plan's budget.
 */
export async function oneAtATimeSensitivity(plan: PlanResult, solveOptions: Partial<SolveOptions> = {}): Promise<SensitivityResult> {
  const { prepared } = plan;
  const candidates = new Set(prepared.sites.flatMap((entry) => entry.alternatives.flatMap((a) => a.treatments)));
  const baseChoice = plan.solution.choice;
  const evaluate = async (label: string, scenario: typeof prepared.scenario): Promise<SensitivityCase> => {
    const moved = preparePlan(scenario, prepared.objective);
    const chosen = baseChoice.flatMap((index, group) => {
      if (index === null) return [];
      const alternative = moved.sites[group]!.alternatives[index]!;
      if (alternative.treatments.join("+") !== prepared.sites[group]!.alternatives[index]!.treatments.join("+")) {
        throw new RangeError(`alternatives changed order at site ${moved.sites[group]!.site.id}`);
      }
      return [alternative];
    });
    const totals = summariseSelection(chosen);
    const reoptimised = await planProgramme(moved, plan.budget, solveOptions);
    const entering: string[] = [];
    const leaving: string[] = [];
    reoptimised.solution.choice.forEach((index, group) => {
      const before = baseChoice[group] ?? null;
      if (index === before) return;
      if (index !== null) entering.push(projectKey(plan, group, index));
      if (before !== null) leaving.push(projectKey(plan, group, before));
    });
    return {
      label,
      ksiAvoided: totals.ksiAvoided,
      ksiAvoidedChange: totals.ksiAvoided - plan.totals.ksiAvoided,
      bcRatio: totals.bcRatio,
      bcRatioChange: totals.bcRatio - plan.totals.bcRatio,
      listChanges: entering.length + leaving.length > 0,
      entering,
      leaving,
    };
  };
  const rows: SensitivityRow[] = [];
  for (const variation of sensitivityVariations(prepared.scenario, candidates)) {
    rows.push({
      parameter: variation.parameter,
      base: variation.base,
      low: await evaluate(variation.low.label, variation.low.scenario),
      high: await evaluate(variation.high.label, variation.high.scenario),
    });
  }
  const swing = (row: SensitivityRow, key: "ksiAvoidedChange" | "bcRatioChange") => Math.max(Math.abs(row.low[key]), Math.abs(row.high[key]));
  // Stable sort: ties keep the order of sensitivityVariations.
  rows.sort((a, b) => swing(b, "ksiAvoidedChange") - swing(a, "ksiAvoidedChange") || swing(b, "bcRatioChange") - swing(a, "bcRatioChange"));
  return { baseKsiAvoided: plan.totals.ksiAvoided, baseBcRatio: plan.totals.bcRatio, rows };
}
