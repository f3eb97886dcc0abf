import { describe, expect, it } from "vitest";
import { loadScenario } from "../../src/io/loadScenario.js";
import { completeCrashMatrix } from "../../src/model/crashMatrix.js";
import { screenSites } from "../../src/model/screenSites.js";
import type { Scenario, Site } from "../../src/model/types.js";

const { scenario } = loadScenario("scenarios/demo.yaml");

describe("screenSites", () => {
  it("orders sites by excess expected KSI, each excess being EB expected minus predicted", () => {
    const { sites } = screenSites(scenario, 5);
    expect(sites).toHaveLength(scenario.sites.length);
    for (let i = 1; i < sites.length; i++) expect(sites[i - 1]!.excessKsiPerYear!).toBeGreaterThanOrEqual(sites[i]!.excessKsiPerYear!);
    for (const entry of sites) expect(entry.excessKsiPerYear!).toBeCloseTo(entry.expectedKsiPerYear! - entry.predictedKsiPerYear!, 12);
    expect(new Set(sites.map((e) => e.observedRank)).size).toBe(sites.length);
  });
  it("puts EB between predicted and observed KSI (shrinkage), for every site", () => {
    for (const e of screenSites(scenario, 5).sites) {
      expect(e.expectedKsiPerYear!).toBeLessThanOrEqual(Math.max(e.observedKsiPerYear, e.predictedKsiPerYear!) + 1e-12);
      expect(e.expectedKsiPerYear!).toBeGreaterThanOrEqual(Math.min(e.observedKsiPerYear, e.predictedKsiPerYear!) - 1e-12);
    }
  });
  it("ranks a site without AADT last, by observed KSI, and never proposes it", () => {
    const bad: Site = { ...scenario.sites[0]!, id: "Z-00", crashes: completeCrashMatrix({ pedestrian: { K: 40 } }) };
    delete (bad as { aadt?: number }).aadt;
    const edited: Scenario = { ...scenario, sites: [bad, ...scenario.sites] };
    const { sites, proposed } = screenSites(edited, 100);
    expect(sites.at(-1)!.site.id).toBe("Z-00");
    expect(sites.at(-1)!.observedRank).toBe(1);
    expect(sites.at(-1)!.note).toMatch(/aadt/);
    expect(proposed).not.toContain("Z-00");
  });
  it("proposes the top N with positive excess", () => {
    const { sites, proposed } = screenSites(scenario, 3);
    expect(proposed).toEqual(sites.slice(0, 3).map((e) => e.site.id));
  });
});
