import type { Programme, ProgrammeGroup, SideConstraint } from "../src/solver/types.js";
import { generateBenchProgramme } from "./generateBenchProgramme.js";

/** Shape of a generated multi-year benchmark programme. */
export interface BenchYearProgrammeShape {
  readonly sites: number;
  readonly years: number;
  readonly carryOver: "none" | "unspent";
  readonly seed: number;
}

/** Analysis horizon of the generated programmes, in years. */
const HORIZON = 20;
/** Capital escalation per year and the design share spent a year before building, for options above 1M. */
const ESCALATION = 0.03;
const DESIGN_SHARE = 0.2;

/**
 * A seeded multi-year programme built on generateBenchProgramme's sites (3–6 alternatives each):
 * every alternative in every build year d (none in the first year when it needs a design year),
 * K+A falling with the years of benefit left, (H − d) / H, capital escalating 3 % a year, and
 * options above 1M spending 20 % the year before. The budget is 30 % of the sum of the sites'
 * cheapest alternatives, spread evenly; rows as the analysis builds them (programmeYearRows).
 */
export function generateBenchYearProgramme(shape: BenchYearProgrammeShape): Programme {
  const base = generateBenchProgramme({ sites: shape.sites, budgetShare: 0.3, rules: false, seed: shape.seed });
  const spends: number[][][] = [];
  const groups: ProgrammeGroup[] = base.groups.map((group) => {
    const options: { cost: number; value: number }[] = [];
    const spend: number[][] = [];
    for (let d = 0; d < shape.years; d += 1) {
      for (const option of group.options) {
        const capital = option.cost * Math.pow(1 + ESCALATION, d);
        const designed = option.cost > 1_000_000;
        if (designed && d === 0) continue;
        const byYear = new Array<number>(shape.years).fill(0);
        if (designed) {
          byYear[d - 1] = capital * DESIGN_SHARE;
          byYear[d] = capital * (1 - DESIGN_SHARE);
        } else byYear[d] = capital;
        options.push({ cost: capital, value: (option.value * (HORIZON - d)) / HORIZON });
        spend.push(byYear);
      }
    }
    spends.push(spend);
    return { id: group.id, required: false, options };
  });
  const yearBudget = base.budget / shape.years;
  const rows: SideConstraint[] = [];
  for (let y = 0; y < shape.years; y += 1) {
    if (shape.carryOver === "unspent" && y === shape.years - 1) break;
    rows.push({
      id: `year-${y + 1}`,
      label: `year ${y + 1}`,
      sense: "<=",
      rhs: shape.carryOver === "unspent" ? yearBudget * (y + 1) : yearBudget,
      coefficients: spends.map((spend) => spend.map((byYear) => (shape.carryOver === "unspent" ? byYear.slice(0, y + 1).reduce((a, b) => a + b, 0) : byYear[y]!))),
    });
  }
  return { budget: base.budget, groups, constraints: rows };
}
