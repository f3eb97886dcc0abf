import type { FrontierLevel } from "../../analysis/budgetFrontier.js";
import type { Cell, NumberFormat, SheetSpec } from "./workbookTypes.js";

export const BUDGET_LEVELS_SHEET = "Budget levels";
const HEADER_ROW = 3;
const HEADERS = ["Budget", "Status", "Projects", "Capital spent", "K+A crashes avoided", "Benefit PV", "Lifecycle cost PV", "B/C", "NPV", "Cost per K+A crash avoided", "Gap to the bound"];
const FORMATS: (NumberFormat | undefined)[] = ["money", undefined, "count", "money", "crashes", "money", "money", "ratio", "money", "money", "rate"];

/** A finite number, or an empty cell (a ratio at zero cost, a gap not known). */
function finite(value: number): Cell {
  return Number.isFinite(value) ? value : null;
}

/**
 * The optimal list at each budget level, as values: every level is an optimisation of its own,
 * which a spreadsheet cannot redo. The chart of K+A avoided against budget is in the HTML
 * report; the file-format library writes no native charts.
 */
export function budgetLevelsSheet(frontier: readonly FrontierLevel[]): SheetSpec {
  const rows: Cell[][] = [
    [{ value: BUDGET_LEVELS_SHEET, bold: true }],
    ["The optimal list at each budget level (values: each level is solved by averta; rerun 'averta frontier' to change them)."],
    HEADERS,
  ];
  for (const { budget, plan } of frontier) {
    const { totals, solution } = plan;
    rows.push([budget, solution.status, totals.projects, totals.cost, totals.ksiAvoided, totals.benefitPV, totals.lifecycleCostPV, finite(totals.bcRatio), totals.npv, finite(totals.costPerKsi), finite(solution.gap)]);
  }
  return { name: BUDGET_LEVELS_SHEET, rows, frozenRows: HEADER_ROW, boldRows: [HEADER_ROW], columnFormats: FORMATS };
}
