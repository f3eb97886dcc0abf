import { describe, expect, it } from "vitest";
import { InputError } from "../../src/io/InputError.js";
import { loadScenarioSource } from "../../src/io/loadScenario.js";
import { parseYamlText } from "../../src/io/readYamlFile.js";

// The per-site limit is covered by the bad-input corpus (too-many-alternatives.yaml); this is the total.
describe("the limit on alternatives over all sites", () => {
  it("refuses 1,250 sites of 40 combinable candidates, up to 2 each (820 a site, 1,025,000 in all), at the sites list", () => {
    const candidates = Array.from({ length: 40 }, (_, i) => `t${String(i + 1).padStart(2, "0")}`).join(", ");
    const sites = Array.from({ length: 1250 }, (_, s) =>
      [`  - id: S-${s}`, `    name: Site ${s}`, "    kind: intersection", "    district: North", "    crashes: { angle: { A: 1 } }", `    candidates: [${candidates}]`].join("\n"),
    );
    const text = [
      "name: Many alternatives",
      "catalogues: [catalogs/forty-treatments.yaml]",
      "currency: USD",
      "budget: 1M",
      "crashWindow: { firstYear: 2021, lastYear: 2025 }",
      "economics:",
      "  discountRate: 0.04",
      "  horizonYears: 20",
      "  crashCosts: { K: 11295400, A: 655000, B: 198500, C: 125600, O: 11900, source: test values }",
      "maxTreatmentsPerSite: 2",
      "sites:",
      ...sites,
      "",
    ].join("\n");
    const file = "test/fixtures/bad/many-sites.yaml";
    let problem: InputError["problems"][number] | undefined;
    try {
      loadScenarioSource(parseYamlText(text, file), file);
    } catch (error) {
      if (!(error instanceof InputError)) throw error;
      problem = error.problems[0];
    }
    expect(problem).toMatchObject({ code: "too-many-alternatives", file, line: 11, path: "sites" });
    expect(problem!.message).toContain("1,025,000 alternatives in all, more than the limit of 1,000,000");
    expect(problem!.hint).toMatch(/maxTreatmentsPerSite/);
  });
});
