/** The longest text one spreadsheet cell holds (Excel's limit, which LibreOffice also keeps to). */
export const MAX_CELL_TEXT = 32_767;

/**
 * User text made safe to store as a cell's string: lone surrogates (not encodable) become
 * U+FFFD, a literal `_xHHHH_` is escaped as `_x005F_xHHHH_` so readers do not decode it as an
 * escaped character (the OOXML string escape), and text past the cell limit is cut with "…".
 * The text is written as a string cell, so a leading = + − @ tab or CR never makes it a formula.
 */
export function cellText(text: string): string {
  const wellFormed = text.replace(/[\uD800-\uDBFF](?![\uDC00-\uDFFF])|(?<![\uD800-\uDBFF])[\uDC00-\uDFFF]/g, "\uFFFD");
  const escaped = wellFormed.replace(/_(?=x[0-9A-Fa-f]{4}_)/g, "_x005F_");
  return escaped.length <= MAX_CELL_TEXT ? escaped : `${escaped.slice(0, MAX_CELL_TEXT - 1)}…`;
}
