import { describe, expect, it } from "vitest";
import { loadScenario } from "../../src/io/loadScenario.js";
import { sumCrashMatrix } from "../../src/model/crashMatrix.js";
import { siteBaselines } from "../../src/model/siteBaselines.js";

describe("siteBaselines with an Empirical Bayes baseline", () => {
  const { scenario, warnings } = loadScenario("scenarios/demo-eb.yaml");
  it("uses EB at every demo site, each between its prediction and its record", () => {
    const baselines = siteBaselines(scenario);
    expect(baselines.every((b) => b.method === "empirical-bayes")).toBe(true);
    expect(warnings.filter((w) => w.code === "eb-fallback")).toEqual([]);
    // EB lies between observed and predicted; it differs from observed at every site (shrinkage).
    const observed = siteBaselines({ ...scenario, baseline: "observed" });
    let differ = 0;
    baselines.forEach((b, i) => {
      if (Math.abs(sumCrashMatrix(b.expectedPerYear) - sumCrashMatrix(observed[i]!.expectedPerYear)) > 1e-9) differ++;
    });
    expect(differ).toBe(scenario.sites.length);
  });
  it("falls back to observed counts, with a note and a warning, where a site lacks AADT", () => {
    const first = scenario.sites[0]!;
    const { aadt: _dropped, ...withoutAadt } = first;
    const edited = { ...scenario, sites: [withoutAadt, ...scenario.sites.slice(1)] };
    const [baseline] = siteBaselines(edited);
    expect(baseline!.method).toBe("observed");
    expect(baseline!.note).toMatch(/aadt/);
    expect(sumCrashMatrix(baseline!.expectedPerYear)).toBeCloseTo(sumCrashMatrix(first.crashes) / 5, 12);
  });
});
