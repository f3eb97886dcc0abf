import type { CrashType, GeoPoint, Severity } from "../model/types.js";

/** One usable crash from a crash file, with the line it starts on. */
export interface CrashRecord {
  readonly line: number;
  readonly id: string;
  readonly year: number;
  /** The calendar day, ISO (YYYY-MM-DD), as written in the file (a time after it does not shift it). */
  readonly date: string;
  readonly severity: Severity;
  readonly type: CrashType;
  readonly location: GeoPoint;
}

/** Why a crash row was set aside. */
export type RejectReason =
  | "wrong-field-count"
  | "missing-id"
  | "invalid-date"
  | "missing-coordinates"
  | "invalid-coordinates"
  | "unknown-severity"
  | "unknown-type"
  | "outside-window"
  | "duplicate-id";

export const REJECT_REASONS: readonly RejectReason[] = [
  "wrong-field-count",
  "missing-id",
  "invalid-date",
  "missing-coordinates",
  "invalid-coordinates",
  "unknown-severity",
  "unknown-type",
  "outside-window",
  "duplicate-id",
];

/** A crash row that was not counted, with its line and what was wrong. */
export interface RejectedRow {
  readonly line: number;
  readonly reason: RejectReason;
  readonly message: string;
}

/** A severity or crash-type code that the mapping does not translate, the rows rejected for it and its first line. */
export interface UnknownCode {
  readonly field: "severity" | "type";
  readonly code: string;
  readonly rows: number;
  readonly firstLine: number;
}
