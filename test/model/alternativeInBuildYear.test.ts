import { describe, expect, it } from "vitest";
import { alternativeInBuildYear } from "../../src/model/alternativeInBuildYear.js";
import { alternativesOverBuildYears } from "../../src/model/alternativesOverBuildYears.js";
import { buildYears } from "../../src/model/buildYears.js";
import { evaluateAlternative } from "../../src/model/evaluateAlternative.js";
import { observedCrashesPerYear } from "../../src/model/observedCrashesPerYear.js";
import type { ProgrammeYears } from "../../src/model/programmeTypes.js";
import type { SiteBaseline } from "../../src/model/siteBaselines.js";
import { treatmentCmf } from "../../src/model/treatmentCmf.js";
import type { Economics, Treatment } from "../../src/model/types.js";
import { ALL_SEVERITIES, ALL_TYPES, HAND_ECONOMICS, handSite, treatment } from "./fixtures.js";

// Compound interest factor tables as printed in engineering-economy textbooks (4 % and 7 % tables,
// four decimals; from memory, each checked here against (1 + i)^-n and (1 - (1 + i)^-n) / i):
const PF_4_1 = 0.9615; // (P/F, 4 %, 1)
const PF_4_2 = 0.9246; // (P/F, 4 %, 2)
const PF_7_3 = 0.8163; // (P/F, 7 %, 3)
const PA_4_18 = 12.6593; // (P/A, 4 %, 18)
const PA_4_19 = 13.1339; // (P/A, 4 %, 19)
const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);

const site = handSite();
const perYear = observedCrashesPerYear(site.crashes, 5); // ped K 0.2, A 0.8, B 1.0; angle O 2.0
// CMF 0.6 on pedestrian crashes: avoided a year ped K 0.08, A 0.32, B 0.4 → K+A 0.4 a year;
// crash costs a year 0.08 × 10M + 0.32 × 500k + 0.4 × 100k = 1,000,000.
const pedestrianEffect = [{ crashTypes: ["pedestrian" as const], severities: ALL_SEVERITIES, cmf: 0.6, source: "test" }];
const t1 = treatment({ id: "t1", cost: { basis: "per-site", amount: 100_000 }, upkeepPerYear: 2_000, serviceLifeYears: 10, effects: pedestrianEffect });
const t2 = treatment({ id: "t2", cost: { basis: "per-site", amount: 20_000 }, serviceLifeYears: 5, effects: [{ crashTypes: ALL_TYPES, severities: ALL_SEVERITIES, cmf: 0.8, source: "test" }] });
// Outlives every horizon here and has no upkeep, so its figures are a plain annuity.
const longLived = treatment({ id: "long", cost: { basis: "per-site", amount: 100_000 }, serviceLifeYears: 30, effects: pedestrianEffect });
const phased = (base: Treatment): Treatment => ({ ...base, id: `${base.id}-phased`, phasing: [{ yearsBeforeBuild: 1, share: 0.2 }, { yearsBeforeBuild: 0, share: 0.8 }] });

function programme(overrides: Partial<ProgrammeYears> = {}): ProgrammeYears {
  return { firstYear: 2027, years: 3, budgets: [1e6, 1e6, 1e6], carryOver: "none", costEscalationRate: 0, committed: [], ...overrides };
}

function build(treatments: readonly Treatment[], year: number, options: { economics?: Economics; years?: ProgrammeYears; growth?: number; committed?: boolean } = {}) {
  const economics = options.economics ?? HAND_ECONOMICS;
  return alternativeInBuildYear(site, treatments, perYear, economics, options.years ?? programme(), year, treatmentCmf, options.growth ?? 1, options.committed ?? false);
}

