import { describe, expect, it } from "vitest";
import { runCaptured } from "./captureIo.js";

describe("averta plan justification (smoke, demo scenario)", () => {
  it("adds a justification key to the JSON and keeps the existing contract keys", async () => {
    const io = await runCaptured(["plan", "scenarios/demo.yaml", "--format", "json"]);
    expect(io.code).toBe(0);
    const json = JSON.parse(io.stdout) as Record<string, unknown> & {
      selected: { site: string }[];
      justification: {
        funded: { site: string; bcRank: number }[];
        notFunded: { site: string; reason: string }[];
        rankingComparison: { extraKsiAvoidedByOptimal: number; rankingSpend: number };
      };
      totals: { ksiAvoided: number };
      budget: number;
    };
    for (const key of ["scenario", "currency", "budget", "objective", "status", "totals", "selected", "bound", "gap", "budgetMarginalValue", "engine", "assumptions", "cautions"]) {
      expect(json).toHaveProperty(key);
    }
    const { justification } = json;
    expect(justification.funded.map((f) => f.site)).toEqual(json.selected.map((s) => s.site));
    expect([...justification.funded.map((f) => f.bcRank)].sort((a, b) => a - b)).toEqual(json.selected.map((_, i) => i + 1));
    // Every one of the demo's 51 sites is either funded or has a reason.
    expect(justification.funded.length + justification.notFunded.length).toBe(51);
    // The ranking's list fits the budget and, being feasible, avoids no more than the optimal list.
    expect(justification.rankingComparison.rankingSpend).toBeLessThanOrEqual(json.budget);
    expect(justification.rankingComparison.extraKsiAvoidedByOptimal).toBeGreaterThanOrEqual(0);
  });

  it("compares with the ranking at equal spend: both spends, the optimum at the ranking's spend, the ranking carried on", async () => {
    const io = await runCaptured(["plan", "scenarios/demo.yaml", "--format", "json"]);
    const json = JSON.parse(io.stdout) as { budget: number; totals: { cost: number; ksiAvoided: number }; justification: { rankingComparison: any } };
    const comparison = json.justification.rankingComparison;
    expect(comparison.optimalSpend).toBe(json.totals.cost);
    expect(comparison.extraSpendByOptimal).toBeCloseTo(comparison.optimalSpend - comparison.rankingSpend, 6);
    // (a) solved at the ranking's spend: proven optimal and, the ranking's list being feasible there, at least as good.
    expect(comparison.atRankingSpend.budget).toBe(comparison.rankingSpend);
    expect(comparison.atRankingSpend.status).toBe("optimal");
    expect(comparison.atRankingSpend.spend).toBeLessThanOrEqual(comparison.rankingSpend);
    expect(comparison.atRankingSpend.ksiAvoided).toBeGreaterThanOrEqual(comparison.rankingKsiAvoided);
    expect(comparison.atRankingSpend.extraKsiAvoidedByOptimal).toBeCloseTo(comparison.atRankingSpend.ksiAvoided - comparison.rankingKsiAvoided, 9);
    // (b) carried on within the budget, spending what its steps add.
    const extended = comparison.extendedRanking;
    expect(extended.spend).toBeLessThanOrEqual(json.budget);
    expect(extended.spend).toBeCloseTo(comparison.rankingSpend + extended.steps.reduce((t: number, s: { extraCost: number }) => t + s.extraCost, 0), 6);
    expect(extended.meetsRules).toBe(true);
    expect(extended.extraKsiAvoidedByOptimal).toBeGreaterThanOrEqual(0);
    expect(extended.extraKsiAvoidedByOptimal).toBeCloseTo(json.totals.ksiAvoided - extended.ksiAvoided, 9);
    // The definitions say what is counted: crashes of severity K or A, not people.
    expect(comparison.definitions.ksiAvoided).toMatch(/K\+A/);
    expect(comparison.definitions.ksiAvoided).toMatch(/not people/);
  });

  it("prints the justification sections in the table", async () => {
    const io = await runCaptured(["plan", "scenarios/demo.yaml"]);
    expect(io.code).toBe(0);
    for (const heading of ["Why these projects", "Why not the others", "Upgrades by incremental B/C", "Against a B/C ranking at the same budget", "Cautions:"]) {
      expect(io.stdout).toContain(heading);
    }
    // The comparison table has a column for each list compared, equal-spend ones included.
    for (const column of ["Optimal list", "B/C ranking", "Optimal at the ranking's spend", "Ranking carried on (incremental B/C)"]) expect(io.stdout).toContain(column);
  });
});
