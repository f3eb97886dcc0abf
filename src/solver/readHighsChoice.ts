import type { HighsModel } from "./buildHighsModel.js";

/**
 * Turns HiGHS column values into one option (or null) per group. HiGHS's answer is untrusted:
 * a value more than 1e-6 from 0 or 1 means the point is not integral and undefined is returned;
 * two options set in one group are passed on as an impossible index (-1) for the verifier to reject.
 */
export function readHighsChoice(model: HighsModel, colValue: Float64Array, groupCount: number): (number | null)[] | undefined {
  if (colValue.length !== model.columnGroup.length) return undefined;
  const choice: (number | null)[] = new Array<number | null>(groupCount).fill(null);
  for (let j = 0; j < colValue.length; j += 1) {
    const x = colValue[j]!;
    if (Math.abs(x - Math.round(x)) > 1e-6) return undefined;
    if (Math.round(x) !== 1) continue;
    const g = model.columnGroup[j]!;
    choice[g] = choice[g] === null ? model.columnOption[j]! : -1;
  }
  return choice;
}
