import type { Highs, ModelData } from "highs";
import type { Programme } from "./types.js";

/** A programme as HiGHS arrays, with the (group, option) behind each column. */
export interface HighsModel {
  readonly data: ModelData;
  readonly columnGroup: Int32Array;
  readonly columnOption: Int32Array;
}

/** Which columns to build and which groups must pick one: the whole programme when omitted. */
export interface HighsModelRestriction {
  /** keep[g][a]: build a column for option a of group g. */
  readonly keep: readonly (readonly boolean[])[];
  /** Groups that must pick one of their kept options (doing nothing was ruled out). */
  readonly mustPick: readonly boolean[];
}

/**
 * Builds the programme as a HiGHS model in compressed sparse columns (about 3-4x faster to
 * load than LP text, as we measured): one 0-1 column per option, row 0 the
 * budget, rows 1..G "at most one (exactly one if required)" per group, then one row per side
 * constraint, then one "no-good" row per excluded choice: sum of its chosen columns minus the
 * sum of all others <= (number chosen) - 1, which cuts off exactly that 0-1 point and no other.
 * `integer` false gives the LP relaxation.
 */
export function buildHighsModel(
  highs: Highs,
  programme: Programme,
  integer: boolean,
  restriction?: HighsModelRestriction,
  excluded: readonly (readonly (number | null)[])[] = [],
): HighsModel {
  const { groups, constraints } = programme;
  const columnGroup: number[] = [];
  const columnOption: number[] = [];
  const colCost: number[] = [];
  const starts: number[] = [0];
  const indices: number[] = [];
  const values: number[] = [];
  groups.forEach((group, g) => {
    group.options.forEach((option, a) => {
      if (restriction !== undefined && !restriction.keep[g]![a]) return;
      columnGroup.push(g);
      columnOption.push(a);
      colCost.push(option.value);
      if (option.cost !== 0) {
        indices.push(0);
        values.push(option.cost);
      }
      indices.push(1 + g);
      values.push(1);
      constraints.forEach((constraint, k) => {
        const coefficient = constraint.coefficients[g]?.[a] ?? 0;
        if (coefficient === 0) return;
        indices.push(1 + groups.length + k);
        values.push(coefficient);
      });
      excluded.forEach((choice, e) => {
        indices.push(1 + groups.length + constraints.length + e);
        values.push(choice[g] === a ? 1 : -1);
      });
      starts.push(indices.length);
    });
  });
  const numCols = columnGroup.length;
  const numRows = 1 + groups.length + constraints.length + excluded.length;
  const rowLower: number[] = [-highs.infinity];
  const rowUpper: number[] = [programme.budget];
  groups.forEach((group, g) => {
    rowLower.push(group.required || restriction?.mustPick[g] === true ? 1 : 0);
    rowUpper.push(1);
  });
  for (const constraint of constraints) {
    rowLower.push(constraint.sense === ">=" ? constraint.rhs : -highs.infinity);
    rowUpper.push(constraint.sense === "<=" ? constraint.rhs : highs.infinity);
  }
  for (const choice of excluded) {
    rowLower.push(-highs.infinity);
    rowUpper.push(choice.filter((a) => a !== null).length - 1);
  }
  const data: ModelData = {
    numCols,
    numRows,
    sense: highs.constants.objectiveSense.maximize,
    colCost: Float64Array.from(colCost),
    colLower: new Float64Array(numCols),
    colUpper: new Float64Array(numCols).fill(1),
    rowLower: Float64Array.from(rowLower),
    rowUpper: Float64Array.from(rowUpper),
    matrix: {
      format: "csc",
      numRows,
      numCols,
      starts: Int32Array.from(starts),
      indices: Int32Array.from(indices),
      values: Float64Array.from(values),
    },
    ...(integer ? { integrality: new Int32Array(numCols).fill(highs.constants.variableType.integer) } : {}),
  };
  return { data, columnGroup: Int32Array.from(columnGroup), columnOption: Int32Array.from(columnOption) };
}
