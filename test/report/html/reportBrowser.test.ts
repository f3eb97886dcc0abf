import { existsSync, mkdtempSync, readFileSync, statSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { chromium, type BrowserContext, type Page } from "playwright-core";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { fullFundingCost } from "../../../src/analysis/fullFundingCost.js";
import { budgetFrontier, budgetLevels, type FrontierLevel } from "../../../src/analysis/budgetFrontier.js";
import { preparePlan } from "../../../src/analysis/preparePlan.js";
import type { CliIo } from "../../../src/cli/CliIo.js";
import { runCli } from "../../../src/cli/runCli.js";
import { loadScenario } from "../../../src/io/loadScenario.js";
import { formatFixed, formatMoney } from "../../../src/report/formatNumber.js";

const CHROMIUM = "/usr/bin/chromium";
const HOSTILE_NAME = "<script>alert(1)</script>";
const HOSTILE_DISTRICT = "Old Town</script><script>alert(2)</script>";
const STEPS = 4;
const browserPresent = existsSync(CHROMIUM);
if (!browserPresent && !process.env.CI) {
  console.warn(`SKIPPED report browser tests: ${CHROMIUM} not found. Install it with "apt-get install -y chromium" (CI installs it and fails without it).`);
}

const quiet: CliIo = { stdout: () => {}, stderr: () => {}, stderrIsTty: false };

describe.skipIf(!browserPresent && !process.env.CI)("HTML report in headless chromium", () => {
  let folder: string;
  let context: BrowserContext;
  let page: Page;
  let frontier: FrontierLevel[];
  let chosenIndex: number;
  const external: string[] = [];
  const consoleErrors: string[] = [];
  const dialogs: string[] = [];

  beforeAll(async () => {
    if (!browserPresent) throw new Error(`chromium not found at ${CHROMIUM}: install it with "apt-get install -y chromium" (.ci/run does so before npm test)`);
    folder = mkdtempSync(join(tmpdir(), "averta-report-browser-"));
    // The demo with scenario text that would run as script if it were not escaped.
    const demo = readFileSync("scenarios/demo.yaml", "utf8")
      .replace("catalogues: [../catalogs/demo-catalogue.yaml]", `catalogues: [${JSON.stringify(resolve("catalogs/demo-catalogue.yaml"))}]`)
      .replace("name: Market Street / Bridge Street", `name: ${JSON.stringify(HOSTILE_NAME)}`)
      .replace(/(id: I-02\n(?:.*\n){2}\s+district: )Old Town/, `$1${JSON.stringify(HOSTILE_DISTRICT)}`);
    expect(demo).toContain(HOSTILE_NAME);
    expect(demo).toContain("alert(2)");
    const scenarioFile = join(folder, "hostile.yaml");
    writeFileSync(scenarioFile, demo);
    const out = join(folder, "report.html");
    expect(await runCli(["report", scenarioFile, "--out", out, "--steps", String(STEPS), "--draws", "12", "--csv", join(folder, "list.csv")], quiet)).toBe(0);

    // The frontier computed here, independently of the page, at the levels the command uses.
    const { scenario } = loadScenario(scenarioFile);
    const prepared = preparePlan(scenario);
    const levels = [...new Set([...budgetLevels(0, fullFundingCost(prepared), STEPS), scenario.budget])].sort((a, b) => a - b);
    frontier = await budgetFrontier(prepared, levels);
    chosenIndex = levels.indexOf(scenario.budget);

    context = await chromium.launchPersistentContext(mkdtempSync(join(tmpdir(), "averta-chromium-profile-")), {
      executablePath: CHROMIUM,
      headless: true,
      viewport: { width: 1100, height: 900 },
      args: ["--headless", "--no-sandbox", "--disable-gpu", "--disable-quic", "--no-first-run", "--disable-background-networking", "--disable-component-update", "--disable-sync"],
    });
    context.on("request", (request) => {
      const url = request.url();
      if (!url.startsWith("data:") && !url.startsWith("file:")) external.push(url);
    });
    page = await context.newPage();
    page.on("console", (message) => {
      if (message.type() === "error") consoleErrors.push(message.text());
    });
    page.on("pageerror", (error) => consoleErrors.push(String(error)));
    page.on("dialog", (dialog) => {
      dialogs.push(dialog.message());
      void dialog.dismiss();
    });
    await page.goto(`file://${out}`, { waitUntil: "load" });
  });

  afterAll(async () => {
    await context?.close();
  });

  async function shown(id: string): Promise<{ text: string; value: string }> {
    const locator = page.locator(`#${id}`);
    return { text: (await locator.textContent()) ?? "", value: (await locator.getAttribute("data-value")) ?? "" };
  }

  async function expectLevel(index: number): Promise<void> {
    const level = frontier[index]!;
    const budget = await shown("slider-budget");
    expect(Number(budget.value)).toBe(level.budget);
    const rows = await page.locator("#slider-funded tr").evaluateAll((elements) => elements.map((element) => element.getAttribute("data-site")));
    if (level.plan.solution.status !== "optimal") {
      expect((await shown("slider-ksi")).text).toBe("–");
      expect(rows).toEqual([]);
      return;
    }
    const totals = level.plan.totals;
    const ksi = await shown("slider-ksi");
    expect(Number(ksi.value)).toBeCloseTo(totals.ksiAvoided, 9);
    expect(ksi.text).toBe(formatFixed(totals.ksiAvoided, 1));
    const cost = await shown("slider-cost");
    expect(Number(cost.value)).toBe(totals.cost);
    expect(cost.text).toBe(formatMoney(totals.cost));
    expect(Number((await shown("slider-projects")).value)).toBe(totals.projects);
    expect(Number((await shown("slider-npv")).value)).toBeCloseTo(totals.npv, 3);
    expect(rows).toEqual(level.plan.funded.map((project) => project.entry.site.id));
  }

  it("loads with no network request and no console error", () => {
    expect(external).toEqual([]);
    expect(consoleErrors).toEqual([]);
  });

  it("renders scenario text as text: no dialog, no extra script, the literal in the page", async () => {
    expect(dialogs).toEqual([]);
    expect(await page.locator("script").count()).toBe(2); // the frontier JSON and the slider script
    const text = (await page.locator("body").textContent()) ?? "";
    expect(text).toContain(HOSTILE_NAME);
    expect(text).toContain(HOSTILE_DISTRICT);
    expect(await page.locator("#capital-list").textContent()).toContain(HOSTILE_NAME);
  });

  it("shows the robustness and sensitivity sections, the tornado drawn inline", async () => {
    expect(await page.locator("#robustness").isVisible()).toBe(true);
    const tornado = page.locator("#sensitivity figure.tornado svg");
    expect(await tornado.count()).toBe(1);
    // Scaled to the column, not its 1010 px natural width.
    const box = await tornado.boundingBox();
    expect(box!.width).toBeLessThanOrEqual(1100);
    expect(await page.locator("#capital-list td.selection").count()).toBe(frontier[chosenIndex]!.plan.funded.length);
  });

  it("draws the chosen budget's marker above the frontier's points, where a pointer finds it", async () => {
    // Run in the page (as text: the tests are type-checked without the DOM library).
    const onTop = await page.evaluate<boolean>(`(() => {
      const marker = document.querySelector("#frontier-chart .chosen-marker");
      marker.scrollIntoView({ block: "center" });
      const box = marker.getBoundingClientRect();
      return document.elementFromPoint(box.x + box.width / 2, box.y + box.height / 2)?.classList.contains("chosen-marker") ?? false;
    })()`);
    expect(onTop).toBe(true);
  });

  it("prints every tornado label whole, inside the label column and clear of its neighbours", async () => {
    const labels = await page.evaluate<{ right: number; top: number; bottom: number; text: string; full: string }[]>(`
      [...document.querySelectorAll("#sensitivity text.tornado-label")].map((text) => {
        const box = text.getBBox();
        const spans = [...text.querySelectorAll("tspan")].map((span) => span.textContent);
        return { right: box.x + box.width, top: box.y, bottom: box.y + box.height, text: spans.join(" "), full: text.querySelector("title").textContent };
      })`);
    expect(labels.length).toBeGreaterThan(3);
    for (const label of labels) {
      expect(label.text).toBe(label.full);
      // The label column is 330 px wide, with the change dot at 322 ± 4 (tornadoSvg's layout).
      expect(label.right).toBeLessThan(316);
    }
    for (let index = 1; index < labels.length; index += 1) expect(labels[index]!.top).toBeGreaterThanOrEqual(labels[index - 1]!.bottom - 0.5);
  });

  it("opens the slider at the chosen budget with the capital list's totals", async () => {
    expect(Number(await page.locator("#budget-slider").inputValue())).toBe(chosenIndex);
    await expectLevel(chosenIndex);
    const listed = await page.locator("#capital-list tbody.project").evaluateAll((elements) => elements.map((element) => element.getAttribute("data-site")));
    expect(listed).toEqual(frontier[chosenIndex]!.plan.funded.map((project) => project.entry.site.id));
  });

  it("moving the slider shows the frontier's list and totals at each level", async () => {
    const slider = page.locator("#budget-slider");
    await slider.focus();
    await page.keyboard.press("Home");
    let checked = 0;
    for (let index = 0; index < frontier.length; index += 1) {
      if (index > 0) await page.keyboard.press("ArrowRight");
      expect(Number(await slider.inputValue())).toBe(index);
      await expectLevel(index);
      checked += 1;
    }
    expect(checked).toBe(STEPS + 2);
    // Levels differ, so the funded list really changed as the slider moved.
    expect(frontier[1]!.plan.funded.length).not.toBe(frontier[frontier.length - 1]!.plan.funded.length);
  });

  it("writes a screenshot", async () => {
    const file = join(folder, "report.png");
    await page.locator("#budget-slider").focus();
    await page.keyboard.press("Home");
    for (let index = 0; index < chosenIndex; index += 1) await page.keyboard.press("ArrowRight");
    await page.screenshot({ path: file, fullPage: true });
    const bytes = readFileSync(file);
    expect(bytes.subarray(0, 8)).toEqual(Buffer.from([0x89, 0x50, 0x4e, 0x47, 0x0d, 0x0a, 0x1a, 0x0a])); // PNG signature (ISO/IEC 15948)
    expect(statSync(file).size).toBeGreaterThan(50_000);
    if (process.env.AVERTA_KEEP_SCREENSHOT) writeFileSync(process.env.AVERTA_KEEP_SCREENSHOT, bytes);
  });
});
