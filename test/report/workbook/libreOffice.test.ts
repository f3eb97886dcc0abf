import ExcelJS from "exceljs";
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { libreOfficePresent, recalculatedSheets, resavedXlsx, SOFFICE } from "./libreOffice.js";

// LibreOffice Calc as an independent spreadsheet engine: these checks prove the harness itself, so later
// workbook tests can trust that what they read was computed by LibreOffice, not echoed from exceljs.
const HYPERLINK_TEXT = '=HYPERLINK("http://x") is text, not a formula';
const AWKWARD_TEXT = 'a "quoted", comma\nand a line break';

describe.skipIf(!libreOfficePresent && !process.env.CI)("LibreOffice harness", () => {
  let folder: string;
  let source: string;
  let sheets: Map<string, string[][]>;
  let resaved: ExcelJS.Workbook;

  beforeAll(async () => {
    if (!libreOfficePresent) throw new Error(`soffice not found at ${SOFFICE}: install it with "apt-get install -y libreoffice-calc"`);
    folder = mkdtempSync(join(tmpdir(), "averta-libreoffice-test-"));
    source = join(folder, "source.xlsx");
    const workbook = new ExcelJS.Workbook();
    const summary = workbook.addWorksheet("Summary");
    summary.getCell("A1").value = 21;
    // Cached results are deliberately wrong: only a real recalculation yields the right values.
    summary.getCell("B1").value = { formula: "A1*2", result: 999 };
    summary.getCell("C1").value = { formula: "1/3", result: 999 };
    summary.getCell("D1").value = { formula: "0.1+0.2", result: 999 };
    summary.getCell("E1").value = AWKWARD_TEXT;
    const capital = workbook.addWorksheet("Capital list");
    capital.getCell("A1").value = HYPERLINK_TEXT;
    capital.getCell("A2").value = { formula: "Summary!B1+1", result: 999 };
    await workbook.xlsx.writeFile(source);

    // Both calls at once: each has its own profile, so they must not get in each other's way.
    const resavedPath = join(folder, "resaved.xlsx");
    [sheets] = await Promise.all([recalculatedSheets(source), resavedXlsx(source, resavedPath)]);
    resaved = new ExcelJS.Workbook();
    await resaved.xlsx.readFile(resavedPath);
  });

  afterAll(() => {
    if (folder) rmSync(folder, { recursive: true, force: true });
  });

  it("exports every sheet, keyed by its name, spaces included", () => {
    expect([...sheets.keys()]).toEqual(["Capital list", "Summary"]);
  });

  it("recalculates formulas instead of keeping the cached results", () => {
    const summary = sheets.get("Summary")!;
    expect(summary[0]![0]).toBe("21");
    expect(summary[0]![1]).toBe("42");
    expect(sheets.get("Capital list")![1]![0]).toBe("43");
  });

  it("writes numbers unrounded by the display format, to 15 significant digits", () => {
    const [, , third, sum] = sheets.get("Summary")![0]!;
    // IEEE 754 doubles: the reference values are JavaScript's own evaluation of the same expressions.
    expect(Math.abs(Number(third) - 1 / 3) / (1 / 3)).toBeLessThanOrEqual(1e-15);
    expect(Math.abs(Number(sum) - (0.1 + 0.2)) / (0.1 + 0.2)).toBeLessThanOrEqual(1e-15);
  });

  it("keeps quotes, commas and line breaks inside a text cell (RFC 4180 quoting)", () => {
    expect(sheets.get("Summary")![0]![4]).toBe(AWKWARD_TEXT);
  });

  it("keeps text that looks like a formula as literal text after LibreOffice re-saves the file", () => {
    const cell = resaved.getWorksheet("Capital list")!.getCell("A1");
    expect(cell.type).toBe(ExcelJS.ValueType.String);
    expect(cell.formula).toBeUndefined();
    expect(cell.value).toBe(HYPERLINK_TEXT);
    expect(sheets.get("Capital list")![0]![0]).toBe(HYPERLINK_TEXT);
  });

  it("rejects a file LibreOffice cannot load, passing on soffice's message", async () => {
    const broken = join(folder, "broken.xlsx");
    writeFileSync(broken, "PK\u0003\u0004 not a zip archive");
    await expect(recalculatedSheets(broken)).rejects.toThrow(/source file could not be loaded/);
  });
});
