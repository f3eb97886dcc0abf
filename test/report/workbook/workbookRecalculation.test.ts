// The workbook's formulas, recomputed by LibreOffice Calc as an independent spreadsheet engine,
// must give averta's own figures (evaluateAlternative and alternativeInBuildYear), also after the
// discount rate is edited; hostile names must stay inert text.
import { mkdtempSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { casePlan } from "../../../src/analysis/casePlan.js";
import { planProgramme } from "../../../src/analysis/planProgramme.js";
import { preparePlan } from "../../../src/analysis/preparePlan.js";
import { loadScenario } from "../../../src/io/loadScenario.js";
import type { Alternative, Scenario } from "../../../src/model/types.js";
import { buildWorkbook } from "../../../src/report/workbook/buildWorkbook.js";
import { workbookXlsx } from "../../../src/report/workbook/workbookXlsx.js";
import { recalculatedSheets, resavedXlsx } from "./libreOffice.js";

const folder = mkdtempSync(join(tmpdir(), "averta-workbook-"));

async function writeWorkbook(scenario: Scenario, name: string): Promise<string> {
  const plan = await planProgramme(preparePlan(scenario));
  const planCase = await casePlan(plan);
  const path = join(folder, name);
  writeFileSync(path, await workbookXlsx(buildWorkbook({ plan, planCase, frontier: [] })));
  return path;
}

/** Every alternative's figures as averta computes them, in the workbook's alternative order. */
function modelFigures(scenario: Scenario): readonly Alternative[] {
  return preparePlan(scenario).sites.flatMap((entry) => entry.alternatives);
}

function close(actual: number, expected: number): void {
  expect(Math.abs(actual - expected)).toBeLessThanOrEqual(1e-9 * Math.max(1, Math.abs(expected)));
}

function checkAlternatives(sheets: Map<string, string[][]>, expected: readonly Alternative[]): void {
  const rows = sheets.get("Alternatives")!;
  const header = rows[2]!;
  const column = (name: string) => header.indexOf(name);
  const body = rows.slice(3).filter((row) => row[0] !== "");
  expect(body).toHaveLength(expected.length);
  body.forEach((row, index) => {
    const want = expected[index]!;
    close(Number(row[column("Benefit PV")]), want.benefitPV);
    close(Number(row[column("Lifecycle cost PV")]), want.lifecycleCostPV);
    close(Number(row[column("K+A crashes avoided")]), want.ksiAvoided);
    close(Number(row[column("NPV")]), want.npv);
    if (Number.isFinite(want.bcRatio)) close(Number(row[column("B/C")]), want.bcRatio);
  });
}

describe("workbook recomputed by LibreOffice", () => {
  for (const file of ["scenarios/demo.yaml", "scenarios/demo-programme.yaml"]) {
    it(`${file}: every alternative's money figures recompute to averta's within 1e-9`, async () => {
      const { scenario } = loadScenario(file);
      const path = await writeWorkbook(scenario, file.replace(/\W/g, "_") + ".xlsx");
      checkAlternatives(await recalculatedSheets(path), modelFigures(scenario));
    }, 120_000);
  }

  it("every formula's cached result (what a viewer that does not recalculate shows) is what LibreOffice computes", async () => {
    const { scenario } = loadScenario("scenarios/demo-programme.yaml");
    const path = await writeWorkbook(scenario, "cached.xlsx");
    const recomputed = await recalculatedSheets(path);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.readFile(path);
    let formulas = 0;
    workbook.eachSheet((sheet) => {
      const rows = recomputed.get(sheet.name)!;
      sheet.eachRow((row, rowNumber) =>
        row.eachCell((cell, columnNumber) => {
          if (cell.formula === undefined) return;
          formulas++;
          const where = `${sheet.name}!${cell.address}`;
          const cached = cell.result;
          const value = rows[rowNumber - 1]![columnNumber - 1]!;
          if (typeof cached === "number") {
            expect(Number.isFinite(Number(value)), `${where}: ${value}`).toBe(true);
            close(Number(value), cached);
          } else expect(value, where).toBe(String(cached ?? ""));
        }),
      );
    });
    expect(formulas).toBeGreaterThan(100);
  }, 120_000);

  it("a discount rate edited in a copy recomputes to averta's figures at that rate", async () => {
    const { scenario } = loadScenario("scenarios/demo.yaml");
    const path = await writeWorkbook(scenario, "rate.xlsx");
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.readFile(path);
    const sheet = workbook.getWorksheet("Assumptions")!;
    let edited = false;
    sheet.eachRow((row) => {
      if (row.getCell(3).value === "DiscountRate") {
        row.getCell(2).value = 0.07;
        edited = true;
      }
    });
    expect(edited).toBe(true);
    const copy = join(folder, "rate-edited.xlsx");
    await workbook.xlsx.writeFile(copy);
    const atSeven = { ...scenario, economics: { ...scenario.economics, discountRate: 0.07 } };
    checkAlternatives(await recalculatedSheets(copy), modelFigures(atSeven));
  }, 120_000);

  it("the capital list's totals recompute to the plan's totals", async () => {
    const { scenario } = loadScenario("scenarios/demo.yaml");
    const plan = await planProgramme(preparePlan(scenario));
    const path = await writeWorkbook(scenario, "totals.xlsx");
    const rows = (await recalculatedSheets(path)).get("Capital list")!;
    const header = rows[2]!;
    const totals = rows.find((row) => row[0] === "Total")!;
    close(Number(totals[header.indexOf("Benefit PV")]), plan.totals.benefitPV);
    close(Number(totals[header.indexOf("Lifecycle cost PV")]), plan.totals.lifecycleCostPV);
    close(Number(totals[header.indexOf("K+A crashes avoided")]), plan.totals.ksiAvoided);
    close(Number(totals[header.indexOf("Capital cost")]), plan.totals.cost);
    close(Number(totals[header.indexOf("B/C")]), plan.totals.bcRatio);
    expect(rows.length - 4).toBe(plan.totals.projects);
  }, 120_000);

  it("hostile site names stay inert text after LibreOffice opens and re-saves the file", async () => {
    const { scenario } = loadScenario("scenarios/demo.yaml");
    const hostile = ['=HYPERLINK("http://example.invalid","x")', "+cmd|' /C calc'!A0", "@SUM(1)", "\tTabbed", "-2+3", "_x0041_ literal"];
    const sites = scenario.sites.map((site, index) => (index < hostile.length ? { ...site, name: hostile[index]! } : site));
    const path = await writeWorkbook({ ...scenario, sites }, "hostile.xlsx");
    const resaved = join(folder, "hostile-resaved.xlsx");
    await resavedXlsx(path, resaved);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.readFile(resaved);
    const names = new Map<string, ExcelJS.Cell>();
    workbook.getWorksheet("Alternatives")!.eachRow((row) => names.set(String(row.getCell(3).value), row.getCell(3)));
    for (const name of hostile) {
      const cell = names.get(name);
      expect(cell, name).toBeDefined();
      expect(cell!.type).toBe(ExcelJS.ValueType.String);
      expect(cell!.formula).toBeUndefined();
    }
  }, 120_000);
});
