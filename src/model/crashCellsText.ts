import type { CrashCells } from "./matchEffectCells.js";
import { CRASH_TYPES, SEVERITIES } from "./types.js";

/**
 * A block of crash cells in words, as messages and assumption lines name an effect's cells.
 * @example { crashTypes: ["pedestrian"], severities: SEVERITIES } → "pedestrian crashes, all severities"
 */
export function crashCellsText(cells: CrashCells): string {
  const types = CRASH_TYPES.every((type) => cells.crashTypes.includes(type)) ? "all crash types" : `${cells.crashTypes.join(", ")} crashes`;
  const severities = SEVERITIES.every((severity) => cells.severities.includes(severity)) ? "all severities" : `severities ${cells.severities.join(", ")}`;
  return `${types}, ${severities}`;
}
