import type { Programme, ProgrammeGroup, SideConstraint } from "../src/solver/types.js";
import { seededRandom as mulberry32 } from "../scripts/seededRandom.js";

/** Shape of a generated benchmark programme. */
export interface BenchProgrammeShape {
  readonly sites: number;
  /** Budget as a share of the sum of every site's cheapest alternative. */
  readonly budgetShare: number;
  /** Add district spending caps, a spend-share floor for flagged sites and a project-count limit. */
  readonly rules: boolean;
  readonly seed: number;
  /** Alternatives per site; drawn from 3-6 when absent. */
  readonly options?: number;
}


const DISTRICTS = 4;

/**
 * A seeded programme shaped like a city's candidate list: 3-6 alternatives per
 * site, costs 20k-3M on a 1k grid, KSI avoided rising with cost with diminishing returns and
 * noise. With `rules`: each of 4 districts capped at 35% of the budget, flagged sites (about
 * 30%) taking at least 30% of total spend and giving at least 35% of the K+A crashes avoided (the
 * value), and at most a fifth of the sites funded.
 */
export function generateBenchProgramme(shape: BenchProgrammeShape): Programme {
  const random = mulberry32(shape.seed);
  const groups: ProgrammeGroup[] = [];
  const district: number[] = [];
  const flagged: boolean[] = [];
  let cheapestTotal = 0;
  for (let g = 0; g < shape.sites; g += 1) {
    const drawnCount = 3 + Math.floor(random() * 4);
    const count = shape.options ?? drawnCount;
    const siteRisk = 0.05 + random() * random() * 2;
    const options = [];
    let cheapest = Number.POSITIVE_INFINITY;
    for (let a = 0; a < count; a += 1) {
      const cost = 1000 * Math.round(20 + random() * random() * 2980);
      const value = siteRisk * Math.pow(cost / 100_000, 0.6) * (0.6 + 0.8 * random());
      options.push({ cost, value });
      cheapest = Math.min(cheapest, cost);
    }
    cheapestTotal += cheapest;
    groups.push({ id: `site-${String(g).padStart(6, "0")}`, options, required: false });
    district.push(Math.floor(random() * DISTRICTS));
    flagged.push(random() < 0.3);
  }
  const budget = 1000 * Math.round((shape.budgetShare * cheapestTotal) / 1000);
  const constraints: SideConstraint[] = [];
  if (shape.rules) {
    for (let d = 0; d < DISTRICTS; d += 1) {
      constraints.push({
        id: `cap-district-${d}`,
        label: `spend in district ${d} <= 35% of budget`,
        sense: "<=",
        rhs: 0.35 * budget,
        coefficients: groups.map((group, g) => (district[g] === d ? group.options.map((o) => o.cost) : undefined)),
      });
    }
    constraints.push({
      id: "floor-flagged",
      label: "spend at flagged sites >= 30% of total spend",
      sense: ">=",
      rhs: 0,
      coefficients: groups.map((group, g) => group.options.map((o) => (flagged[g] ? 0.7 : -0.3) * o.cost)),
    });
    constraints.push({
      id: "ksi-share-flagged",
      label: "K+A crashes avoided at flagged sites >= 35% of all avoided",
      sense: ">=",
      rhs: 0,
      coefficients: groups.map((group, g) => group.options.map((o) => (flagged[g] ? 0.65 : -0.35) * o.value)),
    });
    constraints.push({
      id: "count",
      label: "at most one site in five funded",
      sense: "<=",
      rhs: Math.floor(shape.sites / 5),
      coefficients: groups.map((group) => group.options.map(() => 1)),
    });
  }
  return { budget, groups, constraints };
}