describe("alternativeInBuildYear, hand-worked", () => {
  it("built in the first year with no phasing or escalation: every figure is the one-year list's, exactly", () => {
    const growing = { ...HAND_ECONOMICS, renewal: "renew" as const };
    for (const [treatments, growth] of [[[t1], 1], [[t1, t2], 1.02]] as const) {
      const oneYear = evaluateAlternative(site, treatments, perYear, growing, treatmentCmf, growth);
      const total = treatments.reduce((sum, t) => sum + t.cost.amount, 0);
      expect(build(treatments, 2027, { economics: growing, growth })).toEqual({ ...oneYear, buildYear: 2027, spendByYear: [total, 0, 0] });
    }
  });

  it("checks the cited interest factors against (1 + i)^-n (so the citations are right to 4 decimals)", () => {
    expect(Math.pow(1.04, -1)).toBeCloseTo(PF_4_1, 4);
    expect(Math.pow(1.04, -2)).toBeCloseTo(PF_4_2, 4);
    expect(Math.pow(1.07, -3)).toBeCloseTo(PF_7_3, 4);
    expect((1 - Math.pow(1.04, -18)) / 0.04).toBeCloseTo(PA_4_18, 4);
    expect((1 - Math.pow(1.04, -19)) / 0.04).toBeCloseTo(PA_4_19, 4);
  });

  it("built two years in at 4 %: benefits of years 3…20 discounted to the first year by (P/F, 4 %, 2)", () => {
    // Acts in years 3…20 (18 years): K+A 0.4 × 18 = 7.2; benefit 1,000,000 × (P/A, 4 %, 18) × (P/F, 4 %, 2).
    const late = build([longLived], 2029)!;
    expect(late.ksiAvoided).toBeCloseTo(7.2, 10);
    expect(relative(late.benefitPV, 1_000_000 * PA_4_18 * PF_4_2)).toBeLessThan(1e-4);
    // Capital at the start of year 2 is worth (P/F, 4 %, 2) of it today.
    expect(relative(late.lifecycleCostPV, 100_000 * PF_4_2)).toBeLessThan(1e-4);
    expect(late.spendByYear).toEqual([0, 0, 100_000]);
    expect(late.cost).toBe(100_000);
  });

  it("a build in year d is the one-year list with horizon H − d, scaled by G^d and (P/F, i, d)", () => {
    const sevenPercent: Economics = { ...HAND_ECONOMICS, discountRate: 0.07, renewal: "renew" };
    const growth = 1.02;
    const years = programme({ years: 4, budgets: [1, 1, 1, 1] });
    const late = build([t1, t2], 2030, { economics: sevenPercent, years, growth })!;
    const shifted = evaluateAlternative(site, [t1, t2], perYear, { ...sevenPercent, horizonYears: 17 }, treatmentCmf, growth);
    const g3 = Math.pow(growth, 3);
    expect(relative(late.benefitPV, shifted.benefitPV * g3 * PF_7_3)).toBeLessThan(1e-4); // table's 4 decimals
    expect(relative(late.ksiAvoided, shifted.ksiAvoided * g3)).toBeLessThan(1e-12);
    expect(relative(late.crashesAvoidedPerYear.K, shifted.crashesAvoidedPerYear.K * g3)).toBeLessThan(1e-12);
    expect(late.buildYear).toBe(2030);
  });

  it("K+A avoided falls as the build year moves later (fewer benefit years within the horizon)", () => {
    const renewing = { ...HAND_ECONOMICS, renewal: "renew" as const };
    const ksi = [2027, 2028, 2029].map((year) => build([t1], year, { economics: renewing })!.ksiAvoided);
    // Renewed treatments act to the horizon: 20, 19, 18 years of 0.4 K+A a year.
    expect(ksi[0]).toBeCloseTo(8.0, 10);
    expect(ksi[1]).toBeCloseTo(7.6, 10);
    expect(ksi[2]).toBeCloseTo(7.2, 10);
    const benefit = [2027, 2028, 2029].map((year) => build([t1], year, { economics: renewing })!.benefitPV);
    expect(benefit[1]).toBeLessThan(benefit[0]!);
    expect(benefit[2]).toBeLessThan(benefit[1]!);
    // Without renewal a 10-year life ends inside the horizon wherever it starts (README's caution).
    expect(build([t1], 2029)!.ksiAvoided).toBeCloseTo(build([t1], 2027)!.ksiAvoided, 10);
  });
});

