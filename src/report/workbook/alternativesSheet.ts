import type { WorkbookAlternative } from "../../analysis/workbookAlternatives.js";
import { ALTERNATIVE_FORMATS, ALTERNATIVE_HEADERS, alternativeRowCells, siteCells, siteHeaders } from "./alternativeRowCells.js";
import type { LiveAssumptions } from "./assumptionsSheet.js";
import type { BenefitRows, StreamRows } from "./benefitStreamsSheet.js";
import type { Cell, NumberFormat, SheetSpec } from "./workbookTypes.js";

export const ALTERNATIVES_SHEET = "Alternatives";
const HEADER_ROW = 3;

export const DOMINATED_NOTE =
  "Dominated: another alternative at the same site costs no more capital and is worth at least as much by the objective, and is better in one of the two; the optimiser never needs it.";

/** Every alternative of every site, numbered as the stream sheets number them, with its figures as formulas. */
export function alternativesSheet(alternatives: readonly WorkbookAlternative[], benefit: readonly BenefitRows[], lifecycle: readonly StreamRows[], live: LiveAssumptions, programme: boolean, lifecycleStreamColumn: number): SheetSpec {
  const leading = ["Alternative no.", ...siteHeaders(programme)];
  const rows: Cell[][] = [[{ value: ALTERNATIVES_SHEET, bold: true }], [DOMINATED_NOTE], [...leading, ...ALTERNATIVE_HEADERS, "Funded", "Dominated"]];
  alternatives.forEach((entry, index) => {
    const row = rows.length + 1;
    const sources = { yearsInService: entry.alternative.effectiveYears, benefit: benefit[index]!, lifecycle: lifecycle[index]! };
    const { cells } = alternativeRowCells(entry, row, leading.length + 1, live.discountRate, sources, lifecycleStreamColumn);
    rows.push([entry.number, ...siteCells(entry, programme), ...cells, entry.funded ? "yes" : "no", entry.dominated ? "yes" : "no"]);
  });
  const columnFormats: (NumberFormat | undefined)[] = ["count", ...leading.slice(1).map((header) => (header === "Build year" ? ("year" as const) : undefined)), ...ALTERNATIVE_FORMATS];
  return { name: ALTERNATIVES_SHEET, rows, frozenRows: HEADER_ROW, frozenColumns: 2, boldRows: [HEADER_ROW], columnFormats };
}
