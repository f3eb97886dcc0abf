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

  it("prints the justification sections in the table", async () => {
    const io = await runCaptured(["plan", "scenarios/demo.yaml"]);
    expect(io.code).toBe(0);
    for (const heading of ["Why these projects", "Why not the others", "Upgrades by incremental B/C", "Against a B/C ranking at the same budget", "Cautions:"]) {
      expect(io.stdout).toContain(heading);
    }
  });
});
