import type { ComparedProject, PlanComparison } from "../analysis/comparePlans.js";
import type { ProgrammeTotals } from "../analysis/summariseSelection.js";
import type { CompareLabels } from "./compareTable.js";
import { csvPreamble } from "./csvPreamble.js";
import { formatFixed, formatMoney } from "./formatNumber.js";
import { toCsv } from "./toCsv.js";

/**
 * A what-if comparison as CSV: the preamble (both sides with status and totals; units), then one
 * row per site that enters, leaves or changes treatment between list A and list B.
 */
export function compareCsv(comparison: PlanComparison, labels: CompareLabels): string {
  const currency = labels.currency;
  const side = (name: string, label: string, status: string, totals: ProgrammeTotals) =>
    `${name}: ${label}, ${status}, ${totals.projects} projects, spend ${formatMoney(totals.cost)}, ${formatFixed(totals.ksiAvoided, 2)} K+A crashes avoided`;
  // Programmes add each side's build year.
  const years = [...comparison.entering, ...comparison.leaving, ...comparison.changed.flatMap((c) => [c.before, c.after]), ...comparison.moved.map((c) => c.after)].some((p) => p.buildYear !== undefined);
  const preamble = csvPreamble(
    ["comparison", side("A", labels.a, comparison.sideA.status, comparison.totalsA), side("B", labels.b, comparison.sideB.status, comparison.totalsB)],
    [`money in ${currency} (whole currency units, not thousands)`, "ksi_avoided: K+A crashes avoided over each project's service life within the horizon (crashes, not people)", `change: enters (in B only), leaves (in A only), changes treatment (in both)${years ? ", moves year (same treatments, another build year)" : ""}`],
  );
  const header = ["site_id", "site_name", "change", "treatments_a", "treatments_b", `cost_a_${currency}`, `cost_b_${currency}`, "ksi_avoided_a", "ksi_avoided_b", ...(years ? ["build_year_a", "build_year_b"] : [])];
  const row = (change: string, site: string, name: string, a: ComparedProject | undefined, b: ComparedProject | undefined) => [
    site,
    name,
    change,
    a?.treatments.join(" + "),
    b?.treatments.join(" + "),
    a?.cost,
    b?.cost,
    a?.ksiAvoided,
    b?.ksiAvoided,
    ...(years ? [a?.buildYear, b?.buildYear] : []),
  ];
  const rows = [
    ...comparison.entering.map((project) => row("enters", project.site, project.name, undefined, project)),
    ...comparison.leaving.map((project) => row("leaves", project.site, project.name, project, undefined)),
    ...comparison.changed.map((change) => row("changes treatment", change.site, change.name, change.before, change.after)),
    ...comparison.moved.map((change) => row("moves year", change.site, change.name, change.before, change.after)),
  ];
  return preamble + toCsv(header, rows);
}
