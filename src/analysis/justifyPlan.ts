import type { Alternative } from "../model/types.js";
import { objectiveValue } from "./buildProgramme.js";
import { lpBudgetMarginalValue } from "../solver/index.js";
import type { PlanResult } from "./planProgramme.js";
import { byBcRatioDescending } from "../model/benefitCostRatio.js";

/** A funded project's case: its economics and where it stands by B/C among the funded. */
export interface FundedCase {
  readonly site: string;
  readonly name: string;
  readonly treatments: readonly string[];
  readonly bcRatio: number;
  readonly npv: number;
  readonly costPerKsi: number;
  /** 1 = the highest B/C among funded projects (ties share the order of the list). */
  readonly bcRank: number;
  /** Other alternatives at this site, not chosen because this one was. */
  readonly alternativesNotChosen: number;
  /** Crash cells where two or more of its treatments act together (their combined CMF is the scenario's combination rule, not a measured effect). */
  readonly sharedCrashCells: number;
}

/** Why a candidate site is not on the list. */
export type NotFundedReason =
  | "excluded" // a never-fund rule removed every alternative
  | "no-alternatives" // no candidate treatments listed, or none applies
  | "no-effect" // no alternative avoids anything the objective counts
  | "bc-below-1" // its best alternative's B/C is below 1
  | "budget"; // it would pay its way but the money went further elsewhere

/**
 * How far a left-out alternative is from entering at this budget (LP reduced-cost argument):
 * it enters the LP optimum once value − λ·cost exceeds the site's contribution from its other
 * alternatives, max(0, max over them of value − λ·cost).
 */
export interface EntryThreshold {
  readonly treatments: readonly string[];
  readonly cost: number;
  /** Objective value (KSI avoided, or benefit PV). */
  readonly value: number;
  /** The cost at or below which it enters: (value − other contribution) / λ. */
  readonly costThreshold: number;
  /** How much cheaper it would need to be (0 when already within the threshold). */
  readonly costCut: number;
  /** How much more it would need to avoid at its cost, in objective units (0 when already within). */
  readonly extraValueNeeded: number;
}

/** A site not on the list, with the reason in plain words and, when the budget is why, the threshold. */
export interface NotFundedCase {
  readonly site: string;
  readonly name: string;
  readonly reason: NotFundedReason;
  readonly explanation: string;
  readonly bestBcRatio: number | null;
  /** The alternative closest to entering (smallest cost cut), when λ is known and the site has options. */
  readonly threshold: EntryThreshold | null;
}

/** The case for the list: funded projects ranked by B/C, reasons for the rest, and the margin's price. */
export interface PlanJustification {
  readonly funded: readonly FundedCase[];
  readonly notFunded: readonly NotFundedCase[];
  /** λ: objective (K+A crashes avoided, or benefit PV) gained per extra currency unit of budget at the LP optimum; null when unknown. */
  readonly budgetMarginalValue: number | null;
  /** Where λ came from. */
  readonly marginalValueSource: "solver" | "lp-relaxation" | "unavailable";
  readonly method: string;
}

export const THRESHOLD_METHOD =
  "LP reduced-cost argument: with λ the budget's marginal value at the LP-relaxation optimum, a left-out alternative enters the LP optimum once " +
  "value − λ × cost exceeds what its site already contributes (max(0, value − λ × cost) over the site's other alternatives); so it enters once its cost " +
  "falls below (value − contribution) / λ, or its value rises above contribution + λ × cost. Limits: this is exact for the LP relaxation only; the " +
  "integer list can differ near the margin: read a threshold as about the least change needed, since an alternative just past it may still not fit " +
  "the money freed by dropping whole projects (in our seeded tests a cut 1% past the threshold brought the alternative in about a third of the time, " +
  "twice the cut about 85%, while half the cut kept it out 97% of the time); policy rules other than the budget also price the margin, so thresholds are not given when rules bind through side constraints.";

/**
 * The case for each funded project (B/C, NPV, cost per KSI, rank by B/C) and the reason each
 * other candidate site is not funded: excluded by a rule, no effect, best B/C below 1, or the
 * budget, with the entry threshold from λ (see THRESHOLD_METHOD). λ comes from the solver when
 * it reports one, otherwise from the LP relaxation of a programme without side constraints.
 */
