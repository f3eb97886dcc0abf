import type { FrontierSummary } from "../analysis/summariseFrontier.js";
import { toCsv } from "./toCsv.js";

/** The budget frontier as CSV: one row per budget level, units in the header. */
export function frontierCsv(summary: FrontierSummary, currency: string): string {
  const header = [
    `budget_${currency}`,
    "status",
    `spend_${currency}`,
    "projects",
    "ksi_avoided",
    `benefit_pv_${currency}`,
    "bc_ratio",
    "marginal_ksi_per_1m",
    "below_half_first_1m",
  ];
  const rows = summary.rows.map((row) => [
    row.budget,
    row.status,
    row.spend,
    row.projects,
    row.ksiAvoided,
    row.benefitPV,
    row.bcRatio,
    row.marginalKsiPerMillion,
    row.diminishing ? "yes" : "no",
  ]);
  return toCsv(header, rows);
}
