import { describe, expect, it } from "vitest";
import { budgetFrontier, budgetLevels } from "../../src/analysis/budgetFrontier.js";
import { fullFundingCost } from "../../src/analysis/fullFundingCost.js";
import { randomSites, syntheticPlan, type SyntheticSite } from "./syntheticPlan.js";

// Independent reference written here, not the solver: try every choice (none or one option per site).
function bruteForceKsi(sites: readonly SyntheticSite[], budget: number): number {
  let best = 0;
  const visit = (s: number, cost: number, ksi: number): void => {
    if (cost > budget) return;
    if (s === sites.length) {
      best = Math.max(best, ksi);
      return;
    }
    visit(s + 1, cost, ksi);
    for (const option of sites[s]!.options) visit(s + 1, cost + option.cost, ksi + option.ksi);
  };
  visit(0, 0, 0);
  return best;
}

describe("budgetFrontier", () => {
  it("matches brute-force enumeration at every level and never falls as the budget rises (seeded random instances)", async () => {
    let instances = 0;
    let levelsChecked = 0;
    for (let seed = 1; seed <= 25; seed += 1) {
      const sites = randomSites(seed, 6, 3);
      const prepared = syntheticPlan(sites, 0);
      const top = fullFundingCost(prepared);
      const frontier = await budgetFrontier(prepared, budgetLevels(0, top, 8));
      let previous = -Infinity;
      for (const level of frontier) {
        expect(level.plan.solution.status).toBe("optimal");
        expect(level.plan.totals.cost).toBeLessThanOrEqual(level.budget);
        expect(level.plan.totals.ksiAvoided).toBeCloseTo(bruteForceKsi(sites, level.budget), 9);
        expect(level.plan.totals.ksiAvoided).toBeGreaterThanOrEqual(previous);
        previous = level.plan.totals.ksiAvoided;
        levelsChecked += 1;
      }
      // At the full-funding cost every site's most-KSI option fits: the top level buys the sum of the best.
      expect(frontier.at(-1)!.plan.totals.ksiAvoided).toBe(sites.reduce((t, s) => t + Math.max(...s.options.map((o) => o.ksi)), 0));
      instances += 1;
    }
    expect(instances).toBe(25);
    expect(levelsChecked).toBe(25 * 9);
  });

  it("fullFundingCost takes each site's most-valuable alternative, the cheaper on a tie (hand-computed)", () => {
    const prepared = syntheticPlan(
      [
        { id: "A", options: [{ cost: 10, ksi: 3 }, { cost: 40, ksi: 5 }] },
        { id: "B", options: [{ cost: 30, ksi: 4 }, { cost: 20, ksi: 4 }] },
        { id: "C", options: [] },
      ],
      0,
    );
    expect(fullFundingCost(prepared)).toBe(40 + 20);
  });
});
