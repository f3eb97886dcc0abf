import { describe, expect, it } from "vitest";
import { planProgramme, type PlanResult } from "../../src/analysis/planProgramme.js";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import type { Scenario } from "../../src/model/types.js";
import { bruteForceProgramme, choiceKey, choiceValue, programmeOptions, programmeViolations, type ProgrammeChoice } from "./programmeBruteForceOptimum.js";
import { randomProgrammeScenario } from "./randomProgrammeScenario.js";

// Reference: exhaustive enumeration of every (treatment set, build year | nothing) per site, each
// programme checked against the year budgets and rules written from their definitions
// (programmeBruteForceOptimum.ts), sharing no code with buildProgramme, programmeYearRows or the solver.
const CASES = 400;
const FIRST_SEED = 41_000;
const close = (a: number, b: number) => Math.abs(a - b) <= 1e-9 * Math.max(Math.abs(a), Math.abs(b)) || Math.abs(a - b) < 1e-12;

/** averta's funded list as the brute force's own picks (null where a site is not funded or the option is unknown to it). */
function picksOf(scenario: Scenario, options: readonly ProgrammeChoice[][], result: PlanResult): { picks: (ProgrammeChoice | null)[]; unknown: string[] } {
  const picks: (ProgrammeChoice | null)[] = scenario.sites.map(() => null);
  const unknown: string[] = [];
  for (const { entry, alternative } of result.funded) {
    const index = scenario.sites.findIndex((site) => site.id === entry.site.id);
    const key = choiceKey(alternative.treatments, alternative.buildYear!);
    const match = options[index]?.find((option) => choiceKey(option.treatments, option.buildYear) === key);
    if (match === undefined || picks[index] !== null) unknown.push(`${entry.site.id} ${key}`);
    else picks[index] = match;
  }
  return { picks, unknown };
}

/** Some option spends capital before its build year (phasing). */
const usesPhasing = (scenario: Scenario, options: readonly ProgrammeChoice[][]) =>
  options.flat().some((o) => o.spendByYear.some((amount, y) => amount > 0 && y !== o.buildYear - scenario.programme!.firstYear));

/** A committed project whose phasing started before the first year (its design year is sunk). */
const sunkSpend = (scenario: Scenario) =>
  scenario.programme!.committed.some((project) => project.treatments.some((id) => {
    const lead = Math.max(0, ...(scenario.catalogue.treatments.find((t) => t.id === id)!.phasing ?? []).map((phase) => phase.yearsBeforeBuild));
    return project.year - lead < scenario.programme!.firstYear;
  }));

describe("multi-year programmes against brute force", () => {
  it(`planProgramme's optimum equals exhaustive enumeration on ${CASES} seeded tiny programmes`, async () => {
    const seen = { none: 0, unspent: 0, phasing: 0, committed: 0, sunk: 0, escalation: 0, windows: 0, yearRules: 0, infeasible: 0, optimal: 0, binding: 0, bindingNone: 0, bindingUnspent: 0, laterBuilds: 0, assignments: 0 };
    for (let seed = FIRST_SEED; seed < FIRST_SEED + CASES; seed += 1) {
      const scenario = randomProgrammeScenario(seed);
      const programme = scenario.programme!;
      const options = programmeOptions(scenario);
      const reference = bruteForceProgramme(scenario, options);
      const result = await planProgramme(preparePlan(scenario));
      const label = `seed ${seed}`;

      seen[programme.carryOver] += 1;
      if (usesPhasing(scenario, options)) seen.phasing += 1;
      if (programme.committed.length > 0) seen.committed += 1;
      if (sunkSpend(scenario)) seen.sunk += 1;
      if (programme.costEscalationRate > 0) seen.escalation += 1;
      if (scenario.sites.some((site) => site.earliestYear !== undefined || site.latestYear !== undefined)) seen.windows += 1;
      if (scenario.rules.some((rule) => "year" in rule && rule.year !== undefined)) seen.yearRules += 1;
      seen.assignments += reference.assignments;
      // The year budgets bind when the total budget alone would allow a better programme (or any at all).
      const binding = reference.bestUnderTotalBudget !== null && (reference.best === null || reference.bestUnderTotalBudget > reference.best && !close(reference.bestUnderTotalBudget, reference.best));
      if (binding) {
        seen.binding += 1;
        seen[programme.carryOver === "none" ? "bindingNone" : "bindingUnspent"] += 1;
      }

      if (reference.best === null) {
        seen.infeasible += 1;
        expect(result.solution.status, label).toBe("infeasible");
        expect(result.funded, label).toEqual([]);
        continue;
      }
      seen.optimal += 1;
      expect(result.solution.status, label).toBe("optimal");
      expect(close(result.solution.objective, reference.best), `${label}: ${result.solution.objective} vs brute force ${reference.best}`).toBe(true);
      // averta's list, read back as the brute force's own options, meets every condition of its checker.
      const { picks, unknown } = picksOf(scenario, options, result);
      expect(unknown, `${label}: options the brute force does not allow`).toEqual([]);
      expect(programmeViolations(scenario, picks), label).toEqual([]);
      const value = picks.reduce((total, pick) => total + (pick === null ? 0 : choiceValue(scenario, pick)), 0);
      expect(close(value, reference.best), `${label}: list worth ${value} by the brute force's figures`).toBe(true);
      // The brute force's own best list passes its checker (guards the enumeration itself).
      expect(programmeViolations(scenario, reference.bestPicks!), label).toEqual([]);
      if (result.funded.some(({ alternative }) => alternative.buildYear! > programme.firstYear)) seen.laterBuilds += 1;
    }

    // The generator covers what it claims, so the agreement above proves something.
    expect(seen.none).toBeGreaterThan(0);
    expect(seen.unspent).toBeGreaterThan(0);
    expect(seen.phasing).toBeGreaterThan(0);
    expect(seen.committed).toBeGreaterThan(0);
    expect(seen.sunk).toBeGreaterThan(0);
    expect(seen.escalation).toBeGreaterThan(0);
    expect(seen.windows).toBeGreaterThan(0);
    expect(seen.yearRules).toBeGreaterThan(0);
    expect(seen.laterBuilds).toBeGreaterThan(0);
    expect(seen.infeasible).toBeGreaterThan(0);
    expect(seen.infeasible).toBeLessThan(CASES / 3);
    expect(seen.binding).toBeGreaterThan(0);
    expect(seen.bindingNone).toBeGreaterThan(0);
    expect(seen.bindingUnspent).toBeGreaterThan(0);
    expect(seen.optimal + seen.infeasible).toBe(CASES);
    console.log(`programme brute force: ${JSON.stringify(seen)}`);
  });
});
