/** One CSV cell: text, a number, or empty (null/undefined). */
export type CsvCell = string | number | null | undefined;

/**
 * Renders rows as RFC 4180 CSV (CRLF line ends, quotes doubled). Every cell, header included,
 * goes through `guardCsvText`, the one guard against CSV (formula) injection; numbers are written
 * as plain numbers, so they stay machine-readable.
 */
export function toCsv(header: readonly string[], rows: readonly (readonly CsvCell[])[]): string {
  return [header, ...rows].map((row) => row.map(csvCell).join(",")).join("\r\n") + "\r\n";
}

// Characters a spreadsheet may skip before it looks for a formula sign: every Unicode white space
// (\s covers space, tab, line feed, carriage return, no-break space, the U+2000 spaces, U+3000 and
// the byte order mark) and the zero-width format characters that print as nothing.
const INVISIBLE_LEAD = "[\\s\\u200b-\\u200d\\u2060\\u180e]*";
// Formula signs, with their full-width forms (U+FF1D, U+FF0B, U+FF0D, U+FF20) and the minus sign U+2212.
const FORMULA_SIGN = "[=+\\-@\\uff1d\\uff0b\\uff0d\\uff20\\u2212]";
const STARTS_LIKE_FORMULA = new RegExp(`^(?:${INVISIBLE_LEAD}${FORMULA_SIGN}|[\\t\\r\\n])`);
const PLAIN_NUMBER = /^[+-]?(?:[0-9]+(?:\.[0-9]*)?|\.[0-9]+)(?:[eE][+-]?[0-9]+)?$/;

/**
 * A text cell made safe to open in a spreadsheet (OWASP, "CSV Injection"): text that starts with
 * =, +, -, @, a tab, a carriage return or a line feed, or with white space or invisible characters
 * before one of those signs, gets a leading apostrophe, so it is shown as text and never run as a
 * formula. Text that is a plain decimal number ("-3.5", "+2", "1e-5") is left alone: a spreadsheet
 * reads it as that number and runs nothing.
 * @example guardCsvText("=1+1") → "'=1+1"; guardCsvText(" @SUM(A1)") → "' @SUM(A1)"; guardCsvText("-3.5") → "-3.5"
 */
export function guardCsvText(text: string): string {
  return STARTS_LIKE_FORMULA.test(text) && !PLAIN_NUMBER.test(text) ? `'${text}` : text;
}

function csvCell(cell: CsvCell): string {
  if (cell === null || cell === undefined) return "";
  if (typeof cell === "number") return Number.isFinite(cell) ? String(cell) : "";
  const safe = guardCsvText(cell);
  return /[",\r\n]/.test(safe) ? `"${safe.replace(/"/g, '""')}"` : safe;
}
