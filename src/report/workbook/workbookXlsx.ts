import ExcelJS from "exceljs";
import { columnLetters, sheetReference } from "./cellAddress.js";
import { cellText } from "./cellText.js";
import type { Cell, NumberFormat, SheetSpec, WorkbookSpec } from "./workbookTypes.js";

const MIN_WIDTH = 8;
const MAX_WIDTH = 48;

function numberFormat(format: NumberFormat, currency: string): string {
  switch (format) {
    case "money":
      return `#,##0" ${currency}"`;
    case "ratio":
      return "0.00";
    case "crashes":
      return "0.000";
    case "rate":
      return "0.00%";
    case "factor":
      return "0.000000";
    case "year":
      return "0";
    case "count":
      return "#,##0";
  }
}

/** About how many characters a cell shows, to fit its column (text past MAX_WIDTH overflows into empty neighbours). */
function shownLength(cell: Cell): number {
  if (cell === null) return 0;
  if (typeof cell === "string") return cell.length;
  if (typeof cell === "number") return String(Math.round(cell)).length + 6;
  const value = "formula" in cell ? cell.result : cell.value;
  return typeof value === "number" ? String(Math.round(value)).length + 8 : String(value).length;
}

function writeSheet(workbook: ExcelJS.Workbook, spec: SheetSpec, currency: string): void {
  const sheet = workbook.addWorksheet(spec.name, {
    views: [{ state: "frozen", xSplit: spec.frozenColumns ?? 0, ySplit: spec.frozenRows }],
  });
  const widths: number[] = [];
  spec.rows.forEach((cells, r) => {
    const row = sheet.getRow(r + 1);
    cells.forEach((cell, c) => {
      if (cell === null) return;
      const target = row.getCell(c + 1);
      const format = typeof cell === "object" ? cell.format : undefined;
      if (typeof cell === "string") target.value = cellText(cell);
      else if (typeof cell === "number") target.value = cell;
      else if ("formula" in cell) target.value = { formula: cell.formula, result: typeof cell.result === "string" ? cellText(cell.result) : cell.result } as ExcelJS.CellFormulaValue;
      else target.value = typeof cell.value === "string" ? cellText(cell.value) : cell.value;
      const columnFormat = spec.columnFormats?.[c];
      const chosen = format ?? (r + 1 > spec.frozenRows ? columnFormat : undefined);
      if (chosen !== undefined) target.numFmt = numberFormat(chosen, currency);
      if ((typeof cell === "object" && "bold" in cell && cell.bold) || spec.boldRows?.includes(r + 1)) target.font = { bold: true };
      // Single-cell rows are notes and titles: they overflow across the row instead of widening column A.
      if (cells.length > 1 || c > 0) widths[c] = Math.max(widths[c] ?? 0, shownLength(cell));
    });
  });
  widths.forEach((width, c) => {
    sheet.getColumn(c + 1).width = Math.min(MAX_WIDTH, Math.max(MIN_WIDTH, width + 2));
  });
}

/** The workbook as .xlsx bytes, written by exceljs from its plain description. */
export async function workbookXlsx(spec: WorkbookSpec): Promise<Uint8Array> {
  const workbook = new ExcelJS.Workbook();
  workbook.creator = "averta";
  // Spreadsheet programs recalculate every formula on opening, so edited inputs never show stale figures.
  workbook.calcProperties = { fullCalcOnLoad: true };
  for (const sheet of spec.sheets) writeSheet(workbook, sheet, spec.currency);
  for (const name of spec.names) {
    workbook.definedNames.add(sheetReference(name.sheet, `$${columnLetters(name.column)}$${name.row}`), name.name);
  }
  const buffer = await workbook.xlsx.writeBuffer();
  return new Uint8Array(buffer as ArrayBuffer);
}
