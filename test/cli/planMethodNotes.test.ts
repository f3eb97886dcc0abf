import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { planMethodNotes } from "../../src/analysis/planMethodNotes.js";
import { planProgramme } from "../../src/analysis/planProgramme.js";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import { totalsBySeverity } from "../../src/model/crashMatrix.js";
import { runCaptured } from "./captureIo.js";

const folder = mkdtempSync(join(tmpdir(), "averta-notes-"));
function demoWith(name: string, edit: (text: string) => string): string {
  const text = edit(readFileSync("scenarios/demo.yaml", "utf8").replace("../catalogs/demo-catalogue.yaml", resolve("catalogs/demo-catalogue.yaml")));
  const file = join(folder, `${name}.yaml`);
  writeFileSync(file, text);
  return file;
}

describe("plan states its method choices", () => {
  it("JSON: each project's baseline, the baseline counts, the single-fatal share and shared crash cells", async () => {
    const { code, stdout } = await runCaptured(["plan", "scenarios/demo.yaml", "--format", "json"]);
    expect(code).toBe(0);
    const plan = JSON.parse(stdout);
    expect(plan.method.baselineCounts).toEqual({ empiricalBayes: 51, observed: 0 });
    expect(plan.selected.every((project: { baseline: string }) => project.baseline === "empirical-bayes")).toBe(true);
    expect(plan.assumptions.ksiCosting).toMatch(/^combined/);
    expect(plan.assumptions.crashCostEscalation).toMatch(/2016 to 2026/);
    const shared = plan.selected.filter((project: { sharedCrashCells: number }) => project.sharedCrashCells > 0).map((p: { site: string }) => p.site);
    expect(plan.method.sharedCellProjects).toEqual(shared);
    expect(plan.method.singleFatalCrashShare.share).toBeGreaterThanOrEqual(0);
  });

  it("the table shows a Baseline column and the notes", async () => {
    const { stdout } = await runCaptured(["plan", "scenarios/demo.yaml"]);
    expect(stdout).toMatch(/│ Baseline │/);
    expect(stdout).toMatch(/Baselines: Empirical Bayes at 51 site\(s\), observed counts at 0\./);
    expect(stdout).toMatch(/Valuing K and A crashes: combined/);
  });

  it("valuing K and A by severity puts far more of the benefit on single fatal crashes than one combined K+A cost", async () => {
    const combined = planMethodNotes(await planProgramme(preparePlan(loadScenario("scenarios/demo.yaml").scenario)));
    const bySeverityFile = demoWith("by-severity", (text) => text.replace("ksiCosting: { method: combined }", "ksiCosting: { method: by-severity }"));
    const bySeverity = planMethodNotes(await planProgramme(preparePlan(loadScenario(bySeverityFile).scenario)));
    expect(bySeverity.singleFatal.share).toBeGreaterThan(2 * combined.singleFatal.share);
    expect(bySeverity.singleFatal.high).toBe(true);
    expect(bySeverity.notes.join(" ")).toMatch(/chance deaths are steering the list/);
  });

  it("the single-fatal share is recomputed by hand: K-cell benefit at sites with exactly one recorded fatal crash", async () => {
    const result = await planProgramme(preparePlan(loadScenario("scenarios/demo.yaml").scenario));
    const costs = result.prepared.scenario.economics.crashCosts.perCrash;
    let share = 0;
    for (const { entry, alternative } of result.funded) {
      if (totalsBySeverity(entry.site.crashes).K !== 1) continue;
      const a = alternative.crashesAvoidedPerYear;
      const yearOne = a.K * costs.K + a.A * costs.A + a.B * costs.B + a.C * costs.C + a.O * costs.O;
      share += (alternative.benefitPV * (a.K * costs.K)) / yearOne / result.totals.benefitPV;
    }
    expect(planMethodNotes(result).singleFatal.share).toBeCloseTo(share, 12);
  });

  it("observed baselines are counted and named as regression-to-the-mean risks", async () => {
    const file = demoWith("observed", (text) => text.replace("baseline: auto", "baseline: observed"));
    const notes = planMethodNotes(await planProgramme(preparePlan(loadScenario(file).scenario)));
    expect(notes.baselineCounts).toEqual({ empiricalBayes: 0, observed: 51 });
    expect(notes.observedBaselineProjects.length).toBeGreaterThan(0);
    expect(notes.notes.join(" ")).toMatch(/regression to the mean/);
  });
});
