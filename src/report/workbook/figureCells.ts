import type { BenefitRows, StreamRows } from "./benefitStreamsSheet.js";
import { BENEFIT_COLUMN, BENEFIT_STREAMS_SHEET, KSI_COLUMN } from "./benefitStreamsSheet.js";
import { cellAddress, columnLetters, sheetReference } from "./cellAddress.js";
import { COST_STREAMS_SHEET } from "./costStreamsSheet.js";
import { uniformSeriesFormula, type Term } from "./discountFormulas.js";
import type { Cell, FormulaCell, NumberFormat } from "./workbookTypes.js";

/** The headers of the figure columns, in order. */
export const FIGURE_HEADERS = ["Years in service", "P/A factor", "K+A crashes avoided", "Benefit PV", "Lifecycle cost PV", "B/C", "NPV", "Cost per K+A crash avoided"] as const;
export const FIGURE_FORMATS: readonly NumberFormat[] = ["year", "factor", "crashes", "money", "money", "ratio", "money", "money"];

/** Where one alternative's figures come from: its stream rows and its years in service. */
export interface FigureSources {
  readonly yearsInService: number;
  readonly benefit: BenefitRows;
  readonly lifecycle: StreamRows;
}

/** The cached figures of a row, for totals and for tests. */
export interface RowFigures {
  readonly ksiAvoided: number;
  readonly benefitPV: number;
  readonly lifecycleCostPV: number;
}

function streamSum(sheet: string, column: number, rows: StreamRows): FormulaCell {
  const from = cellAddress(rows.firstRow, column);
  const to = cellAddress(rows.lastRow, column);
  return { formula: `SUM(${sheetReference(sheet, from, to)})`, result: rows.sum };
}

/**
 * The figure cells of one alternative on row `row`, starting at column `first`: years in
 * service, the P/A factor over them (the handbook expression written out, for reading), K+A
 * avoided, benefit PV and lifecycle cost PV as SUMs of its stream rows, then B/C = benefit ÷
 * lifecycle (blank at zero cost, as averta shows no ratio there), NPV = benefit − lifecycle and
 * cost per K+A = lifecycle ÷ K+A (blank when none is avoided).
 */
export function figureCells(row: number, first: number, rate: Term, sources: FigureSources, lifecycleStreamColumn: number): { cells: Cell[]; figures: RowFigures } {
  const ref = (offset: number) => `${columnLetters(first + offset)}${row}`;
  const years: Term = { ref: ref(0), value: sources.yearsInService };
  const ksi = { ...streamSum(BENEFIT_STREAMS_SHEET, KSI_COLUMN, sources.benefit.ksi), format: "crashes" as const };
  const benefit = { ...streamSum(BENEFIT_STREAMS_SHEET, BENEFIT_COLUMN, sources.benefit.benefit), format: "money" as const };
  const lifecycle = { ...streamSum(COST_STREAMS_SHEET, lifecycleStreamColumn, sources.lifecycle), format: "money" as const };
  const figures = { ksiAvoided: Number(ksi.result), benefitPV: Number(benefit.result), lifecycleCostPV: Number(lifecycle.result) };
  return { cells: [years.value, uniformSeriesFormula(rate, years), ksi, benefit, lifecycle, ...ratioCells(ref(2), ref(3), ref(4), figures)], figures };
}

/** B/C, NPV and cost per K+A from the cells holding K+A, benefit PV and lifecycle cost PV (a row's, or a totals row's). */
export function ratioCells(ksiRef: string, benefitRef: string, lifecycleRef: string, figures: RowFigures): Cell[] {
  const { ksiAvoided, benefitPV, lifecycleCostPV } = figures;
  return [
    { formula: `IF(${lifecycleRef}>0,${benefitRef}/${lifecycleRef},"")`, result: lifecycleCostPV > 0 ? benefitPV / lifecycleCostPV : "", format: "ratio" },
    { formula: `${benefitRef}-${lifecycleRef}`, result: benefitPV - lifecycleCostPV, format: "money" },
    { formula: `IF(${ksiRef}>0,${lifecycleRef}/${ksiRef},"")`, result: ksiAvoided > 0 ? lifecycleCostPV / ksiAvoided : "", format: "money" },
  ];
}
