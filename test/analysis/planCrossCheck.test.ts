import { describe, expect, it } from "vitest";
import { CROSS_CHECK_OBJECTIVE_TOLERANCE, runCrossCheck } from "../../bench/crossCheckBench.js";

// Reference: an independent model built from each scenario's rules (bench/referenceOptimum.ts): its
// own enumeration of treatment sets, every rule written from its definition as LP text, HiGHS's
// one-shot solver (mip_rel_gap 1e-6, feasibility tolerances 1e-9) and its own feasibility test. It
// shares no code with buildAlternatives, buildProgramme or src/solver. `npm run bench` runs 300.
const CASES = 60;

describe("plans with policy rules against an independent HiGHS model", () => {
  it(`agrees on ${CASES} seeded scenarios with K+A share floors, caps, floors, counts and site rules`, async () => {
    const { summary, failures } = await runCrossCheck(1, CASES);
    expect(failures, JSON.stringify(failures, null, 1)).toEqual([]);
    expect(summary.cases).toBe(CASES);
    expect(summary.statusMismatches).toBe(0);
    expect(summary.referenceUndecided).toBe(0);
    // Objectives within CROSS_CHECK_OBJECTIVE_TOLERANCE (1e-6) relative; every list feasible by the reference's own test.
    expect(CROSS_CHECK_OBJECTIVE_TOLERANCE).toBe(1e-6);
    expect(summary.objectiveMismatches).toBe(0);
    expect(summary.infeasibleAnswers).toBe(0);
    expect(summary.enumerationMismatches).toBe(0);
    // The generator must exercise the rule that broke before, and both outcomes, or this proves little.
    expect(summary.withKsiShareFloor).toBeGreaterThanOrEqual(CASES / 2);
    expect(summary.infeasible).toBeGreaterThan(0);
    expect(summary.infeasible).toBeLessThan(CASES / 4);
    for (const what of ["ksi-share-floor", "spend-cap", "spend-floor", "max-projects", "must-fund", "never-fund", "exclusive groups", "whole-programme spending rule", "objective ksi", "objective benefit"]) {
      expect(summary.coverage[what] ?? 0, what).toBeGreaterThan(0);
    }
  }, 900_000);
});
