import type { CrashRecord, RejectedRow, UnknownCode } from "../geo/CrashRecord.js";
import { CRASH_TYPES, SEVERITIES, type CrashType, type Severity } from "../model/types.js";
import { CRASH_FIELDS, type CrashField, type CrashMapping } from "./CrashMapping.js";
import { detectDateFormat } from "./detectDateFormat.js";
import { InputError } from "./InputError.js";
import { DATE_FORMAT_EXAMPLES, parseCrashDate, type CalendarDate, type DateFormat } from "./parseCrashDate.js";
import { CSV_DELIMITERS, parseCsv, type CsvDelimiter, type CsvRecord } from "./parseCsv.js";
import { quoteValue } from "./quoteValue.js";

/** The rows of a crash file: every data row is either a record or a rejected row. */
export interface CrashRows {
  /** Data rows read (the header excluded). */
  readonly rowsRead: number;
  readonly records: readonly CrashRecord[];
  readonly rejected: readonly RejectedRow[];
  /** Untranslated severity and type codes, most rows first. */
  readonly unknownCodes: readonly UnknownCode[];
  /** The field separator and date format used: given, or told from the file. */
  readonly delimiter: CsvDelimiter;
  readonly dateFormat: DateFormat;
}

/** How to read a crash file; what is left out is told from the file itself. */
export interface CrashCsvOptions {
  readonly delimiter?: CsvDelimiter;
  readonly dateFormat?: DateFormat;
}

const DELIMITER_NAMES: Readonly<Record<CsvDelimiter, string>> = { ",": "',' (comma)", ";": "';' (semicolon)", "\t": "tab" };

/**
 * Turns crash CSV text into crash records through `mapping`. The field separator (comma,
 * semicolon or tab) is told from the header when not given: the one that splits it into the
 * mapped columns; the date format is told from all the dates when not given (detectDateFormat).
 * A row with a bad value is rejected with its line and reason (never dropped silently); a file
 * whose CSV syntax or header is broken, that has no data rows, or whose separator or date format
 * cannot be told, is an InputError, since no row could be trusted. `label` names the file.
 */
