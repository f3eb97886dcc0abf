import type { ProgrammeTotals } from "../analysis/summariseSelection.js";
import { jsonNumber } from "./formatNumber.js";

/** Programme totals as plain JSON (ratios that are undefined or infinite become null). */
export interface TotalsJson {
  readonly projects: number;
  readonly cost: number;
  readonly ksiAvoided: number;
  readonly ksiAvoidedPerYear: number;
  readonly benefitPV: number;
  readonly lifecycleCostPV: number;
  readonly bcRatio: number | null;
  readonly npv: number;
  readonly costPerKsi: number | null;
}

/** The one JSON shape of programme totals, shared by `plan --format json` and the report's slider. */
export function totalsJson(totals: ProgrammeTotals): TotalsJson {
  return {
    projects: totals.projects,
    cost: totals.cost,
    ksiAvoided: totals.ksiAvoided,
    ksiAvoidedPerYear: totals.ksiAvoidedPerYear,
    benefitPV: totals.benefitPV,
    lifecycleCostPV: totals.lifecycleCostPV,
    bcRatio: jsonNumber(totals.bcRatio),
    npv: totals.npv,
    costPerKsi: jsonNumber(totals.costPerKsi),
  };
}
