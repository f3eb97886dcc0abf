import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { loadScenario } from "../../src/io/loadScenario.js";

const folder = mkdtempSync(join(tmpdir(), "averta-method-"));
const demo = readFileSync("scenarios/demo.yaml", "utf8").replace("../catalogs/demo-catalogue.yaml", resolve("catalogs/demo-catalogue.yaml"));

/** The demo scenario with some text replaced, loaded from a scratch folder. */
function demoWith(name: string, edit: (text: string) => string) {
  const text = edit(demo);
  expect(text).not.toBe(demo);
  const file = join(folder, `${name}.yaml`);
  writeFileSync(file, text);
  return loadScenario(file);
}
const codes = (loaded: ReturnType<typeof loadScenario>) => loaded.warnings.map((warning) => warning.code);

describe("warnings about method choices", () => {
  it("the demo as shipped raises none of them", () => {
    const loaded = loadScenario("scenarios/demo.yaml");
    for (const code of ["regression-to-mean", "price-year-gap", "calibration-sample", "calibration-bias"]) expect(codes(loaded)).not.toContain(code);
  });

  it("observed baselines on candidate sites warn of regression to the mean, at the baseline key", () => {
    const loaded = demoWith("observed", (text) => text.replace("baseline: auto", "baseline: observed"));
    const warning = loaded.warnings.find((w) => w.code === "regression-to-mean")!;
    expect(warning.message).toMatch(/^51 of 51 candidate site/);
    expect(warning.path).toBe("baseline");
  });

  it("auto warns only about the sites that fall back to observed counts", () => {
    const loaded = demoWith("fallback", (text) => text.replace("    aadt: 24000\n", ""));
    expect(loaded.warnings.find((w) => w.code === "regression-to-mean")!.message).toMatch(/^1 of 51 candidate site.*I-01/);
  });

  it("crash costs priced more than 2 years from the programme, without escalation, are flagged", () => {
    const loaded = demoWith("unescalated", (text) => text.replace(/^    escalation: .*$/m, ""));
    const warning = loaded.warnings.find((w) => w.code === "price-year-gap")!;
    expect(warning.message).toMatch(/2016 prices, 10 years/);
    expect(loaded.scenario.economics.crashCosts.escalationFactor).toBe(1);
    // Two years apart is within tolerance.
    const near = demoWith("near", (text) => text.replace(/^    escalation: .*$/m, "").replace("  priceYear: 2026", "  priceYear: 2018"));
    expect(codes(near)).not.toContain("price-year-gap");
  });

  it("an estimated calibration factor from few sites warns about the sample", () => {
    const loaded = demoWith("calibrated", (text) => text.replace("baseline: auto\n", "baseline: auto\ncalibration: { rural-two-lane-segment: estimate, urban-4sg-intersection: 1.1 }\n"));
    const calibrations = loaded.scenario.calibrations!;
    expect(calibrations.find((c) => c.performanceFunction === "urban-4sg-intersection")).toMatchObject({ method: "given", factor: 1.1 });
    const estimated = calibrations.find((c) => c.performanceFunction === "rural-two-lane-segment")!;
    expect(estimated.method).toBe("estimated");
    expect(estimated.sites).toBe(6);
    expect(estimated.factor).toBeCloseTo(estimated.observedCrashes! / estimated.predictedCrashes!, 12);
    expect(codes(loaded)).toContain("calibration-sample");
    const spf = loaded.scenario.catalogue.performanceFunctions.find((f) => f.id === "rural-two-lane-segment")!;
    expect(spf.calibrationFactor).toBeCloseTo(estimated.factor, 12);
  });

  it("the demo's crash costs are escalated to the programme year and K and A valued at one weighted cost", () => {
    const { economics, sites } = loadScenario("scenarios/demo.yaml").scenario;
    const costs = economics.crashCosts;
    expect(costs.escalationFactor).toBeCloseTo(Math.pow(1.03, 10), 12);
    let fatal = 0;
    let serious = 0;
    for (const site of sites) for (const cells of Object.values(site.crashes)) (fatal += cells.K), (serious += cells.A);
    const share = fatal / (fatal + serious);
    expect(costs.perCrash.K).toBeCloseTo((share * 11_295_400 + (1 - share) * 655_000) * Math.pow(1.03, 10), 4);
    expect(costs.perCrash.A).toBe(costs.perCrash.K);
  });
});
