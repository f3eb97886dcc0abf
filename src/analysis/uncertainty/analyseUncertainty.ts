import { assumedCmfCv, drawnStandardError, hasStandardError } from "../../model/sampleTreatmentCmfs.js";
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

/** How the draws treated the CMF effects of the treatments that some site may get. */
export interface EffectUncertainty {
  /** The scenario's uncertainty.assumedCmfCv (or its default). */
  readonly assumedCmfCv: number | "off";
  readonly total: number;
  /** Drawn with their published standard error. */
  readonly withStandardError: number;
  /** Drawn with the assumed CV: they publish no standard error. */
  readonly withAssumedCv: number;
  /** Held at their CMF in every draw. */
  readonly heldExact: number;
}

/** How the draws treated the baselines of the sites that have at least one alternative. */
export interface BaselineUncertainty {
  /** Drawn from the Jeffreys-prior posterior of their observed counts. */
  readonly observed: number;
  /** Drawn from their Empirical Bayes gamma posterior. */
  readonly empiricalBayes: number;
  /** Held at their point estimate (no posterior for their method, or --fixed-baseline). */
  readonly fixed: number;
}

/** The chosen list and what the draws say about it. */
export interface UncertaintyResult {
  readonly plan: PlanResult;
  readonly draws: number;
  readonly seed: number;
  readonly sampleBaselines: boolean;
  readonly effects: EffectUncertainty;
  readonly baselines: BaselineUncertainty;
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
  return {
    plan,
    draws: options.draws,
    seed: options.seed,
    sampleBaselines: options.sampleBaselines,
    effects: effectUncertainty(prepared),
    baselines: baselineUncertainty(prepared, options.sampleBaselines),
    summary: summariseDraws(plan, outcomes),
  };
}

function effectUncertainty(prepared: PreparedPlan): EffectUncertainty {
  const cv = assumedCmfCv(prepared.scenario);
  const candidateIds = new Set(prepared.sites.flatMap((entry) => entry.alternatives.flatMap((alternative) => alternative.treatments)));
  const effects = prepared.scenario.catalogue.treatments.filter((t) => candidateIds.has(t.id)).flatMap((t) => t.effects);
  const withStandardError = effects.filter(hasStandardError).length;
  const drawn = effects.filter((effect) => drawnStandardError(effect, cv) > 0).length;
  return { assumedCmfCv: cv, total: effects.length, withStandardError, withAssumedCv: drawn - withStandardError, heldExact: effects.length - drawn };
}

// Keyed on each site's own method: a scenario may mix observed and Empirical Bayes sites.
function baselineUncertainty(prepared: PreparedPlan, sampleBaselines: boolean): BaselineUncertainty {
  const methods = prepared.sites.flatMap((entry, index) => (entry.alternatives.length > 0 ? [prepared.baselines[index]!.method] : []));
  if (!sampleBaselines) return { observed: 0, empiricalBayes: 0, fixed: methods.length };
  const observed = methods.filter((method) => method === "observed").length;
  const empiricalBayes = methods.filter((method) => method === "empirical-bayes").length;
  return { observed, empiricalBayes, fixed: methods.length - observed - empiricalBayes };
}
