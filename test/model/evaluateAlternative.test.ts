import { describe, expect, it } from "vitest";
import { evaluateAlternative } from "../../src/model/evaluateAlternative.js";
import { observedCrashesPerYear } from "../../src/model/observedCrashesPerYear.js";
import { ALL_SEVERITIES, ALL_TYPES, HAND_ECONOMICS, handSite, treatment } from "./fixtures.js";

// Present-worth factors at 4% from a standard interest table (from memory, four decimals):
// (P/A, 4%, 5) = 4.4518, (P/A, 4%, 10) = 8.1109.
const PA_4_5 = 4.4518;
const PA_4_10 = 8.1109;
const relative = (actual: number, expected: number) => Math.abs(actual - expected) / Math.abs(expected);

const site = handSite();
const perYear = observedCrashesPerYear(site.crashes, 5); // ped K 0.2, A 0.8, B 1.0; angle O 2.0
const t1 = treatment({
  id: "t1",
  cost: { basis: "per-site", amount: 100_000 },
  upkeepPerYear: 2_000,
  serviceLifeYears: 10,
  effects: [{ crashTypes: ["pedestrian"], severities: ALL_SEVERITIES, cmf: 0.6, source: "test" }],
});
const t2 = treatment({
  id: "t2",
  cost: { basis: "per-site", amount: 20_000 },
  serviceLifeYears: 5,
  effects: [{ crashTypes: ALL_TYPES, severities: ALL_SEVERITIES, cmf: 0.8, source: "test" }],
});

describe("evaluateAlternative on a hand-worked case", () => {
  it("one treatment: KSI, benefit PV, lifecycle cost, B/C, NPV and cost per KSI", () => {
    // Avoided a year: ped K 0.2×0.4 = 0.08, A 0.8×0.4 = 0.32, B 1.0×0.4 = 0.4 → KSI 0.4 a year for 10 years = 4.0.
    // Benefit a year: 0.08×10M + 0.32×500k + 0.4×100k = 1,000,000; PV = 1,000,000 × 8.1109.
    // Lifecycle cost: 100,000 + 2,000 × 8.1109 = 116,221.8.
    const result = evaluateAlternative(site, [t1], perYear, HAND_ECONOMICS);
    const benefit = 1_000_000 * PA_4_10;
    const lifecycle = 100_000 + 2_000 * PA_4_10;
    expect(result.cost).toBe(100_000);
    expect(result.ksiAvoided).toBeCloseTo(4.0, 10);
    expect(relative(result.benefitPV, benefit)).toBeLessThan(1e-4);
    expect(relative(result.lifecycleCostPV, lifecycle)).toBeLessThan(1e-4);
    expect(relative(result.bcRatio, benefit / lifecycle)).toBeLessThan(2e-4);
    expect(relative(result.npv, benefit - lifecycle)).toBeLessThan(1e-4);
    expect(relative(result.costPerKsi, lifecycle / 4)).toBeLessThan(1e-4);
    expect(result.crashesAvoidedPerYear.K).toBeCloseTo(0.08, 12);
    expect(result.effectiveYears).toBe(10);
  });

  it("two treatments with different lives: combined CMFs while both act, then only the longer-lived one", () => {
    // Years 1-5 both act: pedestrian CMF 0.6 × 0.8 = 0.48, angle 0.8.
    //   avoided: ped K 0.104, A 0.416, B 0.52; angle O 0.4 → KSI 0.52/yr; benefit 1,040,000 + 208,000 + 52,000 + 4,000 = 1,304,000/yr.
    // Years 6-10 only t1: KSI 0.4/yr; benefit 1,000,000/yr.
    const result = evaluateAlternative(site, [t1, t2], perYear, HAND_ECONOMICS);
    expect(result.ksiAvoided).toBeCloseTo(0.52 * 5 + 0.4 * 5, 10);
    const benefit = 1_304_000 * PA_4_5 + 1_000_000 * (PA_4_10 - PA_4_5);
    expect(relative(result.benefitPV, benefit)).toBeLessThan(1e-4);
    expect(relative(result.lifecycleCostPV, 120_000 + 2_000 * PA_4_10)).toBeLessThan(1e-4);
    expect(result.cost).toBe(120_000);
  });

  it("caps the service life at the analysis horizon", () => {
    const short = { ...HAND_ECONOMICS, horizonYears: 4 };
    const result = evaluateAlternative(site, [t1], perYear, short);
    expect(result.ksiAvoided).toBeCloseTo(0.4 * 4, 10);
    expect(result.effectiveYears).toBe(4);
  });

  it("a per-km treatment is priced by the site's length, and a site override wins", () => {
    const perKm = treatment({ id: "t3", cost: { basis: "per-km", amount: 50_000 }, effects: [] });
    const segment = handSite({ kind: "segment", lengthKm: 2.5 });
    expect(evaluateAlternative(segment, [perKm], perYear, HAND_ECONOMICS).cost).toBe(125_000);
    const overridden = handSite({ kind: "segment", lengthKm: 2.5, costOverrides: { t3: 90_000 } });
    expect(evaluateAlternative(overridden, [perKm], perYear, HAND_ECONOMICS).cost).toBe(90_000);
  });

  it("a CMF above 1 gives negative benefits in the cells it worsens (common practice: report, don't hide)", () => {
    const worse = treatment({ id: "w", effects: [{ crashTypes: ["angle"], severities: ["O"], cmf: 1.5, source: "test" }] });
    const result = evaluateAlternative(site, [worse], perYear, HAND_ECONOMICS);
    expect(result.crashesAvoidedPerYear.O).toBeCloseTo(-1.0, 12);
    expect(result.benefitPV).toBeLessThan(0);
  });
});

