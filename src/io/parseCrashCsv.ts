import type { CrashRecord, RejectedRow } from "../geo/CrashRecord.js";
import { CRASH_TYPES, SEVERITIES, type CrashType, type Severity } from "../model/types.js";
import { CRASH_FIELDS, type CrashField, type CrashMapping } from "./CrashMapping.js";
import { InputError } from "./InputError.js";
import { parseCsv } from "./parseCsv.js";

/** The rows of a crash file: every data row is either a record or a rejected row. */
export interface CrashRows {
  /** Data rows read (the header excluded). */
  readonly rowsRead: number;
  readonly records: readonly CrashRecord[];
  readonly rejected: readonly RejectedRow[];
}

/**
 * Turns crash CSV text into crash records through `mapping`. A row with a bad value is
 * rejected with its line and reason (never dropped silently); a file whose CSV syntax or
 * header is broken is an InputError, since no row could be trusted. `label` names the file.
 */
export function parseCrashCsv(text: string, mapping: CrashMapping, label: string): CrashRows {
  const parsed = parseCsv(text);
  if (!parsed.ok) {
    const { line, column, message } = parsed.problem;
    throw new InputError([{ code: "csv-syntax", file: label, line, column, message, hint: "quote fields that hold commas, quotes or line breaks, and double any quote inside them" }]);
  }
  const [header, ...rows] = parsed.records;
  if (header === undefined) throw new InputError([{ code: "csv-empty", file: label, line: 1, message: "the file has no header row", hint: "the first row must name the columns" }]);
  const names = header.fields.map((name) => name.trim().toLowerCase());
  const missing = CRASH_FIELDS.filter((field) => !names.includes(mapping.columns[field].trim().toLowerCase()));
  if (missing.length > 0) {
    throw new InputError([
      {
        code: "csv-columns",
        file: label,
        line: header.line,
        message: `no column for ${missing.map((field) => `${field} ('${mapping.columns[field]}')`).join(", ")}; the header has: ${header.fields.join(", ")}`,
        hint: "rename the columns, or map them in a --mapping file (columns: { latitude: LAT, ... })",
      },
    ]);
  }
  const columnOf = Object.fromEntries(CRASH_FIELDS.map((field) => [field, names.indexOf(mapping.columns[field].trim().toLowerCase())])) as Record<CrashField, number>;
  const severityOf = new Map<string, Severity>([...SEVERITIES.map((s): [string, Severity] => [s, s]), ...Object.entries(mapping.severity)]);
  const typeOf = new Map<string, CrashType>([...CRASH_TYPES.map((t): [string, CrashType] => [t, t]), ...Object.entries(mapping.type)]);

  const records: CrashRecord[] = [];
  const rejected: RejectedRow[] = [];
  for (const row of rows) {
    const reject = (reason: RejectedRow["reason"], message: string) => rejected.push({ line: row.line, reason, message });
    if (row.fields.length !== header.fields.length) {
      reject("wrong-field-count", `${row.fields.length} fields where the header has ${header.fields.length}`);
      continue;
    }
    const value = (field: CrashField) => row.fields[columnOf[field]]!.trim();
    const id = value("id");
    if (id === "") {
      reject("missing-id", "no crash id");
      continue;
    }
    const year = yearOf(value("date"));
    if (year === undefined) {
      reject("invalid-date", `date '${value("date")}' is not a date like 2024-03-31`);
      continue;
    }
    const latText = value("latitude");
    const lonText = value("longitude");
    const lat = Number(latText);
    const lon = Number(lonText);
    if (latText === "" || lonText === "" || (lat === 0 && lon === 0)) {
      // 0, 0 is the usual placeholder of a crash that was never located.
      reject("missing-coordinates", `crash ${id} has no coordinates`);
      continue;
    }
    if (!Number.isFinite(lat) || !Number.isFinite(lon) || Math.abs(lat) > 90 || Math.abs(lon) > 180) {
      reject("invalid-coordinates", `crash ${id} has latitude '${latText}' and longitude '${lonText}', not decimal degrees`);
      continue;
    }
    const severity = severityOf.get(value("severity")) ?? severityOf.get(value("severity").toUpperCase());
    if (severity === undefined) {
      reject("unknown-severity", `crash ${id} has unknown severity code '${value("severity")}'`);
      continue;
    }
    const type = typeOf.get(value("type")) ?? typeOf.get(value("type").toLowerCase());
    if (type === undefined) {
      reject("unknown-type", `crash ${id} has unknown crash type '${value("type")}'`);
      continue;
    }
    records.push({ line: row.line, id, year, severity, type, location: { lon, lat } });
  }
  return { rowsRead: rows.length, records, rejected };
}

/** Calendar year of a date written YYYY-MM-DD (or with '/'), optionally followed by a time. */
function yearOf(text: string): number | undefined {
  const match = /^(\d{4})[-/](\d{1,2})[-/](\d{1,2})(?:[T ].*)?$/.exec(text);
  if (!match) return undefined;
  const [year, month, day] = [Number(match[1]), Number(match[2]), Number(match[3])];
  const date = new Date(Date.UTC(year, month - 1, day));
  return date.getUTCMonth() === month - 1 && date.getUTCDate() === day ? year : undefined;
}