export function justifyPlan(result: PlanResult): PlanJustification {
  const { prepared, programme, solution } = result;
  const objective = prepared.objective;
  const fromSolver = Number.isFinite(solution.budgetMarginalValue) ? solution.budgetMarginalValue : undefined;
  const lambda = fromSolver ?? lpBudgetMarginalValue(programme);
  const source = fromSolver !== undefined ? "solver" : lambda !== undefined ? "lp-relaxation" : "unavailable";

  const byBc = [...result.funded].sort((x, y) => byBcRatioDescending(x.alternative.bcRatio, y.alternative.bcRatio));
  const rank = new Map(byBc.map((project, index) => [project.entry.site.id, index + 1]));
  const funded: FundedCase[] = result.funded.map(({ entry, alternative }) => ({
    site: entry.site.id,
    name: entry.site.name,
    treatments: alternative.treatments,
    bcRatio: alternative.bcRatio,
    npv: alternative.npv,
    costPerKsi: alternative.costPerKsi,
    bcRank: rank.get(entry.site.id)!,
    alternativesNotChosen: entry.alternatives.length - 1,
    sharedCrashCells: alternative.sharedCells,
  }));

  const fundedSites = new Set(result.funded.map((project) => project.entry.site.id));
  const notFunded: NotFundedCase[] = [];
  for (const entry of prepared.sites) {
    if (fundedSites.has(entry.site.id)) continue;
    const base = { site: entry.site.id, name: entry.site.name };
    if (entry.alternatives.length === 0) {
      notFunded.push(
        entry.excludedBy !== undefined
          ? { ...base, reason: "excluded", explanation: `excluded by a rule (${entry.excludedBy})`, bestBcRatio: null, threshold: null }
          : { ...base, reason: "no-alternatives", explanation: entry.site.candidates.length === 0 ? "no candidate treatments are listed for this site, so it cannot be funded" : "no candidate treatment applies to this site", bestBcRatio: null, threshold: null },
      );
      continue;
    }
    const bestBc = entry.alternatives.map((alternative) => alternative.bcRatio).sort(byBcRatioDescending)[0]!;
    const threshold = lambda === undefined ? null : entryThreshold(entry.alternatives, objective, lambda);
    if (entry.alternatives.every((alternative) => objectiveValue(alternative, objective) <= 0)) {
      notFunded.push({ ...base, reason: "no-effect", explanation: `no alternative avoids any ${objective === "ksi" ? "K+A crash" : "crash cost"}`, bestBcRatio: bestBc, threshold: null });
    } else if (bestBc < 1) {
      notFunded.push({ ...base, reason: "bc-below-1", explanation: `its best alternative has B/C ${bestBc.toFixed(2)}, below 1`, bestBcRatio: bestBc, threshold });
    } else {
      notFunded.push({ ...base, reason: "budget", explanation: budgetExplanation(threshold, objective), bestBcRatio: bestBc, threshold });
    }
  }
  return { funded, notFunded, budgetMarginalValue: lambda ?? null, marginalValueSource: source, method: THRESHOLD_METHOD };
}

/** The alternative closest to entering at marginal value λ, by the LP reduced-cost argument. */
export function entryThreshold(alternatives: readonly Alternative[], objective: "ksi" | "benefit", lambda: number): EntryThreshold | null {
  let best: EntryThreshold | null = null;
  alternatives.forEach((alternative, index) => {
    const value = objectiveValue(alternative, objective);
    const contribution = Math.max(0, ...alternatives.filter((_, other) => other !== index).map((other) => objectiveValue(other, objective) - lambda * other.cost));
    // With λ = 0 money is not what binds: any alternative worth more than the site's contribution enters.
    const costThreshold = lambda > 0 ? (value - contribution) / lambda : value > contribution ? Infinity : -Infinity;
    const candidate: EntryThreshold = {
      treatments: alternative.treatments,
      cost: alternative.cost,
      value,
      costThreshold,
      costCut: Math.max(0, alternative.cost - costThreshold),
      extraValueNeeded: Math.max(0, contribution + lambda * alternative.cost - value),
    };
    if (best === null || candidate.costCut < best.costCut) best = candidate;
  });
  return best;
}

function budgetExplanation(threshold: EntryThreshold | null, objective: "ksi" | "benefit"): string {
  if (threshold === null) return "the budget, or a policy rule, left it out (no threshold: λ is unknown when rules bind through side constraints)";
  if (threshold.costCut <= 0) return "the budget ran out at the margin: past its LP threshold, but it does not fit the money left (an integer effect)";
  const what = objective === "ksi" ? "K+A crashes" : "benefit PV";
  const extra = objective === "ksi" ? threshold.extraValueNeeded.toFixed(2) : Math.round(threshold.extraValueNeeded).toLocaleString("en-US");
  // A threshold at or below zero means no price cut alone brings it in.
  if (threshold.costThreshold <= 0) return `the budget ran out: ${threshold.treatments.join(" + ")} would enter only if it avoided at least ${extra} more ${what} at its cost; no price cut alone is enough`;
  return (
    `the budget ran out: ${threshold.treatments.join(" + ")} would need to cost at most about ${Math.round(threshold.costThreshold).toLocaleString("en-US")} ` +
    `(at least ${Math.round(threshold.costCut).toLocaleString("en-US")} cheaper), or to avoid at least ${extra} more ${what}, to enter`
  );
}
