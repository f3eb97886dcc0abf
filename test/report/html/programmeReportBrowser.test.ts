import { existsSync, mkdtempSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { planProgramme, type PlanResult } from "../../../src/analysis/planProgramme.js";
import { preparePlan } from "../../../src/analysis/preparePlan.js";
import type { CliIo } from "../../../src/cli/CliIo.js";
import { runCli } from "../../../src/cli/runCli.js";
import { loadScenario } from "../../../src/io/loadScenario.js";
import { CAUTIONS } from "../../../src/report/cautions.js";

const CHROMIUM = "/usr/bin/chromium";
const SCENARIO = "scenarios/demo-programme-2028.yaml";
const browserPresent = existsSync(CHROMIUM);
const quiet: CliIo = { stdout: () => {}, stderr: () => {}, stderrIsTty: false };

// The programme section as a reader's browser draws it, against the plan solved here independently of the page.
describe.skipIf(!browserPresent && !process.env.CI)("programme report in headless chromium", () => {
  let context: BrowserContext;
  let page: Page;
  let plan: PlanResult;
  const consoleErrors: string[] = [];
  const external: string[] = [];

  beforeAll(async () => {
    if (!browserPresent) throw new Error(`chromium not found at ${CHROMIUM}: install it with "apt-get install -y chromium"`);
    const folder = mkdtempSync(join(tmpdir(), "averta-programme-report-"));
    const out = join(folder, "report.html");
    expect(await runCli(["report", SCENARIO, "--out", out, "--steps", "1", "--draws", "0"], quiet)).toBe(0);
    plan = await planProgramme(preparePlan(loadScenario(SCENARIO).scenario));
    expect(plan.solution.status).toBe("optimal");
    context = await chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), "averta-chromium-profile-")), {
      executablePath: CHROMIUM,
      headless: true,
      viewport: { width: 1100, height: 900 },
      args: ["--headless", "--no-sandbox", "--disable-gpu", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
    });
    context.on("request", (request) => {
      if (!request.url().startsWith("file:") && !request.url().startsWith("data:")) external.push(request.url());
    });
    page = await context.newPage();
    page.on("console", (message) => {
      if (message.type() === "error") consoleErrors.push(message.text());
    });
    page.on("pageerror", (error) => consoleErrors.push(String(error)));
    await page.goto(`file://${out}`, { waitUntil: "load" });
  }, 120_000);

  afterAll(async () => {
    await context?.close();
  });

  it("loads with no network request and no console error, cautions shown", async () => {
    expect(external).toEqual([]);
    expect(consoleErrors).toEqual([]);
    const cautions = (await page.locator("#cautions").textContent()) ?? "";
    for (const caution of CAUTIONS) expect(cautions).toContain(caution);
  });

  it("draws one timeline row per funded project, in its build year", async () => {
    const rows = await page.locator("#programme-timeline g[data-site]").evaluateAll((elements) => elements.map((element) => [element.getAttribute("data-site"), Number(element.getAttribute("data-build-year"))] as const));
    const expected = plan.funded.map((project) => [project.entry.site.id, project.alternative.buildYear] as const);
    expect(new Map(rows)).toEqual(new Map(expected));
    expect(rows.length).toBe(plan.funded.length);
  });

  it("puts each build-year bar under its year's label and every label inside the chart", async () => {
    const programme = plan.prepared.scenario.programme!;
    const geometry = await page.locator("#programme-timeline").evaluate((svg) => {
      const box = svg.getBoundingClientRect();
      const labels = [...svg.querySelectorAll(":scope > text")].map((text) => ({ year: Number(text.textContent), ...rect(text) }));
      const bars = [...svg.querySelectorAll("g[data-site]")].map((group) => ({
        build: Number(group.getAttribute("data-build-year")),
        vermillion: [...group.querySelectorAll("rect")].filter((r) => r.getAttribute("fill") === "#D55E00").map(rect),
      }));
      function rect(element: { getBoundingClientRect(): { left: number; right: number; top: number; bottom: number } }) {
        const r = element.getBoundingClientRect();
        return { left: r.left, right: r.right, top: r.top, bottom: r.bottom };
      }
      return { box: rect(svg), width: box.width, labels, bars };
    });
    expect(geometry.labels.map((label) => label.year)).toEqual(Array.from({ length: programme.years + 1 }, (_, y) => programme.firstYear + y));
    for (const label of geometry.labels) {
      expect(label.left).toBeGreaterThanOrEqual(geometry.box.left);
      expect(label.right).toBeLessThanOrEqual(geometry.box.right);
    }
    for (const bar of geometry.bars) {
      expect(bar.vermillion.length).toBe(1);
      const label = geometry.labels.find((l) => l.year === bar.build)!;
      const middle = (label.left + label.right) / 2;
      expect(bar.vermillion[0]!.left).toBeLessThan(middle);
      expect(bar.vermillion[0]!.right).toBeGreaterThan(middle);
    }
  });

  it("shows each year's budget, spend and projects as the plan has them, spend within what the carry-over allows", async () => {
    const cells = await page.locator("#programme-years tbody tr").evaluateAll((rows) => rows.map((row) => [...row.querySelectorAll("td")].map((cell) => cell.textContent ?? "")));
    expect(cells.length).toBe(plan.years!.length);
    plan.years!.forEach((year, index) => {
      expect(cells[index]![0]).toBe(String(year.year));
      expect(Number(cells[index]![5])).toBe(year.projects);
      expect(year.spend).toBeLessThanOrEqual((year.budget + year.carriedIn) * (1 + 1e-9));
    });
    const bars = await page.locator("#year-spend-chart g[data-year]").count();
    expect(bars).toBe(plan.years!.length);
    expect((await page.locator("#programme").textContent()) ?? "").toContain("not yet computed for a multi-year programme");
  });
});
