import type { FrontierSummary } from "../analysis/summariseFrontier.js";
import { csvPreamble } from "./csvPreamble.js";
import type { FrontierContext } from "./frontierTable.js";
import { formatMoney } from "./formatNumber.js";
import { toCsv } from "./toCsv.js";

/** The budget frontier as CSV: the preamble (scenario; units), then one row per budget level, units also in the column names. */
export function frontierCsv(summary: FrontierSummary, context: FrontierContext): string {
  const { currency } = context;
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
  const preamble = csvPreamble(
    [`budget frontier of scenario ${context.scenarioName}`, `objective ${context.objective}`, `scenario budget ${formatMoney(context.scenarioBudget)} ${currency}`, `${summary.rows.length} levels`],
    [
      `money in ${currency} (whole currency units, not thousands)`,
      "ksi_avoided: K+A crashes avoided by the optimal list at the level (crashes, not people)",
      `marginal_ksi_per_1m: K+A crashes avoided per extra 1,000,000 ${currency} since the previous solved level; blank where undefined`,
    ],
  );
  return preamble + toCsv(header, rows);
}