export function parseCrashCsv(text: string, mapping: CrashMapping, label: string, options: CrashCsvOptions = {}): CrashRows {
  const delimiter = options.delimiter ?? detectDelimiter(text, mapping, label);
  const parsed = parseCsv(text, delimiter);
  if (!parsed.ok) {
    const { line, column, message } = parsed.problem;
    throw new InputError([{ code: "csv-syntax", file: label, line, column, message, hint: `quote fields that hold ${DELIMITER_NAMES[delimiter]}, quotes or line breaks, and double any quote inside them` }]);
  }
  const [header, ...rows] = parsed.records;
  if (header === undefined) throw new InputError([{ code: "csv-empty", file: label, line: 1, message: "the file is empty: no header row and no crash rows", hint: "the first row must name the columns (id, date, latitude, longitude, severity, type), one crash per row after it" }]);
  const columnOf = mappedColumns(header, mapping, label, delimiter);
  if (rows.length === 0) {
    throw new InputError([{ code: "no-crash-rows", file: label, line: header.line, message: "no crash rows: the file has a header and nothing after it", hint: "export the crash records with their rows, or check that --crashes names the right file; nothing was written" }]);
  }
  const value = (row: CsvRecord, field: CrashField) => row.fields[columnOf[field]]!.trim();
  const complete = rows.filter((row) => row.fields.length === header.fields.length);
  let dateFormat = options.dateFormat;
  if (dateFormat === undefined) {
    const detected = detectDateFormat(complete.map((row) => ({ text: value(row, "date"), line: row.line })));
    if (!detected.ok) throw new InputError([{ code: "date-format", file: label, line: detected.line, path: mapping.columns.date, message: detected.message, hint: detected.hint }]);
    dateFormat = detected.format;
  }
  const severityOf = new Map<string, Severity>([...SEVERITIES.map((s): [string, Severity] => [s, s]), ...Object.entries(mapping.severity)]);
  const typeOf = new Map<string, CrashType>([...CRASH_TYPES.map((t): [string, CrashType] => [t, t]), ...Object.entries(mapping.type)]);
  const unknown = new Map<string, { field: "severity" | "type"; code: string; rows: number; firstLine: number }>();
  const countUnknown = (field: "severity" | "type", code: string, line: number) => {
    const key = `${field}\u0000${code}`;
    const entry = unknown.get(key);
    if (entry) entry.rows++;
    else unknown.set(key, { field, code, rows: 1, firstLine: line });
  };

  const records: CrashRecord[] = [];
  const rejected: RejectedRow[] = [];
  for (const row of rows) {
    const reject = (reason: RejectedRow["reason"], message: string) => rejected.push({ line: row.line, reason, message });
    if (row.fields.length !== header.fields.length) {
      reject("wrong-field-count", `${row.fields.length} fields where the header has ${header.fields.length} (separator ${DELIMITER_NAMES[delimiter]})`);
      continue;
    }
    const id = value(row, "id");
    if (id === "") {
      reject("missing-id", "no crash id");
      continue;
    }
    const shownId = quoteValue(id);
    const dateText = value(row, "date");
    const date = parseCrashDate(dateText, dateFormat);
    if (date === undefined) {
      reject("invalid-date", `crash ${shownId} has date ${quoteValue(dateText)}, not a real date written ${DATE_FORMAT_EXAMPLES[dateFormat]}`);
      continue;
    }
    const latText = value(row, "latitude");
    const lonText = value(row, "longitude");
    if (latText === "" || lonText === "") {
      reject("missing-coordinates", `crash ${shownId} has no coordinates`);
      continue;
    }
    const lat = coordinateOf(latText);
    const lon = coordinateOf(lonText);
    if (lat === undefined || lon === undefined || Math.abs(lat) > 90 || Math.abs(lon) > 180) {
      reject("invalid-coordinates", `crash ${shownId} has latitude ${quoteValue(latText)} and longitude ${quoteValue(lonText)}, not decimal degrees (latitude -90 to 90, longitude -180 to 180)`);
      continue;
    }
    if (lat === 0 && lon === 0) {
      // 0, 0 is the usual placeholder of a crash that was never located.
      reject("missing-coordinates", `crash ${shownId} has coordinates 0, 0, the usual placeholder of a crash never located`);
      continue;
    }
    const severityText = value(row, "severity");
    const severity = severityOf.get(severityText) ?? severityOf.get(severityText.toUpperCase());
    if (severity === undefined) {
      countUnknown("severity", severityText, row.line);
      reject("unknown-severity", `crash ${shownId} has unknown severity code ${quoteValue(severityText)}`);
      continue;
    }
    const typeText = value(row, "type");
    const type = typeOf.get(typeText) ?? typeOf.get(typeText.toLowerCase());
    if (type === undefined) {
      countUnknown("type", typeText, row.line);
      reject("unknown-type", `crash ${shownId} has unknown crash type ${quoteValue(typeText)}`);
      continue;
    }
    records.push({ line: row.line, id, year: date.year, date: isoDate(date), severity, type, location: { lon, lat } });
  }
  const unknownCodes = [...unknown.values()].sort((a, b) => b.rows - a.rows || a.firstLine - b.firstLine);
  return { rowsRead: rows.length, records, rejected, unknownCodes, delimiter, dateFormat };
}

// Decimal degrees: digits with an optional point, sign and exponent (1e-05 is how some tools write
// tiny values), or one decimal comma (55,4012). Number() alone would also take "0x1F", "0b1",
// "0o7", "Infinity" and "" and white space inside.
const DECIMAL = /^[+-]?(?:[0-9]+(?:\.[0-9]*)?|\.[0-9]+)(?:[eE][+-]?[0-9]+)?$/;
const DECIMAL_COMMA = /^[+-]?[0-9]+,[0-9]+$/;

