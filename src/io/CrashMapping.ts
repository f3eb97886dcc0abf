import type { CrashType, Severity } from "../model/types.js";

/** Fields of a crash record that come from a CSV column. */
export type CrashField = "id" | "date" | "latitude" | "longitude" | "severity" | "type";
export const CRASH_FIELDS: readonly CrashField[] = ["id", "date", "latitude", "longitude", "severity", "type"];

/** How an agency's crash file maps onto our fields and codes. */
export interface CrashMapping {
  /** CSV header for each field (matched ignoring case and surrounding spaces). */
  readonly columns: Readonly<Record<CrashField, string>>;
  /** Agency severity codes → KABCO letters; the letters K, A, B, C, O are always understood. */
  readonly severity: Readonly<Record<string, Severity>>;
  /** Agency crash type codes → our crash types; our own type names are always understood. */
  readonly type: Readonly<Record<string, CrashType>>;
}

/** Columns named after the fields themselves, and no agency codes. */
export const DEFAULT_CRASH_MAPPING: CrashMapping = {
  columns: { id: "id", date: "date", latitude: "latitude", longitude: "longitude", severity: "severity", type: "type" },
  severity: {},
  type: {},
};
