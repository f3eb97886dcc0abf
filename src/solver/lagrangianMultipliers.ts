import type { Highs } from "highs";
import { runHighs } from "./runHighs.js";
import type { Programme } from "./types.js";

/** Most evaluations of the Lagrangian dual; any multipliers give a valid bound, so stopping early is safe. */
const MAX_ITERATIONS = 300;

/** Stop when the cutting-plane model promises less than this (relative) decrease inside an unbinding box. */
const RELATIVE_TOLERANCE = 1e-11;

/** A serious step must achieve this share of the decrease the model promised. */
const SERIOUS_STEP = 0.1;

/** Multipliers of the Lagrangian dual and the bound they give. */
export interface LagrangianMultipliers {
  /** One per row written as "sum of uses <= room": row 0 the budget, row 1 + k side constraint k (>= rows negated). */
  readonly multipliers: Float64Array;
  /** L(multipliers): an upper bound on every feasible programme's value, and on the LP relaxation's. */
  readonly bound: number;
  readonly iterations: number;
  /**
   * The cutting-plane model, inside a box that did not bind, promised less than a 1e-11 relative
   * decrease: L is then within that of its minimum, the LP relaxation's optimum. False when the
   * iterations or the time ran out first (the multipliers still give a valid bound).
   */
  readonly converged: boolean;
}

/** The programme's rows in "<=" form, as dense per-option uses (option j of the flattened options). */
export interface RowForm {
  readonly rowCount: number;
  readonly room: Float64Array;
  /** uses[r * optionCount + j] */
  readonly uses: Float64Array;
  readonly optionCount: number;
  /** First flattened option of group g (groupStart[groups.length] = optionCount). */
  readonly groupStart: Int32Array;
  readonly values: Float64Array;
}

/** Flattens a programme's rows in "<=" form (>= rows negated), once, for repeated evaluation. */
export function rowForm(programme: Programme): RowForm {
  const { groups, constraints } = programme;
  const rowCount = 1 + constraints.length;
  const groupStart = new Int32Array(groups.length + 1);
  groups.forEach((group, g) => {
    groupStart[g + 1] = groupStart[g]! + group.options.length;
  });
  const optionCount = groupStart[groups.length]!;
  const uses = new Float64Array(rowCount * optionCount);
  const values = new Float64Array(optionCount);
  const room = new Float64Array(rowCount);
  room[0] = programme.budget;
  constraints.forEach((c, k) => {
    room[1 + k] = c.sense === "<=" ? c.rhs : -c.rhs;
  });
  groups.forEach((group, g) => {
    group.options.forEach((option, a) => {
      const j = groupStart[g]! + a;
      values[j] = option.value;
      uses[j] = option.cost;
      constraints.forEach((c, k) => {
        const coefficient = c.coefficients[g]?.[a] ?? 0;
        uses[(1 + k) * optionCount + j] = c.sense === "<=" ? coefficient : -coefficient;
      });
    });
  });
  return { rowCount, room, uses, optionCount, groupStart, values };
}

/**
 * L(y) = sum_r y_r room_r + sum_g max(0 if optional, max_a value_ga - sum_r y_r use_rga), and the
 * subgradient room_r - sum_g use_r of each group's best choice (written into `subgradient`).
 */
export function lagrangianValue(programme: Programme, form: RowForm, y: Float64Array, subgradient: Float64Array): number {
  const { rowCount, room, uses, optionCount, groupStart, values } = form;
  let total = 0;
  for (let r = 0; r < rowCount; r += 1) {
    total += y[r]! * room[r]!;
    subgradient[r] = room[r]!;
  }
  const groups = programme.groups;
  for (let g = 0; g < groups.length; g += 1) {
    let best = groups[g]!.required ? Number.NEGATIVE_INFINITY : 0;
    let at = -1;
    for (let j = groupStart[g]!; j < groupStart[g + 1]!; j += 1) {
      let x = values[j]!;
      for (let r = 0; r < rowCount; r += 1) x -= y[r]! * uses[r * optionCount + j]!;
      if (x > best) {
        best = x;
        at = j;
      }
    }
    total += best;
    if (at >= 0) for (let r = 0; r < rowCount; r += 1) subgradient[r] -= uses[r * optionCount + at]!;
  }
  return total;
}

/**
 * Minimises the Lagrangian dual of the programme's rows (budget and side constraints) by a box-step
 * cutting-plane method (Kelley, "The cutting-plane method for solving convex programs", J. SIAM 8(4),
 * 1960; the box trust region after Marsten, Hogan & Blankenship, Operations Research 23(2), 1975;
 * both from memory): each evaluation of L gives a cut L(y_i) + s_i (y - y_i); HiGHS minimises the
 * cuts' maximum inside a box around the best point so far; the box grows after good steps and
 * shrinks after failed ones. Multipliers are scaled so that each row's typical use is worth about one
 * typical option value. Starts from `start` (e.g. the budget's LP rate, zeros elsewhere).
 * The minimum equals the LP relaxation's optimum; every point on the way is a valid upper bound.
 */
