import type { Highs, ModelData } from "highs";
import { NO_OPTION } from "./buildGroupHull.js";
import { buildHighsModel } from "./buildHighsModel.js";
import { readHighsChoice } from "./readHighsChoice.js";
import type { Programme, ProgrammeGroup, SideConstraint } from "./types.js";

/** A restriction as a HiGHS model of its open groups only, and the way back to whole programmes. */
export interface RestrictedModel {
  readonly data: ModelData;
  /** What the fixed groups contribute to the objective: add it to the model's bound. */
  readonly fixedValue: number;
  /** The whole programme's choice from HiGHS's column values; undefined when they are not a 0-1 point. */
  lift(colValue: Float64Array): (number | null)[] | undefined;
  /** A programme of the restriction as column values, to start HiGHS from. */
  start(choice: readonly (number | null)[]): Float64Array;
}

/**
 * The restricted programme as a MIP over the groups left with a choice: groups with one allowed
 * choice are fixed and folded into the budget and the right-hand sides, so HiGHS sees a few hundred
 * rows instead of one per site (at 5,000 sites, about 120 open groups out of 5,000). Excluded
 * programmes (HiGHS answers the check refused) become no-good rows when their fixed part matches the
 * restriction's, and are dropped otherwise (the restriction already excludes them).
 */
export function buildRestrictedModel(
  highs: Highs,
  programme: Programme,
  choices: readonly (readonly number[])[],
  excluded: readonly (readonly (number | null)[])[],
): RestrictedModel {
  const open: number[] = [];
  const fixed = choices.map((allowed) => (allowed.length === 1 ? allowed[0]! : undefined));
  let fixedValue = 0;
  let fixedCost = 0;
  programme.groups.forEach((group, g) => {
    const a = fixed[g];
    if (a === undefined) open.push(g);
    else if (a !== NO_OPTION) {
      fixedValue += group.options[a]!.value;
      fixedCost += group.options[a]!.cost;
    }
  });
  const kept = open.map((g) => choices[g]!.filter((a) => a !== NO_OPTION));
  const groups: ProgrammeGroup[] = open.map((g, i) => ({
    id: programme.groups[g]!.id,
    required: !choices[g]!.includes(NO_OPTION),
    options: kept[i]!.map((a) => programme.groups[g]!.options[a]!),
  }));
  const constraints: SideConstraint[] = programme.constraints.map((c) => {
    let used = 0;
    fixed.forEach((a, g) => {
      if (a !== undefined && a !== NO_OPTION) used += c.coefficients[g]?.[a] ?? 0;
    });
    return { ...c, rhs: c.rhs - used, coefficients: open.map((g, i) => (c.coefficients[g] === undefined ? undefined : kept[i]!.map((a) => c.coefficients[g]![a]!))) };
  });
  const toOpen = (choice: readonly (number | null)[]): (number | null)[] =>
    open.map((g, i) => {
      const a = choice[g];
      return a === null || a === undefined ? null : kept[i]!.indexOf(a);
    });
  const matchesFixed = (choice: readonly (number | null)[]): boolean => fixed.every((a, g) => a === undefined || (choice[g] ?? NO_OPTION) === a);
  const cuts = excluded.filter(matchesFixed).map(toOpen);
  const model = buildHighsModel(highs, { budget: programme.budget - fixedCost, groups, constraints }, true, undefined, cuts);
  return {
    data: model.data,
    fixedValue,
    lift(colValue) {
      const inner = readHighsChoice(model, colValue, open.length);
      if (inner === undefined) return undefined;
      const choice = fixed.map((a) => (a === undefined || a === NO_OPTION ? null : a));
      // An impossible inner index (two options in one group) stays impossible (-1) for the check to refuse.
      inner.forEach((a, i) => {
        choice[open[i]!] = a === null ? null : a < 0 ? -1 : kept[i]![a]!;
      });
      return choice;
    },
    start(choice) {
      const inner = toOpen(choice);
      return Float64Array.from(model.columnGroup, (i, j) => (inner[i] === model.columnOption[j] ? 1 : 0));
    },
  };
}
