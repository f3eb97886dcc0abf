import { describe, expect, it } from "vitest";
import { buildProgramme } from "../../src/analysis/buildProgramme.js";
import { planProgramme } from "../../src/analysis/planProgramme.js";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import type { Scenario } from "../../src/model/types.js";
import { checkSolution } from "../../src/solver/index.js";

// A binding K+A share floor with K+A as the objective ties every option outside the floor's scope
// at the LP prices: the restriction is a subset-sum with about 2^115 programmes, which branch and
// bound alone did not prove within a minute (found on the demo by an uncertainty run). The engine
// must prove these within its default time limit.
describe("a binding K+A share floor on the Empirical Bayes demo is proven optimal", () => {
  const { scenario: demo } = loadScenario("scenarios/demo-eb.yaml");
  const base: Scenario = {
    ...demo,
    economics: { ...demo.economics, trafficGrowthRate: 0.015, renewal: "residual-value", cmfCombination: { rule: "dominant-common-residuals", floor: 0.3 } },
  };
  for (const share of [0.3, 0.35, 0.5]) {
    it(`Old Town at least ${share * 100}% of the K+A crashes avoided`, async () => {
      const scenario: Scenario = { ...base, rules: [...base.rules, { kind: "ksi-share-floor", district: "Old Town", share }] };
      const prepared = preparePlan(scenario);
      const plan = await planProgramme(prepared, scenario.budget, {});
      expect(plan.solution.status).toBe("optimal");
      // Proven: the reported bound is within the documented 1e-9 relative of the list's value.
      expect(plan.solution.bound - plan.solution.objective).toBeLessThanOrEqual(1e-9 * Math.max(1, plan.solution.bound));
      const check = checkSolution(buildProgramme(prepared.sites, scenario.rules, scenario.objective, scenario.budget), plan.solution.choice);
      expect(check.problems).toEqual([]);
      expect(check.objective).toBeCloseTo(plan.solution.objective, 9);
    });
  }
});