/** Decimal degrees written in `text`, or undefined when it is not a plain decimal number. */
function coordinateOf(text: string): number | undefined {
  const plain = DECIMAL.test(text) ? text : DECIMAL_COMMA.test(text) ? text.replace(",", ".") : undefined;
  if (plain === undefined) return undefined;
  const value = Number(plain);
  return Number.isFinite(value) ? value : undefined;
}

/** Each field's column in the header; a missing or repeated mapped column is an InputError. */
function mappedColumns(header: CsvRecord, mapping: CrashMapping, label: string, delimiter: CsvDelimiter): Record<CrashField, number> {
  const names = header.fields.map(normalName);
  const missing = CRASH_FIELDS.filter((field) => !names.includes(normalName(mapping.columns[field])));
  if (missing.length > 0) {
    const single = header.fields.length === 1;
    throw new InputError([
      {
        code: "csv-columns",
        file: label,
        line: header.line,
        message: `no column for ${missing.map((field) => `${field} (${quoteValue(mapping.columns[field])})`).join(", ")}; split by ${DELIMITER_NAMES[delimiter]}, the header has ${single ? "one column" : `${header.fields.length} columns`}: ${header.fields.map(quoteValue).join(", ")}`,
        hint: single
          ? "if the columns are separated by something else, pass --delimiter ',', ';' or tab; otherwise name the columns in a --mapping file (columns: { latitude: LAT, ... })"
          : "rename the columns, or map them in a --mapping file (columns: { latitude: LAT, ... })",
      },
    ]);
  }
  const columnOf = {} as Record<CrashField, number>;
  for (const field of CRASH_FIELDS) {
    const name = normalName(mapping.columns[field]);
    const first = names.indexOf(name);
    const last = names.lastIndexOf(name);
    if (first !== last) {
      throw new InputError([{ code: "csv-columns", file: label, line: header.line, message: `the column ${quoteValue(mapping.columns[field])} for ${field} appears twice (columns ${first + 1} and ${last + 1})`, hint: "rename one of them, or map the field to another column in a --mapping file" }]);
    }
    columnOf[field] = first;
  }
  return columnOf;
}

function normalName(name: string): string {
  return name.trim().toLowerCase();
}

/**
 * The separator of a crash file, from its header line: of comma, semicolon and tab, the one that
 * occurs in the header, or, when several do, the only one that splits it into every mapped column.
 * A header with none of them is one column (split by comma). Refuses when it cannot tell.
 */
function detectDelimiter(text: string, mapping: CrashMapping, label: string): CsvDelimiter {
  const start = text.charCodeAt(0) === 0xfeff ? 1 : 0;
  const breakAt = text.slice(start, start + 65_536).search(/[\r\n]/);
  const headerLine = text.slice(start, breakAt < 0 ? start + 65_536 : start + breakAt);
  const present = CSV_DELIMITERS.filter((delimiter) => headerLine.includes(delimiter));
  if (present.length <= 1) return present[0] ?? ",";
  const wanted = CRASH_FIELDS.map((field) => normalName(mapping.columns[field]));
  const fits = present.filter((delimiter) => {
    const parsed = parseCsv(headerLine, delimiter);
    const names = parsed.ok ? (parsed.records[0]?.fields ?? []).map(normalName) : [];
    return wanted.every((name) => names.includes(name));
  });
  if (fits.length === 1) return fits[0]!;
  const names = (fits.length > 1 ? fits : present).map((delimiter) => DELIMITER_NAMES[delimiter]).join(" and ");
  throw new InputError([
    {
      code: "csv-delimiter",
      file: label,
      line: 1,
      message: fits.length > 1 ? `the header splits into the crash columns by ${names} alike, so the separator cannot be told` : `the header holds ${names}, and split by none of them does it name every crash column (${CRASH_FIELDS.map((field) => quoteValue(mapping.columns[field])).join(", ")})`,
      hint: "pass --delimiter ',', ';' or tab, and map the column names in a --mapping file if they differ",
    },
  ]);
}

function isoDate(date: CalendarDate): string {
  return `${String(date.year).padStart(4, "0")}-${String(date.month).padStart(2, "0")}-${String(date.day).padStart(2, "0")}`;
}
