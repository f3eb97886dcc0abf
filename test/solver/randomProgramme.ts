import type { Programme, ProgrammeGroup, SideConstraint } from "../../src/solver/types.js";
import { seededRandom } from "../../scripts/seededRandom.js";

export { seededRandom };


export interface RandomProgrammeShape {
  readonly groups: number;
  readonly minOptions: number;
  readonly maxOptions: number;
  /** Budget as a fraction of the sum of each group's dearest option. */
  readonly budgetShare: number;
  /** Chance that a group is must-fund. */
  readonly requiredChance: number;
  /** Add district caps, a spend-share floor, a value-share floor and a project-count limit. */
  readonly sideConstraints: boolean;
  /** Largest cost; costs and values are whole numbers so that sums are exact in floating point. */
  readonly maxCost: number;
  /** Multiplies values before rounding: larger means fewer exact ties between programmes. */
  readonly valueScale: number;
}

const DEFAULT_SHAPE: RandomProgrammeShape = {
  groups: 6,
  minOptions: 1,
  maxOptions: 4,
  budgetShare: 0.4,
  requiredChance: 0.1,
  sideConstraints: false,
  maxCost: 100,
  valueScale: 1,
};

/**
 * A seeded random programme with whole-number costs and values (so every sum is exact and
 * optima compare exactly across engines). Values rise with cost with diminishing returns and
 * noise, like the benchmark's (bench/generateBenchProgramme.ts); zero costs and zero values occur on purpose.
 */
export function randomProgramme(seed: number, shape: Partial<RandomProgrammeShape> = {}): Programme {
  const s = { ...DEFAULT_SHAPE, ...shape };
  const random = seededRandom(seed);
  const int = (lo: number, hi: number): number => lo + Math.floor(random() * (hi - lo + 1));
  const groups: ProgrammeGroup[] = [];
  const district: number[] = [];
  const flagged: boolean[] = [];
  let dearestTotal = 0;
  for (let g = 0; g < s.groups; g += 1) {
    const count = int(s.minOptions, s.maxOptions);
    const options = [];
    const scale = 0.5 + random();
    let dearest = 0;
    for (let a = 0; a < count; a += 1) {
      const cost = random() < 0.05 ? 0 : int(1, s.maxCost);
      const value = random() < 0.05 ? 0 : Math.max(0, Math.round(s.valueScale * scale * 10 * Math.sqrt(cost) * (0.7 + 0.6 * random())));
      options.push({ cost, value });
      dearest = Math.max(dearest, cost);
    }
    dearestTotal += dearest;
    groups.push({ id: `S${String(g).padStart(5, "0")}`, options, required: random() < s.requiredChance });
    district.push(int(0, 2));
    flagged.push(random() < 0.4);
  }
  const budget = Math.round(s.budgetShare * dearestTotal);
  const constraints: SideConstraint[] = [];
  if (s.sideConstraints) {
    for (let d = 0; d < 2; d += 1) {
      constraints.push({
        id: `cap-${d}`,
        label: `spend in district ${d} <= ${Math.round(budget * 0.45)}`,
        sense: "<=",
        rhs: Math.round(budget * 0.45),
        coefficients: groups.map((group, g) => (district[g] === d ? group.options.map((o) => o.cost) : undefined)),
      });
    }
    // Spend-share floor: flagged spend >= 1/4 of all spend, i.e. sum (flagged - 1/4) * cost >= 0.
    constraints.push({
      id: "floor-flagged",
      label: "flagged spend >= 25% of total",
      sense: ">=",
      rhs: 0,
      coefficients: groups.map((group, g) => group.options.map((o) => (flagged[g] ? 0.75 : -0.25) * o.cost)),
    });
    constraints.push({
      id: "ksi-share",
      label: "value in flagged sites >= 20% of total",
      sense: ">=",
      rhs: 0,
      coefficients: groups.map((group, g) => group.options.map((o) => (flagged[g] ? 0.75 : -0.25) * o.value * 0.8)),
    });
    constraints.push({
      id: "count",
      label: "at most 60% of sites funded",
      sense: "<=",
      rhs: Math.max(1, Math.floor(0.6 * s.groups)),
      coefficients: groups.map((group) => group.options.map(() => 1)),
    });
  }
  return { budget, groups, constraints };
}
