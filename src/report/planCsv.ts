import type { PlanResult } from "../analysis/planProgramme.js";
import { toCsv } from "./toCsv.js";

/** The funded list as CSV for spreadsheets: one row per project, units in the header. */
export function planCsv(result: PlanResult): string {
  const currency = result.prepared.scenario.currency;
  const header = [
    "site_id",
    "site_name",
    "kind",
    "district",
    "treatments",
    `capital_cost_${currency}`,
    `lifecycle_cost_pv_${currency}`,
    "ksi_avoided",
    `benefit_pv_${currency}`,
    "bc_ratio",
    `npv_${currency}`,
    `cost_per_ksi_${currency}`,
    "must_fund",
    "baseline",
    "shared_crash_cells",
  ];
  const methodBySite = new Map(result.prepared.baselines.map((baseline) => [baseline.site, baseline.method]));
  const rows = result.funded.map(({ entry, alternative }) => [
    entry.site.id,
    entry.site.name,
    entry.site.kind,
    entry.site.district,
    alternative.treatments.join(" + "),
    alternative.cost,
    alternative.lifecycleCostPV,
    alternative.ksiAvoided,
    alternative.benefitPV,
    alternative.bcRatio,
    alternative.npv,
    alternative.costPerKsi,
    entry.required ? "yes" : "no",
    methodBySite.get(entry.site.id) ?? "",
    alternative.sharedCells,
  ]);
  return toCsv(header, rows);
}
