import { CRASH_TYPES, SEVERITIES } from "../model/types.js";
import { InputError, type InputProblem } from "./InputError.js";
import type { UnknownCode } from "../geo/CrashRecord.js";
import type { CrashRows } from "./parseCrashCsv.js";
import { quoteValue } from "./quoteValue.js";

/**
 * Largest share of a crash file's data rows that may be rejected for an untranslated severity or
 * crash-type code before the file is refused: 5 %. Above it the mapping is almost surely
 * incomplete (an agency's own codes), and counts built from the rest would be biased.
 */
export const MAX_UNKNOWN_CODE_SHARE = 0.05;

/** Codes listed in one message; the quality report lists them all. */
const CODES_LISTED = 12;

/**
 * Checks the untranslated severity and type codes of a crash file. Above MAX_UNKNOWN_CODE_SHARE
 * of the rows read it throws an InputError (one problem per column) listing the codes, their row
 * counts and first lines, with how to translate them in a mapping file; at or below it returns
 * warnings saying the same. No unknown codes: no warnings.
 */
export function checkUnknownCodes(rows: CrashRows, label: string): string[] {
  if (rows.unknownCodes.length === 0) return [];
  const affected = rows.unknownCodes.reduce((sum, code) => sum + code.rows, 0);
  const share = affected / rows.rowsRead;
  const percent = (100 * share).toFixed(1);
  const byField = (["severity", "type"] as const).map((field) => {
      const codes = rows.unknownCodes.filter((code) => code.field === field);
      return { field, codes, count: codes.reduce((sum, code) => sum + code.rows, 0) };
    })
    .filter((entry) => entry.codes.length > 0);
  if (share > MAX_UNKNOWN_CODE_SHARE) {
    const problems: InputProblem[] = byField.map(({ field, codes, count }) => ({
      code: "unknown-codes",
      file: label,
      line: Math.min(...codes.map((code) => code.firstLine)),
      message: `${rowsOf(count)} ${count === 1 ? "has" : "have"} a ${field} code the mapping does not translate: ${listCodes(codes)}; all told ${affected} of ${rows.rowsRead} rows (${percent}%) have an unknown code, over the ${100 * MAX_UNKNOWN_CODE_SHARE}% limit`,
      hint: mappingHint(field, codes),
    }));
    throw new InputError(problems);
  }
  return byField.map(({ field, codes, count }) => `warning: ${label}: ${rowsOf(count)} rejected for an unknown ${field} code: ${listCodes(codes)} (${percent}% of rows have an unknown code; above ${100 * MAX_UNKNOWN_CODE_SHARE}% tally stops). ${capitalise(mappingHint(field, codes))}`);
}

function rowsOf(count: number): string {
  return `${count} row${count === 1 ? "" : "s"}`;
}

function listCodes(codes: readonly UnknownCode[]): string {
  const shown = codes.slice(0, CODES_LISTED).map((code) => `${code.code === "" ? "(empty)" : quoteValue(code.code)} in ${rowsOf(code.rows)} (first on line ${code.firstLine})`);
  return shown.join(", ") + (codes.length > CODES_LISTED ? `, and ${codes.length - CODES_LISTED} more codes` : "");
}

function mappingHint(field: "severity" | "type", codes: readonly UnknownCode[]): string {
  const example = codes
    .slice(0, 2)
    .map((code) => `${JSON.stringify(code.code)}: ${field === "severity" ? "O" : "other"}`)
    .join(", ");
  const targets = field === "severity" ? `a KABCO letter (${SEVERITIES.join(", ")})` : `a crash type (${CRASH_TYPES.join(", ")})`;
  return `translate each code to ${targets} in a YAML mapping file, e.g. ${field}: { ${example} }, and pass it as --mapping FILE`;
}

function capitalise(text: string): string {
  return text.charAt(0).toUpperCase() + text.slice(1);
}
