import { describe, expect, it } from "vitest";
import { buildProgramme } from "../../src/analysis/buildProgramme.js";
import { planProgramme } from "../../src/analysis/planProgramme.js";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import { InputError } from "../../src/io/InputError.js";
import { loadScenarioSource } from "../../src/io/loadScenario.js";
import { parseYamlText } from "../../src/io/readYamlFile.js";

// README, scenario rules: a spending rule names a district, a tag, or neither, which means the
// whole programme. Two sites whose every alternative costs 100,000 or more (hand-checked below).
function scenario(rules: string): string {
  return `name: Whole-programme rule
catalogues: [../../catalogs/demo-catalogue.yaml]
currency: USD
budget: 2M
crashWindow: { firstYear: 2021, lastYear: 2025 }
economics:
  discountRate: 0.04
  horizonYears: 20
  crashCosts: { K: 11295400, A: 655000, B: 198500, C: 125600, O: 11900, source: test values }
baseline: observed
${rules}
sites:
  - id: I-01
    name: Alder Street / Brook Road
    kind: intersection
    district: North
    crashes:
      pedestrian: { K: 1, A: 4, B: 3 }
    candidates: [leading-pedestrian-interval, raised-crosswalk]
  - id: S-01
    name: Quay Road
    kind: segment
    district: South
    lengthKm: 1.2
    crashes:
      run-off-road: { K: 1, A: 3, C: 3 }
    candidates: [curve-chevrons]
`;
}
const load = (text: string) => loadScenarioSource(parseYamlText(text, "test/analysis/whole.yaml"), "test/analysis/whole.yaml").scenario;

describe("spending rules over the whole programme (naming neither a district nor a tag)", () => {
  it("a spending cap with an amount and no district or tag caps the spend of the whole programme", async () => {
    const free = await planProgramme(preparePlan(load(scenario(""))));
    expect(free.solution.status).toBe("optimal");
    const cap = Math.floor(free.totals.cost / 2);
    const capped = load(scenario(`rules:\n  spendCaps: [{ amount: ${cap} }]`));
    expect(capped.rules).toEqual([{ kind: "spend-cap", amount: cap }]);
    const programme = buildProgramme(preparePlan(capped).sites, capped.rules, "ksi", capped.budget);
    expect(programme.constraints.map((c) => c.label)).toEqual([`spend in all sites at most ${cap}`]);
    const plan = await planProgramme(preparePlan(capped));
    expect(plan.solution.status).toBe("optimal");
    expect(plan.totals.cost).toBeLessThanOrEqual(cap);
    expect(plan.totals.cost).toBeLessThan(free.totals.cost);
  });

  it("a spending floor with an amount and no district or tag makes the programme spend at least that much", async () => {
    const floor = load(scenario("rules:\n  spendFloors: [{ amount: 3M }]"));
    // More than the 2M budget: no programme can meet it.
    expect((await planProgramme(preparePlan(floor))).solution.status).toBe("infeasible");
  });

  it("refuses a share over the whole programme (always 100%) at the rule's line, with a hint", () => {
    const text = scenario("rules:\n  spendFloors: [{ share: 0.3 }]");
    expect(() => load(text)).toThrow(InputError);
    try {
      load(text);
    } catch (error) {
      const problem = (error as InputError).problems[0]!;
      expect(problem.path).toBe("rules.spendFloors[0]");
      expect(problem.line).toBe(12);
      expect(problem.hint).toMatch(/district or a tag/);
    }
  });
});
