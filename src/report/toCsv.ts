/** One CSV cell: text, a number, or empty (null/undefined). */
export type CsvCell = string | number | null | undefined;

/**
 * Renders rows as RFC 4180 CSV (CRLF line ends, quotes doubled). Text cells that a spreadsheet
 * would run as a formula (leading =, +, -, @, tab or carriage return) are prefixed with a quote
 * mark, the OWASP advice against CSV injection; numbers are written as plain numbers.
 */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return [header, ...rows].map((row) => row.map(csvCell).join(",")).join("\r\n") + "\r\n";
}

function csvCell(cell: CsvCell): string {
  if (cell === null || cell === undefined) return "";
  if (typeof cell === "number") return Number.isFinite(cell) ? String(cell) : "";
  const safe = /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell;
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}
