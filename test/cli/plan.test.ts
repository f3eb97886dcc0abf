import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { loadScenario } from "../../src/io/loadScenario.js";
import { runCaptured } from "./captureIo.js";

const DEMO = "scenarios/demo.yaml";

interface PlanJson {
  scenario: string;
  budget: number;
  objective: string;
  status: string;
  totals: { cost: number; ksiAvoided: number; benefitPV: number; lifecycleCostPV: number; bcRatio: number; npv: number };
  selected: { site: string; treatments: string[]; cost: number; ksiAvoided: number; benefitPV: number; bcRatio: number }[];
  bound: number;
}

async function planJson(...extra: string[]): Promise<PlanJson> {
  const { code, stdout, stderr } = await runCaptured(["plan", DEMO, "--format", "json", ...extra]);
  expect(stderr).not.toMatch(/error/);
  expect(code).toBe(0);
  return JSON.parse(stdout) as PlanJson;
}

describe("averta plan on the demo", () => {
  it("prints an optimal list within budget that honours the demo's rules (JSON contract)", async () => {
    const plan = await planJson();
    const { scenario } = loadScenario(DEMO);
    expect(plan.status).toBe("optimal");
    expect(plan.budget).toBe(scenario.budget);
    expect(plan.objective).toBe("ksi");
    expect(plan.totals.cost).toBeLessThanOrEqual(plan.budget);
    expect(plan.totals.cost).toBeCloseTo(plan.selected.reduce((sum, s) => sum + s.cost, 0), 6);
    expect(plan.totals.ksiAvoided).toBeCloseTo(plan.selected.reduce((sum, s) => sum + s.ksiAvoided, 0), 9);
    expect(plan.bound).toBeGreaterThanOrEqual(plan.totals.ksiAvoided - 1e-9);
    // One alternative per site; every treatment is a candidate there; exclusivity respected.
    const sites = new Map(scenario.sites.map((site) => [site.id, site]));
    const treatments = new Map(scenario.catalogue.treatments.map((t) => [t.id, t]));
    expect(new Set(plan.selected.map((s) => s.site)).size).toBe(plan.selected.length);
    for (const chosen of plan.selected) {
      const site = sites.get(chosen.site)!;
      for (const id of chosen.treatments) expect(site.candidates).toContain(id);
      const groups = chosen.treatments.map((id) => treatments.get(id)!.exclusiveGroup).filter(Boolean);
      expect(new Set(groups).size).toBe(groups.length);
      expect(chosen.treatments.length).toBeLessThanOrEqual(scenario.maxTreatmentsPerSite);
    }
    for (const rule of scenario.rules) {
      if (rule.kind !== "must-fund" && rule.kind !== "never-fund") continue;
      const chosen = plan.selected.find((s) => s.site === rule.site);
      if (rule.kind === "must-fund") for (const id of rule.treatments) expect(chosen?.treatments).toContain(id);
      if (rule.kind === "never-fund" && rule.treatments.length === 0) expect(chosen).toBeUndefined();
    }
  });

  it("with --budget, spends within the new budget and avoids no more than with a larger one", async () => {
    const small = await planJson("--budget", "3M");
    const large = await planJson("--budget", "12.5M");
    expect(small.budget).toBe(3_000_000);
    expect(small.totals.cost).toBeLessThanOrEqual(3_000_000);
    expect(large.totals.ksiAvoided).toBeGreaterThanOrEqual(small.totals.ksiAvoided);
  });

  it("the table names the scenario, the status, the totals and the cautions", async () => {
    const { code, stdout } = await runCaptured(["plan", DEMO]);
    expect(code).toBe(0);
    expect(stdout).toContain("Status: optimal");
    expect(stdout).toContain("Total:");
    expect(stdout).toContain("engineering judgement");
  });

  it("CSV has a header with units and one row per funded project", async () => {
    const json = await planJson();
    const { code, stdout } = await runCaptured(["plan", DEMO, "--format", "csv"]);
    expect(code).toBe(0);
    const lines = stdout.trim().split("\r\n");
    // Two preamble lines (what and units), then the column header, then the projects.
    expect(lines[0]).toMatch(/^"# averta \| plan of scenario Vellmar/);
    expect(lines[0]).toContain("status optimal");
    expect(lines[1]).toMatch(/^"?# units \| money in USD/);
    expect(lines[2]).toMatch(/^site_id,.*capital_cost_USD/);
    expect(lines).toHaveLength(json.selected.length + 3);
  });

  it("--out writes the file, and never replaces an existing file without --force", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-plan-"));
    const out = join(folder, "plan.json");
    expect((await runCaptured(["plan", DEMO, "--format", "json", "--out", out])).code).toBe(0);
    expect(JSON.parse(readFileSync(out, "utf8")).status).toBe("optimal");
    writeFileSync(out, "keep me");
    const again = await runCaptured(["plan", DEMO, "--format", "json", "--out", out]);
    expect(again.code).toBe(2);
    expect(again.stderr).toMatch(/already exists/);
    expect(readFileSync(out, "utf8")).toBe("keep me");
    expect((await runCaptured(["plan", DEMO, "--format", "json", "--out", out, "--force"])).code).toBe(0);
    expect(readFileSync(out, "utf8")).not.toBe("keep me");
  });

  it("a bad --budget is exit 2 with the option named, and nothing on stdout", async () => {
    const { code, stdout, stderr } = await runCaptured(["plan", DEMO, "--budget", "lots"]);
    expect(code).toBe(2);
    expect(stdout).toBe("");
    expect(stderr).toMatch(/--budget.*'lots' is not an amount/);
    expect(stderr).not.toMatch(/\n\s+at /);
  });

  it("must-fund items that alone exceed the budget are reported as infeasible with the shortfall", async () => {
    const { code, stdout } = await runCaptured(["plan", DEMO, "--budget", "10k", "--format", "json"]);
    // No feasible list: exit 3 (README, "Exit codes, errors and limits").
    expect(code).toBe(3);
    const plan = JSON.parse(stdout) as PlanJson & { diagnosis?: string; justification: unknown };
    expect(plan.status).toBe("infeasible");
    expect(plan.diagnosis).toMatch(/I-03/);
    // With no list there is nothing to justify, and the table says so instead of printing empty sections.
    expect(plan.justification).toBeNull();
    const table = await runCaptured(["plan", DEMO, "--budget", "10k"]);
    expect(table.stdout).toMatch(/No list at this budget \(status infeasible/);
    expect(table.stdout).not.toMatch(/Why these projects|gap NaN/);
    expect(existsSync("plan.json")).toBe(false);
  });
});

describe("averta plan's reasons for the sites left out", () => {
  it("never asks for a price cut to zero or below: such a site needs more KSI avoided instead", async () => {
    const { stdout } = await runCaptured(["plan", DEMO, "--format", "json"]);
    const notFunded = (JSON.parse(stdout) as { justification: { notFunded: { threshold: { costThreshold: number } | null; explanation: string }[] } }).justification.notFunded;
    const priceless = notFunded.filter((site) => site.threshold !== null && site.threshold.costThreshold <= 0);
    expect(priceless.length).toBeGreaterThan(0); // C-07 on the demo
    for (const site of priceless) {
      expect(site.explanation).toMatch(/no price cut alone is enough/);
      expect(site.explanation).not.toMatch(/cost at most about/);
    }
  });
});

describe("averta check on the demo", () => {
  it("validates and summarises sites, alternatives and crashes", async () => {
    const { code, stdout, stderr } = await runCaptured(["check", DEMO]);
    expect(code).toBe(0);
    expect(stdout).toMatch(/valid/);
    expect(stdout).toMatch(/sites\s+51/);
    expect(stdout).toMatch(/alternatives\s+\d+/);
    expect(stderr).toMatch(/warning: .*no standard error/);
  });
});
