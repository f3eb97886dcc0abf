/**
 * A workbook described as plain data: sheets of cells, formulas with the values they compute,
 * number formats and names. The report builds it; workbookXlsx writes it with the file-format
 * library, so the layout and the arithmetic are tested without opening a file.
 */

/** How a number is shown. */
export type NumberFormat = "money" | "ratio" | "crashes" | "rate" | "factor" | "year" | "count";

/** A formula (without the leading "="), in the file format's English function names, and the value it computes. */
export interface FormulaCell {
  readonly formula: string;
  /** The value the formula computes from the cells as written: cached in the file for viewers that do not recalculate. */
  readonly result: number | string;
  readonly format?: NumberFormat;
}

/** A plain value with a format or emphasis of its own. */
export interface ValueCell {
  readonly value: string | number;
  readonly format?: NumberFormat;
  readonly bold?: boolean;
}

/** A string is always written as text, never read as a formula, whatever it starts with. */
export type Cell = string | number | null | FormulaCell | ValueCell;

export interface SheetSpec {
  readonly name: string;
  readonly rows: readonly (readonly Cell[])[];
  /** Rows (from the top) and columns (from the left) that stay in view when scrolling. */
  readonly frozenRows: number;
  readonly frozenColumns?: number;
  /** 1-based rows shown bold, e.g. the column headers and a totals row. */
  readonly boldRows?: readonly number[];
  /** Number format of each column, for cells that do not carry their own. */
  readonly columnFormats?: readonly (NumberFormat | undefined)[];
}

/** A workbook-level name for one cell, e.g. DiscountRate → Assumptions!$B$5. */
export interface DefinedName {
  readonly name: string;
  readonly sheet: string;
  /** 1-based row and column. */
  readonly row: number;
  readonly column: number;
}

export interface WorkbookSpec {
  readonly sheets: readonly SheetSpec[];
  readonly names: readonly DefinedName[];
  /** ISO 4217 code shown with money amounts. */
  readonly currency: string;
}

export function isFormula(cell: Cell): cell is FormulaCell {
  return typeof cell === "object" && cell !== null && "formula" in cell;
}
