import { CRASH_TYPES, KSI_SEVERITIES, SEVERITIES, type CrashMatrix, type CrashType, type Severity } from "./types.js";

/** A set of crash cells an evaluation estimates one effect on: all crashes, K+A crashes, or one crash type. */
export interface CrashGroup {
  readonly id: string;
  readonly label: string;
  readonly crashTypes: readonly CrashType[];
  readonly severities: readonly Severity[];
}

export const ALL_CRASHES: CrashGroup = { id: "total", label: "all crashes", crashTypes: CRASH_TYPES, severities: SEVERITIES };
export const KSI_CRASHES: CrashGroup = { id: "ksi", label: "K+A crashes", crashTypes: CRASH_TYPES, severities: KSI_SEVERITIES };

/** One crash type at every severity. */
export function crashTypeGroup(type: CrashType): CrashGroup {
  return { id: type, label: `${type} crashes`, crashTypes: [type], severities: SEVERITIES };
}

/** The crashes (or shares) of a matrix that fall in the group. */
export function crashesInGroup(matrix: CrashMatrix, group: CrashGroup): number {
  let total = 0;
  for (const type of group.crashTypes) for (const severity of group.severities) total += matrix[type][severity];
  return total;
}