describe("evaluateAlternative with the method options", () => {
  it("traffic growth: each year's avoided crashes grow by the crash growth factor (year-by-year sum)", () => {
    const growth = 1.02;
    const result = evaluateAlternative(site, [t1], perYear, HAND_ECONOMICS, undefined, growth);
    let ksi = 0;
    let benefit = 0;
    for (let year = 1; year <= 10; year++) {
      ksi += 0.4 * Math.pow(growth, year);
      benefit += (1_000_000 * Math.pow(growth, year)) / Math.pow(1.04, year);
    }
    expect(result.ksiAvoided).toBeCloseTo(ksi, 10);
    expect(relative(result.benefitPV, benefit)).toBeLessThan(1e-10);
    expect(result.crashesAvoidedPerYear.K).toBeCloseTo(0.08 * growth, 12);
  });

  it("renewal: a 10-year treatment renewed once acts all 20 years, and pays a second capital cost at year 10", () => {
    // (P/A, 4%, 20) = 13.5903, (P/F, 4%, 10) = 0.6756 (4% interest table, from memory).
    const result = evaluateAlternative(site, [t1], perYear, { ...HAND_ECONOMICS, renewal: "renew" });
    expect(result.ksiAvoided).toBeCloseTo(0.4 * 20, 10);
    expect(result.effectiveYears).toBe(20);
    expect(relative(result.benefitPV, 1_000_000 * 13.5903)).toBeLessThan(1e-4);
    expect(relative(result.lifecycleCostPV, 100_000 * (1 + 0.6756) + 2_000 * 13.5903)).toBeLessThan(1e-4);
  });

  it("combination rule: dominant effect counts only the stronger CMF in shared cells, and the shared cells are counted", () => {
    const multiplied = evaluateAlternative(site, [t1, t2], perYear, HAND_ECONOMICS);
    const dominant = evaluateAlternative(site, [t1, t2], perYear, { ...HAND_ECONOMICS, cmfCombination: { rule: "dominant-effect" } });
    // Years 1-5: pedestrian cells take 0.6 (not 0.48): KSI 0.4/yr; years 6-10 as before.
    expect(dominant.ksiAvoided).toBeCloseTo(0.4 * 10, 10);
    expect(multiplied.ksiAvoided).toBeGreaterThan(dominant.ksiAvoided);
    // Pedestrian K, A and B carry crashes and both treatments act there; angle O only t2.
    expect(multiplied.sharedCells).toBe(3);
    expect(evaluateAlternative(site, [t1], perYear, HAND_ECONOMICS).sharedCells).toBe(0);
  });
});
