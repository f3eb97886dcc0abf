/** One CSV record with the 1-based line of the file on which it starts. */
export interface CsvRecord {
  readonly line: number;
  readonly fields: readonly string[];
}

/** Where a CSV text breaks RFC 4180 (a stray quote or an unterminated quoted field). */
export interface CsvSyntaxProblem {
  readonly line: number;
  readonly column: number;
  readonly message: string;
}

/** Records of a CSV text, or the first syntax problem found. */
export type CsvParseResult =
  | { readonly ok: true; readonly records: readonly CsvRecord[] }
  | { readonly ok: false; readonly problem: CsvSyntaxProblem };

/** Field separators a crash file may use: comma (RFC 4180), semicolon, tab. */
export type CsvDelimiter = "," | ";" | "\t";
export const CSV_DELIMITERS: readonly CsvDelimiter[] = [",", ";", "\t"];

/**
 * Parses CSV text by RFC 4180 ("Common Format and MIME Type for CSV Files", section 2):
 * fields separated by commas (or `delimiter`), records by CRLF (a lone LF or CR, and a mix of
 * the three, is accepted too; each CRLF, LF or CR is one line end), fields in double quotes may
 * hold delimiters, line breaks and doubled quotes (""). A leading UTF-8 byte order mark is
 * skipped; a final line break does not start an empty record; blank lines are skipped. Each
 * record carries the line it starts on, counting the line breaks inside quoted fields.
 * Cost O(n) in the text's length.
 * @example parseCsv('a,"b,""c"""\r\n') → records [{ line: 1, fields: ["a", 'b,"c"'] }]
 */
export function parseCsv(text: string, delimiter: CsvDelimiter = ","): CsvParseResult {
  const separator = delimiter.charCodeAt(0);
  const records: CsvRecord[] = [];
  let position = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  let line = 1;
  let lineStart = position;
  const length = text.length;
  while (position < length) {
    const recordLine = line;
    const fields: string[] = [];
    for (;;) {
      let value: string;
      if (text[position] === '"') {
        const openLine = line;
        const openColumn = position - lineStart + 1;
        position++;
        let parts = "";
        let chunkStart = position;
        for (;;) {
          const quote = text.indexOf('"', position);
          if (quote < 0) {
            return { ok: false, problem: { line: openLine, column: openColumn, message: "a quoted field is never closed" } };
          }
          // Count line breaks inside the quoted field so later line numbers stay right.
          for (let i = position; i < quote; i++) {
            const c = text.charCodeAt(i);
            if (c === 10 || (c === 13 && text.charCodeAt(i + 1) !== 10)) {
              line++;
              lineStart = i + 1;
            }
          }
          if (text[quote + 1] === '"') {
            parts += text.slice(chunkStart, quote + 1);
            position = quote + 2;
            chunkStart = position;
            continue;
          }
          parts += text.slice(chunkStart, quote);
          position = quote + 1;
          break;
        }
        value = parts;
        const next = text[position];
        if (next !== undefined && next !== delimiter && next !== "\r" && next !== "\n") {
          return { ok: false, problem: { line, column: position - lineStart + 1, message: "text follows a closing quote" } };
        }
      } else {
        let end = position;
        while (end < length) {
          const c = text.charCodeAt(end);
          if (c === separator || c === 10 || c === 13) break;
          if (c === 34) return { ok: false, problem: { line, column: end - lineStart + 1, message: "a double quote inside an unquoted field" } };
          end++;
        }
        value = text.slice(position, end);
        position = end;
      }
      fields.push(value);
      if (text[position] === delimiter) {
        position++;
        continue;
      }
      break;
    }
    if (text[position] === "\r") position++;
    if (text[position] === "\n") position++;
    line++;
    lineStart = position;
    if (!(fields.length === 1 && fields[0] === "")) records.push({ line: recordLine, fields });
  }
  return { ok: true, records };
}
