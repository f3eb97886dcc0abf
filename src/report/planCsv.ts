import type { PlanResult } from "../analysis/planProgramme.js";
import { csvPreamble } from "./csvPreamble.js";
import { formatMoney } from "./formatNumber.js";
import { toCsv } from "./toCsv.js";

/**
 * The funded list as CSV for spreadsheets: the two preamble lines (scenario, budget, status,
 * engine; units), then one row per project, units also in the column names.
 */
export function planCsv(result: PlanResult): string {
  const { scenario } = result.prepared;
  const currency = scenario.currency;
  const programme = scenario.programme;
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
    // A programme adds each project's build year and its capital spent in each year.
    ...(programme === undefined ? [] : ["build_year", ...Array.from({ length: programme.years }, (_, y) => `spend_${programme.firstYear + y}_${currency}`)]),
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
    ...(programme === undefined ? [] : [alternative.buildYear ?? "", ...Array.from({ length: programme.years }, (_, y) => alternative.spendByYear?.[y] ?? 0)]),
  ]);
  const preamble = csvPreamble(
    [`plan of scenario ${scenario.name}`, `budget ${formatMoney(result.budget)} ${currency}`, `objective ${result.prepared.objective}`, `status ${result.solution.status}`, `engine ${result.solution.engine}`, `${result.funded.length} projects`],
    [
      `money in ${currency} (whole currency units, not thousands; PV at ${(scenario.economics.discountRate * 100).toFixed(1)}% over ${scenario.economics.horizonYears} years)`,
      "ksi_avoided: K+A crashes avoided over each project's service life within the horizon (crashes, not people)",
      "bc_ratio: benefit PV / lifecycle cost PV (blank where undefined)",
      ...(programme === undefined ? [] : [`programme ${programme.firstYear}-${programme.firstYear + programme.years - 1}, carry-over ${programme.carryOver}: PV discounted to ${programme.firstYear}; spend_YEAR is capital spent that year by the project's phasing (escalated)`]),
    ],
  );
  return preamble + toCsv(header, rows);
}
