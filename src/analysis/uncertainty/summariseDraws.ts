import { quantileSorted } from "../../model/quantile.js";
import type { SolveStatus } from "../../solver/index.js";
import type { PlanResult } from "../planProgramme.js";
import type { DrawOutcome } from "./evaluateDraw.js";
import { shakyProjects, type ShakyProject } from "./shakyProjects.js";

/** Selected in at least this share of draws: the core of the list. */
export const CORE_PROBABILITY = 0.9;
/** Selected in at least this share (and below the core's): marginal; below it: rarely best. */
export const MARGINAL_PROBABILITY = 0.1;

/** Mean and 5th, 50th and 95th percentiles (Hyndman–Fan type 7) of a quantity over the draws. */
export interface Spread {
  readonly mean: number;
  readonly p5: number;
  readonly p50: number;
  readonly p95: number;
}

export type SelectionClass = "core" | "marginal" | "rare";

/** How often one site-alternative is in the best list of a draw. */
export interface SelectionFrequency {
  readonly site: string;
  readonly alternativeIndex: number;
  readonly treatments: readonly string[];
  /** Share of solved draws whose best list includes it. */
  readonly probability: number;
  readonly inPlan: boolean;
  readonly class: SelectionClass;
}

/** What the draws say about the chosen list. */
export interface DrawSummary {
  readonly draws: number;
  /** Draws whose re-optimisation returned a list (optimal or time-limit). */
  readonly solvedDraws: number;
  readonly statusCounts: Readonly<Record<SolveStatus, number>>;
  readonly planKsiAvoided: Spread;
  readonly planBenefitPV: Spread;
  readonly planBcRatio: Spread;
  /** Share of draws in which the chosen list's benefit PV exceeds its lifecycle cost PV. */
  readonly probabilityBcAboveOne: number;
  /** Draws in which the chosen list breaks a rule (only KSI-share floors depend on the draw). */
  readonly planInfeasibleDraws: number;
  /** Best list's objective minus the chosen list's, per solved draw (objective units). */
  readonly regret: Spread;
  /** Every site-alternative in the plan or selected in some draw, most often selected first. */
  readonly selections: readonly SelectionFrequency[];
  /** Funded projects selected in fewer than half of the draws' best lists, largest cost first, with what replaces them. */
  readonly shaky: readonly ShakyProject[];
}

/** Spread of values (any order). */
export function spreadOf(values: readonly number[]): Spread {
  const sorted = [...values].sort((a, b) => a - b);
  return {
    mean: values.reduce((total, value) => total + value, 0) / values.length,
    p5: quantileSorted(sorted, 0.05),
    p50: quantileSorted(sorted, 0.5),
    p95: quantileSorted(sorted, 0.95),
  };
}

function classify(probability: number): SelectionClass {
  return probability >= CORE_PROBABILITY ? "core" : probability >= MARGINAL_PROBABILITY ? "marginal" : "rare";
}

/**
 * Summarises draw outcomes (in draw order, so sums are the same whatever thread ran them):
 * the chosen list's KSI avoided, benefit PV and B/C spreads, P(B/C > 1), each site-alternative's
 * selection probability with its class (core ≥ 90%, marginal ≥ 10%, rare), the regret, and the
 * shaky funded projects (`shakyProjects`).
 */
export function summariseDraws(plan: PlanResult, outcomes: readonly DrawOutcome[]): DrawSummary {
  if (outcomes.length === 0) throw new RangeError("no draws to summarise");
  const ordered = [...outcomes].sort((a, b) => a.draw - b.draw);
  const statusCounts: Record<SolveStatus, number> = { optimal: 0, "time-limit": 0, infeasible: 0, "not-solved": 0 };
  const sites = plan.prepared.sites;
  const counts = sites.map((entry) => new Array<number>(entry.alternatives.length).fill(0));
  const regrets: number[] = [];
  for (const outcome of ordered) {
    statusCounts[outcome.status] += 1;
    if (outcome.status !== "optimal" && outcome.status !== "time-limit") continue;
    outcome.choice.forEach((index, group) => {
      if (index !== null) counts[group]![index]! += 1;
    });
    regrets.push(outcome.optimumObjective - outcome.planObjective);
  }
  const solvedDraws = regrets.length;
  const planIndex = plan.solution.choice;
  const selections: SelectionFrequency[] = [];
  sites.forEach((entry, group) => {
    entry.alternatives.forEach((alternative, index) => {
      const count = counts[group]![index]!;
      const inPlan = planIndex[group] === index;
      if (count === 0 && !inPlan) return;
      const probability = solvedDraws > 0 ? count / solvedDraws : 0;
      selections.push({ site: entry.site.id, alternativeIndex: index, treatments: alternative.treatments, probability, inPlan, class: classify(probability) });
    });
  });
  selections.sort((a, b) => b.probability - a.probability || Number(b.inPlan) - Number(a.inPlan) || (a.site < b.site ? -1 : a.site > b.site ? 1 : 0) || a.alternativeIndex - b.alternativeIndex);
  const bcRatios = ordered.map((o) => (o.planLifecycleCostPV > 0 ? o.planBenefitPV / o.planLifecycleCostPV : 0));
  return {
    draws: ordered.length,
    solvedDraws,
    statusCounts,
    planKsiAvoided: spreadOf(ordered.map((o) => o.planKsiAvoided)),
    planBenefitPV: spreadOf(ordered.map((o) => o.planBenefitPV)),
    planBcRatio: spreadOf(bcRatios),
    probabilityBcAboveOne: bcRatios.filter((ratio) => ratio > 1).length / ordered.length,
    planInfeasibleDraws: ordered.filter((o) => !o.planFeasible).length,
    regret: solvedDraws > 0 ? spreadOf(regrets) : { mean: Number.NaN, p5: Number.NaN, p50: Number.NaN, p95: Number.NaN },
    selections,
    shaky: shakyProjects(plan, ordered),
  };
}
