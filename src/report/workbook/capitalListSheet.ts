import type { WorkbookAlternative } from "../../analysis/workbookAlternatives.js";
import { ALTERNATIVE_FORMATS, ALTERNATIVE_HEADERS, alternativeRowCells, siteCells, siteHeaders } from "./alternativeRowCells.js";
import type { LiveAssumptions } from "./assumptionsSheet.js";
import type { BenefitRows, StreamRows } from "./benefitStreamsSheet.js";
import { cellAddress } from "./cellAddress.js";
import { ratioCells } from "./figureCells.js";
import { isFormula, type Cell, type NumberFormat, type SheetSpec } from "./workbookTypes.js";

export const CAPITAL_LIST_SHEET = "Capital list";
const HEADER_ROW = 3;
const SUMMED = new Set(["Capital cost", "Upkeep a year", "K avoided a year", "A avoided a year", "B avoided a year", "C avoided a year", "O avoided a year", "K+A crashes avoided", "Benefit PV", "Lifecycle cost PV"]);

/** Where the totals row sits, for the Summary sheet's references, and its cached figures. */
export interface CapitalListTotals {
  readonly row: number;
  /** 1-based column of each header. */
  readonly columns: ReadonlyMap<string, number>;
  readonly values: ReadonlyMap<string, number>;
}

/**
 * The funded projects, one row each, with their figures as formulas over their stream rows and
 * the Assumptions sheet, and a totals row: SUMs of the amounts and crashes, and B/C, NPV and
 * cost per K+A of the whole list from those sums (as the plan's totals are).
 */
export function capitalListSheet(
  funded: readonly { readonly entry: WorkbookAlternative; readonly benefit: BenefitRows; readonly lifecycle: StreamRows }[],
  live: LiveAssumptions,
  programme: boolean,
  lifecycleStreamColumn: number,
): { sheet: SheetSpec; totals: CapitalListTotals } {
  const leading = [...siteHeaders(programme), "Alternative no."];
  const headers = [...leading, ...ALTERNATIVE_HEADERS];
  const rows: Cell[][] = [[{ value: CAPITAL_LIST_SHEET, bold: true }], ["The projects funded, as averta chose them. Every money figure is a formula over the stream sheets and the Assumptions sheet."], headers];
  for (const { entry, benefit, lifecycle } of funded) {
    const row = rows.length + 1;
    const { cells } = alternativeRowCells(entry, row, leading.length + 1, live.discountRate, { yearsInService: entry.alternative.effectiveYears, benefit, lifecycle }, lifecycleStreamColumn);
    rows.push([...siteCells(entry, programme), entry.number, ...cells]);
  }
  const firstRow = HEADER_ROW + 1;
  const lastRow = rows.length;
  const totalsRow = rows.length + 1;
  const columns = new Map(headers.map((header, index) => [header, index + 1]));
  const values = new Map<string, number>();
  const totals: Cell[] = headers.map((header, index) => {
    if (index === 0) return { value: "Total", bold: true };
    if (!SUMMED.has(header)) return null;
    const column = index + 1;
    const sum = rows.slice(firstRow - 1).reduce((total, cells) => total + cellNumber(cells[index] ?? null), 0);
    values.set(header, sum);
    const range = lastRow < firstRow ? "0" : `SUM(${cellAddress(firstRow, column)}:${cellAddress(lastRow, column)})`;
    return { formula: range, result: sum, format: ALTERNATIVE_FORMATS[index - leading.length] ?? "money" };
  });
  const at = (header: string) => cellAddress(totalsRow, columns.get(header)!);
  const ratios = ratioCells(at("K+A crashes avoided"), at("Benefit PV"), at("Lifecycle cost PV"), {
    ksiAvoided: values.get("K+A crashes avoided")!,
    benefitPV: values.get("Benefit PV")!,
    lifecycleCostPV: values.get("Lifecycle cost PV")!,
  });
  totals.splice(columns.get("B/C")! - 1, 3, ...ratios);
  rows.push(totals);
  const columnFormats: (NumberFormat | undefined)[] = [...leading.map((header) => (header === "Build year" ? ("year" as const) : header === "Alternative no." ? ("count" as const) : undefined)), ...ALTERNATIVE_FORMATS];
  return { sheet: { name: CAPITAL_LIST_SHEET, rows, frozenRows: HEADER_ROW, frozenColumns: 2, boldRows: [HEADER_ROW, totalsRow], columnFormats }, totals: { row: totalsRow, columns, values } };
}

function cellNumber(cell: Cell): number {
  if (typeof cell === "number") return cell;
  if (isFormula(cell)) return typeof cell.result === "number" ? cell.result : 0;
  return 0;
}
