import { beforeAll, describe, expect, it } from "vitest";
import { planProgramme, type PlanResult } from "../../src/analysis/planProgramme.js";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import type { Scenario } from "../../src/model/types.js";
import { PLAN_TABLE_ROWS, planTable } from "../../src/report/planTable.js";

let result: PlanResult;
beforeAll(async () => {
  // The demo's sites three times over (new ids), with money for most of them: well over 50 projects.
  const { scenario } = loadScenario("scenarios/demo.yaml");
  const sites = [0, 1, 2].flatMap((copy) => scenario.sites.map((site) => ({ ...site, id: `${site.id}-${copy}` })));
  const big: Scenario = { ...scenario, sites, budget: 3 * scenario.budget, rules: [] };
  result = await planProgramme(preparePlan(big));
});

const listedSites = (text: string) => [...text.matchAll(/^│ ([A-Z]-\d+-\d)/gm)].map((match) => match[1]!);

describe("plan table length", () => {
  it("lists the 50 projects with the most K+A crashes avoided, largest first, and says so", () => {
    expect(result.funded.length).toBeGreaterThan(PLAN_TABLE_ROWS);
    const text = planTable(result);
    const listed = listedSites(text);
    expect(listed).toHaveLength(PLAN_TABLE_ROWS);
    const bySite = new Map(result.funded.map((project) => [project.entry.site.id, project.alternative.ksiAvoided]));
    const values = listed.map((site) => bySite.get(site)!);
    expect(values).toEqual([...values].sort((a, b) => b - a));
    const smallestListed = values.at(-1)!;
    const left = result.funded.filter((project) => !listed.includes(project.entry.site.id));
    expect(left.every((project) => project.alternative.ksiAvoided <= smallestListed)).toBe(true);
    expect(text).toContain(`Showing the ${PLAN_TABLE_ROWS} of ${result.funded.length} funded projects`);
    // The total still covers the whole list.
    expect(text).toContain(`Total: ${result.funded.length} project(s)`);
  });

  it("lists every project with all", () => {
    const text = planTable(result, [], { all: true });
    expect(listedSites(text)).toEqual(result.funded.map((project) => project.entry.site.id));
    expect(text).not.toContain("Showing the");
  });
});
