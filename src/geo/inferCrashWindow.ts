import type { CrashWindow } from "./tallyNetwork.js";

/** A year counts as a full year of data when it holds at least this share of the median year's rows. */
export const FULL_YEAR_SHARE = 0.5;
/** The inferred window must hold at least this share of the dated rows, or there is no clear window. */
export const MIN_WINDOW_ROW_SHARE = 0.9;

/** Crash rows of one calendar year. */
export interface YearRows {
  readonly year: number;
  readonly rows: number;
}

/** A crash window taken from the data, with what it leaves out. */
export interface WindowInference {
  readonly window: CrashWindow;
  /** Every year with at least one row, in order. */
  readonly rowsByYear: readonly YearRows[];
  /** Median rows of the years with rows; a full year holds at least FULL_YEAR_SHARE of it. */
  readonly medianYearRows: number;
  /** Years with rows outside the window, and their rows. */
  readonly leftOut: readonly YearRows[];
  readonly leftOutRows: number;
  /** Share of the dated rows inside the window (0 to 1). */
  readonly windowShare: number;
  /** Whether the window holds at least MIN_WINDOW_ROW_SHARE of the rows. */
  readonly clear: boolean;
}

/**
 * The crash window implied by the records' years: the latest run of consecutive full years,
 * where a year is full when it holds at least FULL_YEAR_SHARE (50 %) of the median rows of the
 * years that have any. So one stray row from an old year, or a few weeks of a year just begun,
 * do not stretch the window; a year with fewer crashes than usual (but over half the median)
 * stays in. `clear` is false when that run holds under MIN_WINDOW_ROW_SHARE (90 %) of the rows:
 * then the data have no one obvious window and it should be given. Undefined without records.
 * Cost O(records + years log years).
 */
export function inferCrashWindow(records: readonly { readonly year: number }[]): WindowInference | undefined {
  if (records.length === 0) return undefined;
  const counts = new Map<number, number>();
  for (const record of records) counts.set(record.year, (counts.get(record.year) ?? 0) + 1);
  const rowsByYear = [...counts].map(([year, rows]) => ({ year, rows })).sort((a, b) => a.year - b.year);
  const sorted = rowsByYear.map((entry) => entry.rows).sort((a, b) => a - b);
  const middle = sorted.length >> 1;
  const medianYearRows = sorted.length % 2 === 1 ? sorted[middle]! : (sorted[middle - 1]! + sorted[middle]!) / 2;
  const isFull = (year: number) => (counts.get(year) ?? 0) >= FULL_YEAR_SHARE * medianYearRows;
  // The median year is full, so some year is; walk back from the latest full year.
  let lastYear = rowsByYear[rowsByYear.length - 1]!.year;
  while (!isFull(lastYear)) lastYear--;
  let firstYear = lastYear;
  while (isFull(firstYear - 1)) firstYear--;
  const leftOut = rowsByYear.filter((entry) => entry.year < firstYear || entry.year > lastYear);
  const leftOutRows = leftOut.reduce((sum, entry) => sum + entry.rows, 0);
  const windowShare = 1 - leftOutRows / records.length;
  return { window: { firstYear, lastYear }, rowsByYear, medianYearRows, leftOut, leftOutRows, windowShare, clear: windowShare >= MIN_WINDOW_ROW_SHARE };
}
