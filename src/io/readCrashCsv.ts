import type { CrashMapping } from "./CrashMapping.js";
import { parseCrashCsv, type CrashCsvOptions, type CrashRows } from "./parseCrashCsv.js";
import { readTextFile } from "./readTextFile.js";

/** Reads a crash CSV file (RFC 4180, UTF-8; comma, semicolon or tab) into crash records and rejected rows. */
export function readCrashCsv(file: string, mapping: CrashMapping, options: CrashCsvOptions = {}): CrashRows {
  return parseCrashCsv(readTextFile(file), mapping, file, options);
}
