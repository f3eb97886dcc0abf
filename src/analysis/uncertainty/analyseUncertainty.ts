import { hasStandardError } from "../../model/sampleTreatmentCmfs.js";
import type { SolveOptions } from "../../solver/index.js";
import { planProgramme, type PlanResult } from "../planProgramme.js";
import type { PreparedPlan } from "../preparePlan.js";
import type { DrawSettings } from "./drawSettings.js";
import { runDrawsInParallel } from "./runDrawsInParallel.js";
import { summariseDraws, type DrawSummary } from "./summariseDraws.js";

/** How an uncertainty run is set up. */
export interface UncertaintyOptions {
  readonly draws: number;
  readonly seed: number;
  /** Threads to spread the draws over; the result does not depend on it. */
  readonly threads: number;
  readonly sampleBaselines: boolean;
  readonly budget: number;
  readonly solveOptions: Partial<SolveOptions>;
  readonly onProgress?: (done: number, total: number) => void;
}

/** The chosen list and what the draws say about it. */
export interface UncertaintyResult {
  readonly plan: PlanResult;
  readonly draws: number;
  readonly seed: number;
  readonly sampleBaselines: boolean;
  /** Effects (of treatments that some site may get) whose CMF was drawn, and those held at their CMF. */
  readonly effectsWithStandardError: number;
  readonly effectsWithoutStandardError: number;
  /** Sites whose baseline method has no posterior to draw from, held at their point estimate. */
  readonly sitesWithFixedBaseline: number;
  readonly summary: DrawSummary;
}

/**
 * Solves the plan at `budget`, then runs `draws` Monte Carlo draws of CMFs (and baselines), each
 * re-evaluating the chosen list and re-optimising, and summarises them.
 */
export async function analyseUncertainty(prepared: PreparedPlan, options: UncertaintyOptions): Promise<UncertaintyResult> {
  const plan = await planProgramme(prepared, options.budget, options.solveOptions);
  const settings: DrawSettings = {
    seed: options.seed,
    sampleBaselines: options.sampleBaselines,
    budget: options.budget,
    solveOptions: options.solveOptions,
  };
  const outcomes = await runDrawsInParallel(prepared, plan.solution.choice, options.draws, options.threads, settings, (done) =>
    options.onProgress?.(done, options.draws),
  );
  const candidateIds = new Set(prepared.sites.flatMap((entry) => entry.alternatives.flatMap((alternative) => alternative.treatments)));
  const effects = prepared.scenario.catalogue.treatments.filter((t) => candidateIds.has(t.id)).flatMap((t) => t.effects);
  const withError = effects.filter(hasStandardError).length;
  return {
    plan,
    draws: options.draws,
    seed: options.seed,
    sampleBaselines: options.sampleBaselines,
    effectsWithStandardError: withError,
    effectsWithoutStandardError: effects.length - withError,
    sitesWithFixedBaseline: options.sampleBaselines
      ? prepared.sites.filter((entry, index) => entry.alternatives.length > 0 && prepared.baselines[index]!.method !== "observed").length
      : prepared.sites.filter((entry) => entry.alternatives.length > 0).length,
    summary: summariseDraws(plan, outcomes),
  };
}
