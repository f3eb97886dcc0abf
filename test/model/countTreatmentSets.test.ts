import fc from "fast-check";
import { describe, expect, it } from "vitest";
import { buildAlternatives } from "../../src/model/buildAlternatives.js";
import { countTreatmentSets } from "../../src/model/countTreatmentSets.js";
import { countAlternatives, MAX_ALTERNATIVES_PER_SITE, MAX_ALTERNATIVES_TOTAL } from "../../src/model/countAlternatives.js";
import { enumerateTreatmentSets } from "../../src/model/enumerateTreatmentSets.js";
import { siteBaselines } from "../../src/model/siteBaselines.js";
import type { Scenario } from "../../src/model/types.js";
import { treatment } from "./fixtures.js";

// Reference: enumerateTreatmentSets's own list, counted; and binomial sums by hand.
describe("countTreatmentSets", () => {
  it("counts 40 ungrouped candidates with up to 3 each as C(40,1) + C(40,2) + C(40,3) = 10,700 (by hand)", () => {
    const candidates = Array.from({ length: 40 }, (_, i) => treatment({ id: `t${i}` }));
    expect(countTreatmentSets(candidates, { maxTreatments: 3 })).toBe(40 + 780 + 9_880);
    // Up to 6: adds C(40,4) + C(40,5) + C(40,6) = 91,390 + 658,008 + 3,838,380, counted without listing 4.6 million sets.
    expect(countTreatmentSets(candidates, { maxTreatments: 6 })).toBe(10_700 + 91_390 + 658_008 + 3_838_380);
  });

  it("equals the length of the enumerated list for 500 random candidate lists with exclusive groups and site rules", () => {
    const arbitrary = fc.record({
      groups: fc.array(fc.option(fc.constantFrom("g1", "g2", "g3"), { nil: undefined }), { minLength: 0, maxLength: 9 }),
      maxTreatments: fc.integer({ min: 1, max: 6 }),
      requiredMask: fc.nat(511),
      forbiddenMask: fc.nat(511),
    });
    let ran = 0;
    fc.assert(
      fc.property(arbitrary, ({ groups, maxTreatments, requiredMask, forbiddenMask }) => {
        const candidates = groups.map((group, i) => treatment({ id: `t${i}`, ...(group !== undefined && { exclusiveGroup: group }) }));
        // Few required (as must-fund rules name one or two), some forbidden; a forbidden required one gives no set.
        const required = candidates.filter((_, i) => (requiredMask >> i) & 1 && i % 4 === 0).map((t) => t.id);
        const forbidden = candidates.filter((_, i) => (forbiddenMask >> i) & 1 && i % 3 === 1).map((t) => t.id);
        const limits = { maxTreatments, required, forbidden };
        expect(countTreatmentSets(candidates, limits)).toBe(enumerateTreatmentSets(candidates, limits).length);
        ran += 1;
      }),
      { numRuns: 500, seed: 2027 },
    );
    expect(ran).toBe(500);
  });
});

describe("buildAlternatives refuses before it builds", () => {
  const scenarioWith = (candidateCount: number, maxTreatmentsPerSite: number, sites = 1): Scenario => {
    const treatments = Array.from({ length: candidateCount }, (_, i) => treatment({ id: `t${i}` }));
    return {
      name: "limits",
      currency: "USD",
      budget: 1e6,
      crashWindow: { firstYear: 2021, lastYear: 2025 },
      economics: { discountRate: 0.04, horizonYears: 20, crashCosts: { perCrash: { K: 1, A: 1, B: 1, C: 1, O: 1 }, source: "test" } },
      objective: "ksi",
      baseline: "observed",
      maxTreatmentsPerSite,
      catalogue: { treatments, performanceFunctions: [] },
      sites: Array.from({ length: sites }, (_, s) => ({
        id: `S${s}`,
        name: `Site ${s}`,
        kind: "intersection" as const,
        district: "North",
        tags: [],
        crashes: { pedestrian: { K: 0, A: 1, B: 0, C: 0, O: 0 }, bicycle: { K: 0, A: 0, B: 0, C: 0, O: 0 }, motorcycle: { K: 0, A: 0, B: 0, C: 0, O: 0 }, angle: { K: 0, A: 0, B: 0, C: 0, O: 0 }, "rear-end": { K: 0, A: 0, B: 0, C: 0, O: 0 }, "head-on": { K: 0, A: 0, B: 0, C: 0, O: 0 }, "run-off-road": { K: 0, A: 0, B: 0, C: 0, O: 0 }, other: { K: 0, A: 0, B: 0, C: 0, O: 0 } },
        candidates: treatments.map((t) => t.id),
        costOverrides: {},
      })),
      rules: [],
    };
  };

  it("a site with 40 candidates and up to 6 each (4.6 million sets) is a RangeError naming the site, counted not listed", () => {
    const scenario = scenarioWith(40, 6);
    expect(countAlternatives(scenario)).toEqual([4_598_478]);
    expect(() => buildAlternatives(scenario, siteBaselines(scenario))).toThrow(/site S0 has 4598478 alternatives, more than 5000/);
  });

  it("sites within the per-site limit but over the total limit are a RangeError too", () => {
    // 40 candidates, up to 2 each: 820 per site, 1,250 sites: 1,025,000 in all.
    const scenario = scenarioWith(40, 2, 1250);
    expect(countAlternatives(scenario).every((n) => n === 820 && n <= MAX_ALTERNATIVES_PER_SITE)).toBe(true);
    expect(820 * 1250).toBeGreaterThan(MAX_ALTERNATIVES_TOTAL);
    expect(() => buildAlternatives(scenario, siteBaselines(scenario))).toThrow(/1025000 alternatives in all, more than 1000000/);
  });
});
