import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import type { CliIo } from "../../src/cli/CliIo.js";
import { runCli } from "../../src/cli/runCli.js";

function capture(): CliIo & { out: string[]; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  return { out, err, stdout: (text) => out.push(text), stderr: (text) => err.push(text), stderrIsTty: false };
}

describe("averta report (smoke, demo scenario)", () => {
  it("writes one self-contained HTML file, byte-identical on a second run with --force", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-report-"));
    const out = join(folder, "report.html");
    const first = capture();
    expect(await runCli(["report", "scenarios/demo.yaml", "--out", out, "--steps", "2"], first)).toBe(0);
    expect(readdirSync(folder)).toEqual(["report.html"]);
    const html = readFileSync(out, "utf8");
    expect(html.startsWith("<!DOCTYPE html>")).toBe(true);
    // Self-contained: no external script, stylesheet, image or font reference.
    expect(html).not.toMatch(/<(script|img|link|iframe)[^>]+(src|href)=/i);
    expect(html).not.toMatch(/url\(|@import/i);
    expect(html).toContain("Vellmar 2027 road-safety capital programme");
    expect(await runCli(["report", "scenarios/demo.yaml", "--out", out, "--steps", "2", "--force"], capture())).toBe(0);
    expect(readFileSync(out, "utf8")).toBe(html);
  });

  it("refuses to overwrite without --force: exit 2, file untouched", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-report-"));
    const out = join(folder, "report.html");
    writeFileSync(out, "keep me");
    const io = capture();
    expect(await runCli(["report", "scenarios/demo.yaml", "--out", out], io)).toBe(2);
    expect(readFileSync(out, "utf8")).toBe("keep me");
    expect(io.err.join("")).toContain("--force");
  });

  it("writes neither file when the --csv target exists (exit 2)", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-report-"));
    writeFileSync(join(folder, "list.csv"), "keep me");
    const io = capture();
    expect(await runCli(["report", "scenarios/demo.yaml", "--out", join(folder, "report.html"), "--csv", join(folder, "list.csv")], io)).toBe(2);
    expect(readdirSync(folder)).toEqual(["list.csv"]);
    expect(readFileSync(join(folder, "list.csv"), "utf8")).toBe("keep me");
  });

  it("rejects a bad --steps with exit 2", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-report-"));
    expect(await runCli(["report", "scenarios/demo.yaml", "--out", join(folder, "r.html"), "--steps", "0"], capture())).toBe(2);
    expect(readdirSync(folder)).toEqual([]);
  });
});
