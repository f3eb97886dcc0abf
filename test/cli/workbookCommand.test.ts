// `averta workbook`: writes a real .xlsx, refuses to replace a file without --force, and rejects
// bad options with exit 2 before any work (the brief's rules for output files and bad input).
import { copyFileSync, existsSync, mkdirSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import ExcelJS from "exceljs";
import { describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/runCli.js";
import { captureIo } from "./captureIo.js";

const folder = mkdtempSync(join(tmpdir(), "averta-workbook-cli-"));

describe("averta workbook", () => {
  it("writes the demo plan as a workbook with its sheets and the cautions", async () => {
    const out = join(folder, "demo.xlsx");
    const io = captureIo();
    expect(await runCli(["workbook", "scenarios/demo.yaml", "--out", out, "--steps", "3"], io)).toBe(0);
    expect(io.out).toBe("");
    expect(io.err).toContain(`wrote ${out}`);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.readFile(out);
    expect(workbook.worksheets.map((sheet) => sheet.name)).toEqual(["Summary", "Assumptions", "Capital list", "Not funded", "Budget levels", "Alternatives", "Benefit streams", "Cost streams"]);
    const summary: string[] = [];
    workbook.getWorksheet("Summary")!.eachRow((row) => summary.push(row.values!.toString()));
    expect(summary.join("\n")).toMatch(/engineering judgement/);
  });

  it("--steps 0 leaves out the Budget levels sheet", async () => {
    const out = join(folder, "no-levels.xlsx");
    expect(await runCli(["workbook", "scenarios/demo.yaml", "--out", out, "--steps", "0"], captureIo())).toBe(0);
    const workbook = new ExcelJS.Workbook();
    await workbook.xlsx.readFile(out);
    expect(workbook.getWorksheet("Budget levels")).toBeUndefined();
  });

  it("refuses to replace an existing file without --force: exit 2, the file untouched", async () => {
    const out = join(folder, "keep.xlsx");
    writeFileSync(out, "keep me");
    const io = captureIo();
    expect(await runCli(["workbook", "scenarios/demo.yaml", "--out", out, "--steps", "0"], io)).toBe(2);
    expect(io.err).toContain("keep.xlsx");
    expect(io.err).toContain("--force");
    expect(readFileSync(out, "utf8")).toBe("keep me");
    expect(await runCli(["workbook", "scenarios/demo.yaml", "--out", out, "--steps", "0", "--force"], captureIo())).toBe(0);
    expect(readFileSync(out).subarray(0, 2).toString()).toBe("PK");
  });

  it("never writes over the scenario it reads, even with --force", async () => {
    // The copy keeps the demo's layout: the scenario in a folder beside catalogs/.
    const root = mkdtempSync(join(tmpdir(), "averta-workbook-input-"));
    mkdirSync(join(root, "scenarios"));
    mkdirSync(join(root, "catalogs"));
    copyFileSync("catalogs/demo-catalogue.yaml", join(root, "catalogs", "demo-catalogue.yaml"));
    const scenario = join(root, "scenarios", "demo.yaml");
    copyFileSync("scenarios/demo.yaml", scenario);
    const io = captureIo();
    expect(await runCli(["workbook", scenario, "--out", scenario, "--force", "--steps", "0"], io)).toBe(2);
    expect(readFileSync(scenario, "utf8")).toBe(readFileSync("scenarios/demo.yaml", "utf8"));
    expect(io.err).toMatch(/input of this run/);
  });

  for (const [option, value] of [["--steps", "many"], ["--steps", "-1"], ["--budget", "lots"], ["--objective", "fun"], ["--engine", "magic"]] as const) {
    it(`${option} ${value}: exit 2 naming the option, no file written, no stack trace`, async () => {
      const out = join(folder, `bad-${option.slice(2)}-${value}.xlsx`);
      const io = captureIo();
      expect(await runCli(["workbook", "scenarios/demo.yaml", "--out", out, option, value], io)).toBe(2);
      expect(io.err).toContain(option);
      expect(io.err).not.toMatch(/\n\s+at /);
      expect(existsSync(out)).toBe(false);
    });
  }
});