describe("alternativeInBuildYear: escalation and phasing", () => {
  it("escalation: capital × (1 + e)^d in spendByYear and cost, renewals alike; benefits unchanged", () => {
    const renewing = { ...HAND_ECONOMICS, renewal: "renew" as const };
    const flat = build([t2], 2029, { economics: renewing })!;
    const escalated = build([t2], 2029, { economics: renewing, years: programme({ costEscalationRate: 0.03 }) })!;
    const factor = 1.03 * 1.03;
    expect(escalated.spendByYear![2]).toBeCloseTo(20_000 * factor, 8);
    expect(escalated.spendByYear!.slice(0, 2)).toEqual([0, 0]);
    expect(escalated.cost).toBeCloseTo(20_000 * factor, 8);
    // t2 has no upkeep, so capital, renewals and residual value all scale with the escalation.
    expect(relative(escalated.lifecycleCostPV, flat.lifecycleCostPV * factor)).toBeLessThan(1e-12);
    expect(escalated.benefitPV).toBe(flat.benefitPV);
    expect(escalated.ksiAvoided).toBe(flat.ksiAvoided);
  });

  it("escalation 0 charges the stated capital exactly", () => {
    const none = build([t1, t2], 2028, { years: programme({ costEscalationRate: 0 }) })!;
    expect(none.spendByYear).toEqual([0, 120_000, 0]);
    expect(none.cost).toBe(120_000);
  });

  it("phasing 20 % / 80 %: 20 % spent the year before the build year, 80 % in it", () => {
    const alternative = build([phased(longLived)], 2028)!;
    expect(alternative.spendByYear).toEqual([20_000, 80_000, 0]);
    expect(alternative.cost).toBe(100_000);
    // 20,000 now and 80,000 a year from now: 20,000 + 80,000 × (P/F, 4 %, 1).
    expect(relative(alternative.lifecycleCostPV, 20_000 + 80_000 * PF_4_1)).toBeLessThan(1e-4);
    // Phasing moves money only: benefits are those of the same build without phasing.
    expect(alternative.benefitPV).toBe(build([longLived], 2028)!.benefitPV);
    expect(relative(alternative.benefitPV, 1_000_000 * PA_4_19 * PF_4_1)).toBeLessThan(1e-4);
  });

  it("phasing before the first year rules the first year out, unless the project is committed (sunk spend)", () => {
    expect(build([phased(longLived)], 2027)).toBeUndefined();
    const committed = build([phased(longLived)], 2027, { committed: true })!;
    expect(committed.spendByYear).toEqual([80_000, 0, 0]);
    expect(committed.cost).toBe(80_000);
    // The sunk 20 % was spent a year before the present: compounded by (1 + i).
    expect(committed.lifecycleCostPV).toBeCloseTo(20_000 * 1.04 + 80_000, 6);
  });

  it("a build year leaving no benefit year within the horizon has no alternative", () => {
    const short = { ...HAND_ECONOMICS, horizonYears: 3 };
    const years = programme({ years: 4, budgets: [1, 1, 1, 1] });
    expect(build([t1], 2030, { economics: short, years })).toBeUndefined(); // would act from year 4 > H = 3
    expect(build([t1], 2029, { economics: short, years })!.ksiAvoided).toBeCloseTo(0.4, 10); // year 3 only
  });
});

describe("buildYears", () => {
  const years = programme({ years: 4, budgets: [1, 1, 1, 1] }); // 2027–2030
  it("is every programme year without a window", () => {
    expect(buildYears(handSite(), years)).toEqual([2027, 2028, 2029, 2030]);
  });
  it("clips to the site's earliest and latest years", () => {
    expect(buildYears(handSite({ earliestYear: 2028 }), years)).toEqual([2028, 2029, 2030]);
    expect(buildYears(handSite({ latestYear: 2028 }), years)).toEqual([2027, 2028]);
    expect(buildYears(handSite({ earliestYear: 2028, latestYear: 2029 }), years)).toEqual([2028, 2029]);
    expect(buildYears(handSite({ earliestYear: 2029, latestYear: 2029 }), years)).toEqual([2029]);
  });
  it("clips a window wider than the programme to the programme", () => {
    expect(buildYears(handSite({ earliestYear: 2020, latestYear: 2040 }), years)).toEqual([2027, 2028, 2029, 2030]);
  });
});

describe("alternativesOverBuildYears", () => {
  const baseline: SiteBaseline = { site: site.id, expectedPerYear: perYear, method: "observed", crashGrowthPerYear: 1 };
  const tp = phased(t2);
  const sets = [[t1], [tp], [t1, tp]];
  const options = (windowed = handSite(), years = programme()) => alternativesOverBuildYears(windowed, sets, baseline, HAND_ECONOMICS, years, treatmentCmf);

  it("has sets × allowed years options, less the years phasing rules out, year by year in set order", () => {
    // 3 sets × 3 years = 9; the two sets with tp cannot be built in 2027 (their design year would be 2026).
    const all = options();
    expect(all).toHaveLength(3 * 3 - 2);
    expect(all.map((a) => `${a.buildYear}:${a.treatments.join("+")}`)).toEqual([
      "2027:t1", "2028:t1", "2028:t2-phased", "2028:t1+t2-phased", "2029:t1", "2029:t2-phased", "2029:t1+t2-phased",
    ]);
  });

  it("counts only the site's window: from 2028 phasing rules nothing out", () => {
    expect(options(handSite({ earliestYear: 2028 }))).toHaveLength(3 * 2);
    expect(options(handSite({ latestYear: 2027 }))).toHaveLength(1);
  });

  it("gives a committed site exactly one option, its project in its year, even with spend before the first year", () => {
    const project = { site: site.id, treatments: [tp.id], year: 2027 };
    const committed = alternativesOverBuildYears(site, sets, baseline, HAND_ECONOMICS, programme({ committed: [project] }), treatmentCmf, { project, treatments: [tp] });
    expect(committed).toHaveLength(1);
    expect(committed[0]!.buildYear).toBe(2027);
    expect(committed[0]!.treatments).toEqual([tp.id]);
    expect(committed[0]!.spendByYear).toEqual([16_000, 0, 0]); // 80 % of 20,000; the 20 % design year is sunk
  });
});
