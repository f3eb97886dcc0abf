import type { CrashMapping } from "./CrashMapping.js";
import { parseCrashCsv, type CrashRows } from "./parseCrashCsv.js";
import { readTextFile } from "./readTextFile.js";

/** Reads a crash CSV file (RFC 4180, UTF-8) into crash records and rejected rows. */
export function readCrashCsv(file: string, mapping: CrashMapping): CrashRows {
  return parseCrashCsv(readTextFile(file), mapping, file);
}
