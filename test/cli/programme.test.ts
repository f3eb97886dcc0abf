import { existsSync, mkdtempSync, readdirSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { loadScenario } from "../../src/io/loadScenario.js";
import type { Scenario } from "../../src/model/types.js";
import { parseCsv } from "../report/parseCsv.js";
import { runCaptured } from "./captureIo.js";

const PROGRAMME = "scenarios/demo-programme.yaml";
const NEXT_YEAR = "scenarios/demo-programme-2028.yaml";
const scratch = mkdtempSync(join(tmpdir(), "averta-programme-cli-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

interface YearJson {
  year: number;
  budget: number;
  carriedIn: number;
  spend: number;
  unspent: number;
  projects: number;
  ksiAvoided: number;
  cumulativeKsiAvoided: number;
}
interface ProjectJson {
  site: string;
  treatments: string[];
  cost: number;
  ksiAvoided: number;
  buildYear: number;
  spendByYear: number[];
  timing: { notEarlier: string };
}
interface PlanJson {
  status: string;
  budget: number;
  totals: { cost: number; ksiAvoided: number; projects: number };
  programme: { firstYear: number; years: number; carryOver: string; costEscalationRate: number; committed: { site: string; treatments: string[]; year: number }[] };
  years: YearJson[];
  selected: ProjectJson[];
}
interface CompareSide {
  site: string;
  treatments: string[];
  buildYear: number;
}
interface CompareJson {
  entering: { site: string }[];
  leaving: { site: string }[];
  changedTreatment: { site: string }[];
  movedYear: { site: string; before: CompareSide; after: CompareSide }[];
}

const close = (a: number, b: number) => Math.abs(a - b) <= 1e-6 * Math.max(1, Math.abs(a), Math.abs(b));
const sum = (values: readonly number[]) => values.reduce((total, value) => total + value, 0);
const lineOf = (text: string, needle: string) => text.split("\n").findIndex((line) => line.startsWith(needle)) + 1;

// The demo programme takes seconds to solve: one JSON and one CSV run serve every assertion.
let scenario: Scenario;
let plan: PlanJson;
let csv: string;
beforeAll(async () => {
  scenario = loadScenario(PROGRAMME).scenario;
  const json = await runCaptured(["plan", PROGRAMME, "--format", "json"]);
  expect(json.code, json.stderr).toBe(0);
  plan = JSON.parse(json.stdout) as PlanJson;
  const table = await runCaptured(["plan", PROGRAMME, "--format", "csv"]);
  expect(table.code, table.stderr).toBe(0);
  csv = table.stdout;
});

describe("averta plan on the demo programme", () => {
  it("reports the programme's settings, one entry per year with its budget, and an optimal status", () => {
    const programme = scenario.programme!;
    expect(plan.status).toBe("optimal");
    expect(plan.programme).toMatchObject({ firstYear: programme.firstYear, years: programme.years, carryOver: programme.carryOver, costEscalationRate: programme.costEscalationRate });
    expect(plan.budget).toBe(sum(programme.budgets));
    expect(plan.years.map((year) => year.year)).toEqual(programme.budgets.map((_, y) => programme.firstYear + y));
    expect(plan.years.map((year) => year.budget)).toEqual(programme.budgets);
    for (const year of plan.years) for (const field of ["carriedIn", "spend", "unspent", "projects", "ksiAvoided", "cumulativeKsiAvoided"] as const) expect(typeof year[field]).toBe("number");
  });

  it("every year's spend is its projects' spend and stays within the carry-over rule (unspent: the budgets up to that year)", () => {
    const programme = scenario.programme!;
    expect(programme.carryOver).toBe("unspent");
    let budgetSoFar = 0;
    let spendSoFar = 0;
    let carried = 0;
    plan.years.forEach((year, y) => {
      // Recomputed from the projects, not read from the year rows.
      expect(close(year.spend, sum(plan.selected.map((project) => project.spendByYear[y]!)))).toBe(true);
      expect(year.projects).toBe(plan.selected.filter((project) => project.buildYear === year.year).length);
      budgetSoFar += year.budget;
      spendSoFar += year.spend;
      expect(spendSoFar).toBeLessThanOrEqual(budgetSoFar * (1 + 1e-9));
      expect(close(year.carriedIn, carried)).toBe(true);
      expect(close(year.unspent, year.carriedIn + year.budget - year.spend)).toBe(true);
      expect(year.unspent).toBeGreaterThanOrEqual(-1e-6);
      carried = year.unspent;
    });
    expect(close(sum(plan.years.map((year) => year.spend)), plan.totals.cost)).toBe(true);
    expect(close(plan.years.at(-1)!.cumulativeKsiAvoided, plan.totals.ksiAvoided)).toBe(true);
  });

  it("every selected project has a build year in the programme, and the committed projects sit in their years", () => {
    const programme = scenario.programme!;
    const lastYear = programme.firstYear + programme.years - 1;
    const sites = new Map(scenario.sites.map((site) => [site.id, site]));
    for (const project of plan.selected) {
      const site = sites.get(project.site)!;
      expect(project.buildYear).toBeGreaterThanOrEqual(Math.max(programme.firstYear, site.earliestYear ?? 0));
      expect(project.buildYear).toBeLessThanOrEqual(Math.min(lastYear, site.latestYear ?? lastYear));
      expect(project.spendByYear).toHaveLength(programme.years);
      expect(close(sum(project.spendByYear), project.cost)).toBe(true);
    }
    expect(programme.committed.length).toBeGreaterThan(0);
    for (const committed of programme.committed) {
      const project = plan.selected.find((p) => p.site === committed.site)!;
      expect(project, committed.site).toBeDefined();
      expect(project.buildYear).toBe(committed.year);
      expect([...project.treatments].sort()).toEqual([...committed.treatments].sort());
      expect(project.timing.notEarlier).toBe("committed");
    }
    // Never-fund sites stay out in every year.
    for (const rule of scenario.rules) if (rule.kind === "never-fund" && rule.treatments.length === 0) expect(plan.selected.map((p) => p.site)).not.toContain(rule.site);
  });

  it("the CSV has a build_year and a spend column per year, matching the JSON project by project", () => {
    const programme = scenario.programme!;
    const records = parseCsv(csv).filter((record) => record.length > 1 || record[0] !== "");
    const header = records[2]!;
    const rows = records.slice(3);
    const column = (name: string) => header.indexOf(name);
    expect(column("build_year")).toBeGreaterThan(-1);
    const spendColumns = programme.budgets.map((_, y) => column(`spend_${programme.firstYear + y}_${scenario.currency}`));
    expect(spendColumns.every((index) => index > -1)).toBe(true);
    expect(rows).toHaveLength(plan.selected.length);
    const bySite = new Map(plan.selected.map((project) => [project.site, project]));
    for (const row of rows) {
      const project = bySite.get(row[column("site_id")]!)!;
      expect(Number(row[column("build_year")])).toBe(project.buildYear);
      spendColumns.forEach((index, y) => expect(close(Number(row[index]), project.spendByYear[y]!)).toBe(true));
    }
  });
});

describe("averta check, compare and uncertainty on a programme", () => {
  it("check prints a programme summary: years, budgets, carry-over, escalation, committed projects and phasing", async () => {
    const io = await runCaptured(["check", PROGRAMME]);
    expect(io.code).toBe(0);
    const programme = scenario.programme!;
    const line = (label: string) => io.stdout.split("\n").find((text) => text.trimStart().startsWith(`${label} `)) ?? "";
    const summary = line("programme");
    expect(summary).toContain(`${programme.firstYear}-${programme.firstYear + programme.years - 1}`);
    for (const budget of programme.budgets) expect(summary).toContain(budget.toLocaleString("en-US"));
    expect(summary).toContain(`carry-over ${programme.carryOver}`);
    expect(summary).toContain(`${(programme.costEscalationRate * 100).toFixed(1)}%`);
    for (const project of programme.committed) expect(line("committed")).toContain(`${project.site} (${project.treatments.join(", ")}, ${project.year})`);
    const phased = scenario.catalogue.treatments.filter((t) => (t.phasing ?? []).some((phase) => phase.yearsBeforeBuild > 0));
    expect(phased.length).toBeGreaterThan(0);
    for (const treatment of phased) expect(line("phasing")).toContain(treatment.id);
  });

  it("compare of this year's and next year's programme lists the sites that keep their treatments but move year", async () => {
    const io = await runCaptured(["compare", PROGRAMME, NEXT_YEAR, "--format", "json"]);
    expect(io.code, io.stderr).toBe(0);
    const compare = JSON.parse(io.stdout) as CompareJson;
    expect(compare.movedYear.length).toBeGreaterThan(0);
    const inPlan = new Map(plan.selected.map((project) => [project.site, project]));
    for (const moved of compare.movedYear) {
      expect([...moved.after.treatments].sort()).toEqual([...moved.before.treatments].sort());
      expect(moved.after.buildYear).not.toBe(moved.before.buildYear);
      // Side A is this year's plan, as `plan` printed it.
      expect(moved.before.buildYear).toBe(inPlan.get(moved.site)!.buildYear);
      expect([...moved.before.treatments].sort()).toEqual([...inPlan.get(moved.site)!.treatments].sort());
    }
    const others = new Set([...compare.entering, ...compare.leaving, ...compare.changedTreatment].map((entry) => entry.site));
    for (const moved of compare.movedYear) expect(others.has(moved.site)).toBe(false);
    // Next year's scenario marks this year's builds as never-fund: each of them leaves.
    const next = loadScenario(NEXT_YEAR).scenario;
    const built = next.rules.filter((rule) => rule.kind === "never-fund" && rule.treatments.length === 0 && inPlan.has(rule.site)).map((rule) => (rule as { site: string }).site);
    expect(built.length).toBeGreaterThan(0);
    expect(compare.leaving.map((entry) => entry.site)).toEqual(expect.arrayContaining(built));
  });

  it("uncertainty refuses a programme: exit 2, a message located at programme:, no stack trace, no output file", async () => {
    const out = join(scratch, "uncertainty.json");
    const io = await runCaptured(["uncertainty", PROGRAMME, "--draws", "2", "--threads", "1", "--format", "json", "--out", out]);
    expect(io.code).toBe(2);
    expect(io.stdout).toBe("");
    const line = lineOf(readFileSync(PROGRAMME, "utf8"), "programme:");
    expect(io.stderr.split("\n")[0]).toMatch(new RegExp(`^error: ${PROGRAMME.replace(".", "\\.")}:${line}:\\d+: programme: .*multi-year programme.* \\(.+\\)$`));
    expect(io.stderr).not.toMatch(/^\s+at /m);
    expect(existsSync(out)).toBe(false);
  });
});

describe("a bad programme file", () => {
  // The demo programme with four budgets for five years, its catalogue and sites file named by absolute path.
  const text = readFileSync(PROGRAMME, "utf8")
    .replace("../catalogs/demo-catalogue.yaml", resolve("catalogs/demo-catalogue.yaml"))
    .replace("sites: vellmar-candidate-sites.yaml", `sites: ${resolve("scenarios/vellmar-candidate-sites.yaml")}`)
    .replace("budgets: [3.2M, 3.5M, 3.8M, 4M, 4M]", "budgets: [3.2M, 3.5M, 3.8M, 4M]");
  const bad = join(scratch, "bad-programme.yaml");
  const commands: readonly (readonly string[])[] = [
    ["plan", "--format", "json"],
    ["plan", "--format", "csv"],
    ["check"],
    ["frontier", "--steps", "2"],
    ["compare", "--budget", "5M", "--budget", "9M"],
    ["report", "--steps", "2"],
  ];

  it.each(commands)("%s exits 2 with the file, line and field, no stack trace and no output file", async (command, ...options) => {
    writeFileSync(bad, text);
    expect(text).toContain("budgets: [3.2M, 3.5M, 3.8M, 4M]\n");
    const out = join(scratch, `${command}.out`);
    const io = await runCaptured([command, bad, ...options, ...(command === "check" ? [] : ["--out", out])]);
    expect(io.code).toBe(2);
    expect(io.stdout).toBe("");
    const first = io.stderr.split("\n")[0]!;
    expect(first.startsWith(`error: ${bad}:${lineOf(text, "  budgets:")}:`), first).toBe(true);
    expect(first).toContain(" programme.budgets: 4 budget(s) for a 5-year programme (give one amount per year (5), or one amount for every year)");
    expect(io.stderr).not.toMatch(/^\s+at /m);
    expect(existsSync(out)).toBe(false);
    expect(readdirSync(scratch).filter((name) => name.includes(command))).toEqual([]);
  });
});
