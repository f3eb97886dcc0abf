/** A1-style addresses for the workbook's formulas. */

/** Column letters of a 1-based column number: 1 → A, 27 → AA. */
export function columnLetters(column: number): string {
  let letters = "";
  for (let n = column; n > 0; n = Math.floor((n - 1) / 26)) letters = String.fromCharCode(65 + ((n - 1) % 26)) + letters;
  return letters;
}

/** The address of a 1-based (row, column), e.g. (5, 2) → B5. */
export function cellAddress(row: number, column: number): string {
  return `${columnLetters(column)}${row}`;
}

/** A reference into another sheet, quoted as the file format needs: 'Cost streams'!H5:H7. */
export function sheetReference(sheet: string, from: string, to?: string): string {
  return `'${sheet.replace(/'/g, "''")}'!${from}${to === undefined || to === from ? "" : `:${to}`}`;
}
