import { describe, expect, it } from "vitest";
import { buildProgramme } from "../../src/analysis/buildProgramme.js";
import { justifyPlan } from "../../src/analysis/justifyPlan.js";
import { planProgramme } from "../../src/analysis/planProgramme.js";
import { preparePlan, type PreparedPlan } from "../../src/analysis/preparePlan.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import { solveProgramme } from "../../src/solver/solveProgramme.js";
import { randomSites, syntheticPlan } from "./syntheticPlan.js";

interface Tally {
  cases: number;
  enteredWithCut: number;
  enteredWithDoubleCut: number;
  stayedOutWithHalfCut: number;
}
const emptyTally = (): Tally => ({ cases: 0, enteredWithCut: 0, enteredWithDoubleCut: 0, stayedOutWithHalfCut: 0 });

// Re-solves with one alternative made cheaper and reports whether its site is then funded with it.
async function entersWhenCostIs(prepared: PreparedPlan, budget: number, site: number, alternative: number, cost: number): Promise<boolean> {
  const programme = buildProgramme(prepared.sites, prepared.scenario.rules, prepared.objective, budget);
  const groups = programme.groups.map((group, g) =>
    g !== site ? group : { ...group, options: group.options.map((option, a) => (a === alternative ? { ...option, cost } : option)) },
  );
  const solution = await solveProgramme({ ...programme, groups });
  expect(solution.status).toBe("optimal");
  return solution.choice[site] === alternative;
}

// For every left-out site with a positive cost cut: does cut + 1% of cost (or twice the cut) bring it in, and does half the cut keep it out?
async function checkThresholds(prepared: PreparedPlan, budget: number, tally: Tally): Promise<void> {
  const plan = await planProgramme(prepared, budget);
  const justification = justifyPlan(plan);
  for (const left of justification.notFunded) {
    const threshold = left.threshold;
    if (threshold === null || !(threshold.costCut > 0) || !Number.isFinite(threshold.costCut)) continue;
    const site = prepared.sites.findIndex((entry) => entry.site.id === left.site);
    const alternative = prepared.sites[site]!.alternatives.findIndex((a) => a.treatments.join("+") === threshold.treatments.join("+"));
    const beyond = Math.max(0, threshold.cost - threshold.costCut - 0.01 * threshold.cost);
    const doubled = Math.max(0, threshold.cost - 2 * threshold.costCut - 0.01 * threshold.cost);
    const halfway = threshold.cost - 0.5 * threshold.costCut;
    tally.cases += 1;
    if (await entersWhenCostIs(prepared, budget, site, alternative, beyond)) tally.enteredWithCut += 1;
    if (await entersWhenCostIs(prepared, budget, site, alternative, doubled)) tally.enteredWithDoubleCut += 1;
    if (!(await entersWhenCostIs(prepared, budget, site, alternative, halfway))) tally.stayedOutWithHalfCut += 1;
  }
}

describe("justifyPlan entry thresholds, verified by re-solving", () => {
  // Measured when written (40 seeds, 20 sites): 177 cases; 63 entered with the cut + 1%, 152 with twice the cut,
  // and 173 stayed out with half the cut. The LP threshold is close to a lower bound on the cut the integer list needs:
  // integer effects (the cheaper alternative must still fit money freed by dropping whole projects) often need more.
  it("on seeded random instances: half the cut keeps the alternative out; the cut alone brings it in only sometimes (integer effects)", async () => {
    const tally = emptyTally();
    for (let seed = 101; seed <= 140; seed += 1) {
      const sites = randomSites(seed, 20, 3);
      const prepared = syntheticPlan(sites, 0);
      const total = sites.reduce((t, s) => t + Math.max(...s.options.map((o) => o.cost)), 0);
      await checkThresholds(prepared, Math.round(total * 0.35), tally);
    }
    console.info(`random threshold cases: ${JSON.stringify(tally)}`);
    expect(tally.cases).toBeGreaterThanOrEqual(150);
    expect(tally.stayedOutWithHalfCut / tally.cases).toBeGreaterThanOrEqual(0.95);
    expect(tally.enteredWithCut / tally.cases).toBeGreaterThanOrEqual(0.3);
    expect(tally.enteredWithDoubleCut / tally.cases).toBeGreaterThanOrEqual(0.8);
    expect(tally.enteredWithDoubleCut).toBeGreaterThanOrEqual(tally.enteredWithCut);
  });

  it("on the demo scenario at its own budget", async () => {
    const prepared = preparePlan(loadScenario("scenarios/demo.yaml").scenario);
    const tally = emptyTally();
    await checkThresholds(prepared, prepared.scenario.budget, tally);
    console.info(`demo threshold cases: ${JSON.stringify(tally)}`);
    // Measured with the Empirical Bayes baseline and combined K+A costs (December 2026): 5 cases, 3 stayed out
    // with half the cut. Integer effects cut both ways near the margin: dropping a whole project can free
    // enough money for an alternative well before its LP threshold, as in the random instances' rare cases.
    expect(tally.cases).toBeGreaterThanOrEqual(1);
    expect(tally.stayedOutWithHalfCut / tally.cases).toBeGreaterThanOrEqual(0.6);
  });
});
