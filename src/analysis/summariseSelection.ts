import type { Alternative } from "../model/types.js";
import { benefitCostRatio } from "../model/benefitCostRatio.js";

/** Programme totals over a set of chosen alternatives. */
export interface ProgrammeTotals {
  readonly projects: number;
  readonly cost: number;
  readonly ksiAvoided: number;
  readonly ksiAvoidedPerYear: number;
  readonly benefitPV: number;
  readonly lifecycleCostPV: number;
  readonly bcRatio: number;
  readonly npv: number;
  /** Lifecycle cost PV per KSI crash avoided. */
  readonly costPerKsi: number;
}

/** Sums cost, KSI avoided and benefits over the chosen alternatives; ratios are of the sums. */
export function summariseSelection(chosen: readonly Alternative[]): ProgrammeTotals {
  let cost = 0;
  let ksiAvoided = 0;
  let ksiAvoidedPerYear = 0;
  let benefitPV = 0;
  let lifecycleCostPV = 0;
  for (const alternative of chosen) {
    cost += alternative.cost;
    ksiAvoided += alternative.ksiAvoided;
    ksiAvoidedPerYear += alternative.crashesAvoidedPerYear.K + alternative.crashesAvoidedPerYear.A;
    benefitPV += alternative.benefitPV;
    lifecycleCostPV += alternative.lifecycleCostPV;
  }
  return {
    projects: chosen.length,
    cost,
    ksiAvoided,
    ksiAvoidedPerYear,
    benefitPV,
    lifecycleCostPV,
    bcRatio: benefitCostRatio(benefitPV, lifecycleCostPV),
    npv: benefitPV - lifecycleCostPV,
    costPerKsi: ksiAvoided > 0 ? lifecycleCostPV / ksiAvoided : Infinity,
  };
}
