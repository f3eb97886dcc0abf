import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { loadScenario } from "../../src/io/loadScenario.js";
import { sumCrashMatrix } from "../../src/model/crashMatrix.js";
import { siteBaselines } from "../../src/model/siteBaselines.js";
import { KSI_SEVERITIES } from "../../src/model/types.js";

describe("baseline: auto", () => {
  const auto = loadScenario("scenarios/demo.yaml").scenario;
  const eb = loadScenario("scenarios/demo-eb.yaml").scenario;

  it("gives every demo site with an SPF and AADT exactly its empirical-bayes K+A estimate", () => {
    expect(auto.baseline).toBe("auto");
    const fromAuto = siteBaselines(auto);
    const fromEb = new Map(siteBaselines(eb).map((baseline) => [baseline.site, baseline]));
    let compared = 0;
    for (const baseline of fromAuto) {
      if (baseline.method !== "empirical-bayes") continue;
      const reference = fromEb.get(baseline.site)!;
      expect(reference.method).toBe("empirical-bayes");
      expect(sumCrashMatrix(baseline.expectedPerYear, KSI_SEVERITIES)).toBeCloseTo(sumCrashMatrix(reference.expectedPerYear, KSI_SEVERITIES), 12);
      compared++;
    }
    expect(compared).toBe(auto.sites.length);
  });

  it("falls back to observed counts, without the empirical-bayes warning, where a site lacks what EB needs", () => {
    const { aadt: _dropped, ...withoutAadt } = auto.sites[0]!;
    const [first] = siteBaselines({ ...auto, sites: [withoutAadt, ...auto.sites.slice(1)] });
    expect(first!.method).toBe("observed");
    expect(first!.note).toMatch(/aadt/);
  });

  it("is the default when a scenario names no baseline", () => {
    const text = readFileSync("scenarios/demo.yaml", "utf8")
      .replace(/^baseline: auto$/m, "")
      .replace("../catalogs/demo-catalogue.yaml", resolve("catalogs/demo-catalogue.yaml"));
    expect(text).not.toMatch(/^baseline:/m);
    const file = join(mkdtempSync(join(tmpdir(), "averta-auto-")), "no-baseline.yaml");
    writeFileSync(file, text);
    expect(loadScenario(file).scenario.baseline).toBe("auto");
  });
});
