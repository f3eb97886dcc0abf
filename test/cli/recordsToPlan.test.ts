import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { buildProgramme } from "../../src/analysis/buildProgramme.js";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import { checkSolution } from "../../src/solver/checkSolution.js";
import { highsOptimum } from "../solver/highsOptimum.js";
import { runCaptured } from "./captureIo.js";

const scratch = mkdtempSync(join(tmpdir(), "averta-records-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

interface PlanJson {
  status: string;
  budget: number;
  totals: { cost: number; ksiAvoided: number };
  selected: { site: string; treatments: string[] }[];
}

/**
 * The path a new user takes, through the CLI in a temporary folder: crash CSV + sites GeoJSON
 * → tally → init → check → plan. The plan must be verified feasible and proven optimal, and its
 * optimum must equal HiGHS's (an independent MIP solver, mip_rel_gap 0) on the same programme.
 */
async function recordsToPlan(label: string, geojson: string, initOptions: readonly string[]): Promise<{ plan: PlanJson; scenarioFile: string }> {
  const sites = join(scratch, `${label}-sites.yaml`);
  const scenarioFile = join(scratch, `${label}.yaml`);
  const tally = await runCaptured(["tally", "--crashes", "scenarios/vellmar-crashes.csv", "--sites", geojson, "--window", "2021-2025", "--out", sites]);
  expect(tally.code, tally.stderr).toBe(0);
  const init = await runCaptured(["init", "--sites", sites, "--catalogue", resolve("catalogs/demo-catalogue.yaml"), "--budget", "9.7M", "--out", scenarioFile, ...initOptions]);
  expect(init.code, init.stderr).toBe(0);
  const check = await runCaptured(["check", scenarioFile]);
  expect(check.code, check.stderr).toBe(0);
  const plan = await runCaptured(["plan", scenarioFile, "--format", "json"]);
  expect(plan.code, plan.stderr).toBe(0);
  return { plan: JSON.parse(plan.stdout) as PlanJson, scenarioFile };
}

/** Rebuilds the programme from the written scenario and checks the CLI's list against it and against HiGHS. */
async function verify(plan: PlanJson, scenarioFile: string): Promise<number> {
  expect(plan.status).toBe("optimal");
  const prepared = preparePlan(loadScenario(scenarioFile).scenario);
  const programme = buildProgramme(prepared.sites, prepared.scenario.rules, prepared.objective, plan.budget);
  const choice = prepared.sites.map((entry) => {
    const chosen = plan.selected.find((s) => s.site === entry.site.id);
    if (chosen === undefined) return null;
    const index = entry.alternatives.findIndex((alternative) => alternative.treatments.join("+") === chosen.treatments.join("+"));
    expect(index, entry.site.id).toBeGreaterThanOrEqual(0);
    return index;
  });
  const checked = checkSolution(programme, choice);
  expect(checked.problems).toEqual([]);
  expect(checked.feasible).toBe(true);
  expect(checked.objective).toBeCloseTo(plan.totals.ksiAvoided, 9);
  const reference = await highsOptimum(programme);
  expect(reference).not.toBeNull();
  expect(Math.abs(checked.objective - reference!.objective) / Math.max(1, reference!.objective)).toBeLessThanOrEqual(1e-9);
  return programme.groups.filter((group) => group.options.length > 0).length;
}

describe("from crash records to a plan (tally → init → check → plan)", () => {
  it("on the demo network, whose site map lists the engineer's candidates", async () => {
    const { plan, scenarioFile } = await recordsToPlan("listed", "scenarios/vellmar-sites.geojson", []);
    expect(await verify(plan, scenarioFile)).toBe(51);
  });

  it("on the demo network's map without candidates, planning on init's suggestions", async () => {
    const map = JSON.parse(readFileSync("scenarios/vellmar-sites.geojson", "utf8")) as { features: { properties: Record<string, unknown> }[] };
    for (const feature of map.features) delete feature.properties.candidates;
    const bare = join(scratch, "bare.geojson");
    writeFileSync(bare, JSON.stringify(map));
    const { plan, scenarioFile } = await recordsToPlan("suggested", bare, ["--max-suggestions", "3"]);
    // Every demo site has crashes some treatment acts on, so every site has suggestions to choose from.
    expect(await verify(plan, scenarioFile)).toBe(51);
    expect(plan.selected.length).toBeGreaterThan(0);
    expect(plan.totals.cost).toBeLessThanOrEqual(plan.budget);
  });
});