export function lagrangianMultipliers(highs: Highs, programme: Programme, form: RowForm, start: Float64Array, deadline: number): LagrangianMultipliers {
  const { rowCount, uses, optionCount, values } = form;
  // Scale: mean |value| over mean |use| per row (1 when a row has no uses).
  let meanValue = 0;
  for (let j = 0; j < optionCount; j += 1) meanValue += Math.abs(values[j]!);
  meanValue = Math.max(meanValue / Math.max(1, optionCount), 1e-12);
  const scale = new Float64Array(rowCount);
  for (let r = 0; r < rowCount; r += 1) {
    let meanUse = 0;
    for (let j = 0; j < optionCount; j += 1) meanUse += Math.abs(uses[r * optionCount + j]!);
    meanUse /= Math.max(1, optionCount);
    scale[r] = meanUse > 0 ? meanValue / meanUse : 1;
  }

  const cuts: { value: number; at: Float64Array; slope: Float64Array }[] = [];
  const evaluate = (y: Float64Array): number => {
    const slope = new Float64Array(rowCount);
    const value = lagrangianValue(programme, form, y, slope);
    cuts.push({ value, at: Float64Array.from(y), slope });
    return value;
  };
  let center: Float64Array = Float64Array.from(start, (v) => Math.max(0, v));
  let centerValue = evaluate(center);
  let box = 1;
  let failures = 0;
  let iterations = 1;
  let converged = false;
  for (; iterations < MAX_ITERATIONS && Date.now() < deadline; iterations += 1) {
    const step = masterStep(highs, cuts, center, box, scale, deadline);
    if (step === undefined) break;
    const predicted = centerValue - step.modelValue;
    if (predicted <= RELATIVE_TOLERANCE * Math.max(1, Math.abs(centerValue))) {
      if (!step.atBox) {
        converged = true;
        break;
      }
      box *= 4;
      continue;
    }
    const value = evaluate(step.point);
    if (centerValue - value >= SERIOUS_STEP * predicted) {
      center = step.point;
      centerValue = value;
      if (step.atBox) box *= 2;
      failures = 0;
    } else if ((failures += 1) >= 3) {
      box /= 2;
      failures = 0;
    }
  }
  return { multipliers: center, bound: centerValue, iterations, converged };
}

// min t s.t. t >= value_i + slope_i (y - at_i) for every cut, y >= 0 within box * scale of the center.
function masterStep(
  highs: Highs,
  cuts: readonly { value: number; at: Float64Array; slope: Float64Array }[],
  center: Float64Array,
  box: number,
  scale: Float64Array,
  deadline: number,
): { point: Float64Array; modelValue: number; atBox: boolean } | undefined {
  const rowCount = center.length;
  // Columns z_r = y_r / scale_r, then t; rows: t - sum_r slope_r scale_r z_r >= value - slope . at.
  const numCols = rowCount + 1;
  const numRows = cuts.length;
  const starts: number[] = [0];
  const indices: number[] = [];
  const coefficients: number[] = [];
  for (let r = 0; r < rowCount; r += 1) {
    cuts.forEach((cut, i) => {
      const c = -cut.slope[r]! * scale[r]!;
      if (c !== 0) {
        indices.push(i);
        coefficients.push(c);
      }
    });
    starts.push(indices.length);
  }
  cuts.forEach((_, i) => {
    indices.push(i);
    coefficients.push(1);
  });
  starts.push(indices.length);
  const rowLower = Float64Array.from(cuts, (cut) => {
    let x = cut.value;
    for (let r = 0; r < rowCount; r += 1) x -= cut.slope[r]! * cut.at[r]!;
    return x;
  });
  const colLower = new Float64Array(numCols);
  const colUpper = new Float64Array(numCols);
  for (let r = 0; r < rowCount; r += 1) {
    colLower[r] = Math.max(0, center[r]! / scale[r]! - box);
    colUpper[r] = center[r]! / scale[r]! + box;
  }
  colLower[rowCount] = -highs.infinity;
  colUpper[rowCount] = highs.infinity;
  const colCost = new Float64Array(numCols);
  colCost[rowCount] = 1;
  const run = runHighs(
    highs,
    {
      numCols,
      numRows,
      sense: highs.constants.objectiveSense.minimize,
      colCost,
      colLower,
      colUpper,
      rowLower,
      rowUpper: new Float64Array(numRows).fill(highs.infinity),
      matrix: { format: "csc", numRows, numCols, starts: Int32Array.from(starts), indices: Int32Array.from(indices), values: Float64Array.from(coefficients) },
    },
    { timeLimitSeconds: (deadline - Date.now()) / 1000, relativeGap: 0, absoluteGap: 0 },
  );
  if (run.status !== "optimal" || run.colValue.length !== numCols) return undefined;
  const point = new Float64Array(rowCount);
  let atBox = false;
  for (let r = 0; r < rowCount; r += 1) {
    const z = run.colValue[r]!;
    point[r] = Math.max(0, z * scale[r]!);
    const edge = 1e-9 * Math.max(1, box);
    if (z >= colUpper[r]! - edge || (colLower[r]! > 0 && z <= colLower[r]! + edge)) atBox = true;
  }
  return { point, modelValue: run.colValue[rowCount]!, atBox };
}
