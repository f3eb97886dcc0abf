import type { PlanCase } from "../../analysis/casePlan.js";
import type { PlanResult } from "../../analysis/planProgramme.js";
import { CAUTIONS } from "../cautions.js";
import { rankingComparisonText } from "../rankingComparisonText.js";
import { ASSUMPTIONS_NOTE } from "./assumptionsSheet.js";
import { cellAddress, sheetReference } from "./cellAddress.js";
import { CAPITAL_LIST_SHEET, type CapitalListTotals } from "./capitalListSheet.js";
import type { Cell, NumberFormat, SheetSpec } from "./workbookTypes.js";

export const SUMMARY_SHEET = "Summary";

export const FORMULA_NOTE =
  "P/A factors are the handbook expression (1 − (1 + i)^−n) ÷ i written out, not the spreadsheet's PV function; span present-worth factors are the geometric-gradient series " +
  "q^(start+1) × (1 − q^(end−start)) ÷ (1 − q) with q = G ÷ (1 + i), G the site's crash growth a year. The sheets 'Benefit streams' and 'Cost streams' hold every term.";

const TOTALS: readonly [string, string, NumberFormat][] = [
  ["Capital cost", "Capital cost", "money"],
  ["Upkeep a year", "Upkeep a year", "money"],
  ["K+A crashes avoided", "K+A crashes avoided", "crashes"],
  ["Benefit PV", "Benefit PV", "money"],
  ["Lifecycle cost PV", "Lifecycle cost PV", "money"],
  ["B/C", "B/C", "ratio"],
  ["NPV", "NPV", "money"],
  ["Cost per K+A crash avoided", "Cost per K+A crash avoided", "money"],
];

/** The front sheet: what was planned, how sure the solver is, the list's totals (formulas over the Capital list), the ranking comparison and the cautions. */
export function summarySheet(plan: PlanResult, planCase: PlanCase | undefined, totals: CapitalListTotals, totalsCells: readonly Cell[]): SheetSpec {
  const { scenario, objective } = plan.prepared;
  const { solution } = plan;
  const rows: Cell[][] = [
    [{ value: "averta capital list workbook", bold: true }],
    ["Scenario", scenario.name],
    ["Currency", scenario.currency],
    ["Budget", { value: plan.budget, format: "money" }],
    ["Objective", objective === "ksi" ? "ksi: K+A crashes avoided" : "benefit: monetised benefit PV"],
    ["Status", solution.diagnosis === undefined ? solution.status : `${solution.status}: ${solution.diagnosis}`],
    ["Bound on the objective", Number.isFinite(solution.bound) ? { value: solution.bound, format: objective === "ksi" ? "crashes" : "money" } : "not known"],
    ["Gap to the bound", Number.isFinite(solution.gap) ? { value: solution.gap, format: "rate" } : "not known"],
    ["Engine", solution.engine],
    ["Projects funded", plan.totals.projects],
  ];
  for (const [label, header, format] of TOTALS) {
    const column = totals.columns.get(header)!;
    const cached = totalsCells[column - 1];
    const result = typeof cached === "object" && cached !== null && "result" in cached ? cached.result : "";
    rows.push([label, { formula: sheetReference(CAPITAL_LIST_SHEET, cellAddress(totals.row, column)), result, format }]);
  }
  if (plan.years !== undefined) {
    rows.push([], [{ value: "Programme by year", bold: true }], ["Year", "Budget", "Spent", "Unspent", "Projects", "K+A crashes avoided"]);
    for (const year of plan.years) rows.push([year.year, { value: year.budget, format: "money" }, { value: year.spend, format: "money" }, { value: year.unspent, format: "money" }, year.projects, { value: year.ksiAvoided, format: "crashes" }]);
  }
  if (planCase !== undefined) {
    const text = rankingComparisonText(planCase);
    rows.push([], [{ value: "The optimal list against the B/C ranking", bold: true }], [text.asTheyStand], [text.atRankingSpend], [text.extended]);
    if (text.split !== null) rows.push([text.split]);
  }
  rows.push([], [{ value: "Cautions", bold: true }], ...CAUTIONS.map((caution) => [caution]));
  rows.push([], [{ value: "How to read this workbook", bold: true }], [ASSUMPTIONS_NOTE], [FORMULA_NOTE]);
  return { name: SUMMARY_SHEET, rows, frozenRows: 1 };
}
