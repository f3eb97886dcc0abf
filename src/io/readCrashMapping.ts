import { CRASH_TYPES, SEVERITIES, type CrashType, type Severity } from "../model/types.js";
import { closestName } from "./closestName.js";
import { CRASH_FIELDS, DEFAULT_CRASH_MAPPING, type CrashField, type CrashMapping } from "./CrashMapping.js";
import { InputError, type InputProblem } from "./InputError.js";
import { readYamlFile, type PathSegment } from "./readYamlFile.js";

/**
 * Reads a crash-file mapping YAML:
 * ```yaml
 * columns: { id: CRASH_NO, date: CRASH_DATE, latitude: LAT, longitude: LON, severity: SEV, type: MANNER }
 * severity: { "1": K, "2": A, "3": B, "4": C, "5": O }
 * type: { PED: pedestrian, BIKE: bicycle, RE: rear-end }
 * ```
 * Every section is optional; columns left out keep their default names. Throws InputError.
 */
export function readCrashMapping(file: string): CrashMapping {
  const source = readYamlFile(file);
  const problems: InputProblem[] = [];
  const problem = (path: PathSegment[], message: string, hint: string, key = false) =>
    problems.push({ code: "mapping", file: source.file, ...source.positionOf(path, key), path: path.join("."), message, hint });
  const data = source.data ?? {};
  if (!isRecord(data)) throw new InputError([{ code: "mapping", file: source.file, line: 1, column: 1, message: "a mapping file must be a YAML map", hint: "write sections columns:, severity: and type:" }]);

  const columns: Record<CrashField, string> = { ...DEFAULT_CRASH_MAPPING.columns };
  const severity: Record<string, Severity> = {};
  const type: Record<string, CrashType> = {};
  for (const [section, value] of Object.entries(data)) {
    if (!["columns", "severity", "type"].includes(section)) {
      problem([section], `unknown section '${section}'`, "use columns, severity and type", true);
      continue;
    }
    if (!isRecord(value)) {
      problem([section], `'${section}' must be a map`, "write one 'key: value' per line");
      continue;
    }
    for (const [key, raw] of Object.entries(value)) {
      const text = typeof raw === "string" || typeof raw === "number" ? String(raw) : undefined;
      if (section === "columns") {
        if (!(CRASH_FIELDS as readonly string[]).includes(key)) {
          const guess = closestName(key, CRASH_FIELDS);
          problem([section, key], `unknown field '${key}'`, guess ? `did you mean '${guess}'?` : `fields: ${CRASH_FIELDS.join(", ")}`, true);
        } else if (text === undefined || text.trim() === "") problem([section, key], `column name for '${key}' must be text`, "give the CSV header of that column");
        else columns[key as CrashField] = text;
      } else if (section === "severity") {
        const letter = text?.trim().toUpperCase();
        if (letter === undefined || !(SEVERITIES as readonly string[]).includes(letter)) problem([section, key], `severity code '${key}' maps to '${String(raw)}', not a KABCO letter`, "map each code to K, A, B, C or O");
        else severity[key] = letter as Severity;
      } else {
        if (text === undefined || !(CRASH_TYPES as readonly string[]).includes(text)) {
          const guess = text === undefined ? undefined : closestName(text, CRASH_TYPES);
          problem([section, key], `type code '${key}' maps to '${String(raw)}', not a crash type`, guess ? `did you mean '${guess}'?` : `types: ${CRASH_TYPES.join(", ")}`);
        } else type[key] = text as CrashType;
      }
    }
  }
  if (problems.length > 0) throw new InputError(problems);
  return { columns, severity, type };
}

function isRecord(value: unknown): value is Record<string, unknown> {
  return typeof value === "object" && value !== null && !Array.isArray(value);
}
