import type { Alternative } from "../model/types.js";

/** One step up the cost ladder at a site: from a cheaper alternative to a dearer one that benefits more. */
export interface IncrementalStep {
  /** Index into the alternatives given. */
  readonly from: number;
  readonly to: number;
  readonly extraCostPV: number;
  readonly extraBenefitPV: number;
  /** ΔB / ΔC (lifecycle cost PV); Infinity when the dearer one costs no more. */
  readonly incrementalBcRatio: number;
}

/** Incremental benefit-cost analysis of one site's mutually exclusive alternatives. */
export interface IncrementalAnalysis {
  /** The ladder: alternatives by lifecycle cost, each step to the next one that benefits more. */
  readonly steps: readonly IncrementalStep[];
  /** Alternatives left off the ladder because a cheaper one benefits as much or more. */
  readonly dominated: readonly number[];
  /**
   * The economically preferred alternative by the challenger–defender procedure, or null when no
   * alternative has B/C ≥ 1: among alternatives with B/C ≥ 1 in rising cost order, the dearer one
   * replaces the defender only when the incremental B/C between them exceeds 1.
   */
  readonly preferred: number | null;
}

/**
 * Incremental B/C between the alternatives at one site, by the procedure of the Highway Safety
 * Manual (AASHTO, 2010), Part B, Chapter 7 (incremental benefit-cost analysis), as we recall it
 * (from memory): keep alternatives with B/C ≥ 1, order them by cost, and compare each challenger
 * with the current defender by ΔB/ΔC; the dearer one wins only when ΔB/ΔC > 1. Costs are lifecycle
 * cost PV and benefits are benefit PV. The ladder (`steps`) covers every alternative, whatever its
 * own B/C, so a chosen upgrade can be read against the alternative just below it.
 */
export function incrementalBenefitCost(alternatives: readonly Alternative[]): IncrementalAnalysis {
  const order = alternatives.map((_, index) => index).sort((i, j) => alternatives[i]!.lifecycleCostPV - alternatives[j]!.lifecycleCostPV || alternatives[j]!.benefitPV - alternatives[i]!.benefitPV);
  const steps: IncrementalStep[] = [];
  const dominated: number[] = [];
  let current: number | undefined;
  for (const index of order) {
    if (current === undefined) {
      current = index;
      continue;
    }
    const step = incrementalStep(alternatives, current, index);
    if (step.extraBenefitPV <= 0) {
      dominated.push(index);
      continue;
    }
    steps.push(step);
    current = index;
  }
  let preferred: number | null = null;
  for (const index of order) {
    if (!(alternatives[index]!.bcRatio >= 1)) continue;
    if (preferred === null) preferred = index;
    else if (incrementalStep(alternatives, preferred, index).incrementalBcRatio > 1) preferred = index;
  }
  return { steps, dominated, preferred };
}

function incrementalStep(alternatives: readonly Alternative[], from: number, to: number): IncrementalStep {
  const extraCostPV = alternatives[to]!.lifecycleCostPV - alternatives[from]!.lifecycleCostPV;
  const extraBenefitPV = alternatives[to]!.benefitPV - alternatives[from]!.benefitPV;
  return {
    from,
    to,
    extraCostPV,
    extraBenefitPV,
    incrementalBcRatio: extraCostPV > 0 ? extraBenefitPV / extraCostPV : extraBenefitPV > 0 ? Infinity : 0,
  };
}
