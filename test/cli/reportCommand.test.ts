import { mkdtempSync, readdirSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { beforeAll, describe, expect, it } from "vitest";
import type { CliIo } from "../../src/cli/CliIo.js";
import { runCli } from "../../src/cli/runCli.js";
import { formatMoney } from "../../src/report/formatNumber.js";

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
    expect(await runCli(["report", "scenarios/demo.yaml", "--out", out, "--steps", "2", "--draws", "0"], first)).toBe(0);
    expect(readdirSync(folder)).toEqual(["report.html"]);
    const html = readFileSync(out, "utf8");
    expect(html.startsWith("<!DOCTYPE html>")).toBe(true);
    // Self-contained: no external script, stylesheet, image or font reference.
    expect(html).not.toMatch(/<(script|img|link|iframe)[^>]+(src|href)=/i);
    expect(html).not.toMatch(/url\(|@import/i);
    expect(html).toContain("Vellmar 2027 road-safety capital programme");
    expect(await runCli(["report", "scenarios/demo.yaml", "--out", out, "--steps", "2", "--draws", "0", "--force"], capture())).toBe(0);
    expect(readFileSync(out, "utf8")).toBe(html);
    // --draws 0 leaves out the uncertainty sections; the case for the list is always there.
    expect(html).not.toContain('id="robustness"');
    expect(html).toContain('id="summary-gain"');
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

  it("rejects a bad --steps, --draws, --seed or --threads with exit 2 and writes nothing", async () => {
    const folder = mkdtempSync(join(tmpdir(), "averta-report-"));
    for (const bad of [["--steps", "0"], ["--draws", "-1"], ["--draws", "2.5"], ["--seed", "4294967296"], ["--threads", "0"]]) {
      const io = capture();
      expect(await runCli(["report", "scenarios/demo.yaml", "--out", join(folder, "r.html"), ...bad], io)).toBe(2);
      expect(io.err.join("")).toContain(bad[0]);
    }
    expect(readdirSync(folder)).toEqual([]);
  });
});

/** Runs a command that prints JSON and parses it. */
async function jsonOf(argv: string[]): Promise<any> {
  const io = capture();
  expect(await runCli(argv, io)).toBe(0);
  return JSON.parse(io.out.join(""));
}

describe("averta report shows what plan and uncertainty compute (demo scenario)", () => {
  const DRAWS = ["--draws", "16", "--seed", "99"];
  let html: string;
  let folder: string;
  beforeAll(async () => {
    folder = mkdtempSync(join(tmpdir(), "averta-report-"));
    expect(await runCli(["report", "scenarios/demo.yaml", "--out", join(folder, "a.html"), "--steps", "2", ...DRAWS, "--threads", "1"], capture())).toBe(0);
    html = readFileSync(join(folder, "a.html"), "utf8");
  });

  it("the ranking gain equals plan --format json's justification.rankingComparison", async () => {
    const plan = await jsonOf(["plan", "scenarios/demo.yaml", "--format", "json"]);
    const gain = Number(/id="summary-gain" data-extra-ksi="([^"]+)"/.exec(html)![1]);
    expect(gain).toBe(plan.justification.rankingComparison.extraKsiAvoidedByOptimal);
    expect(html).toContain(`${plan.justification.rankingComparison.rankingProjects} projects, ${formatMoney(plan.justification.rankingComparison.rankingSpend)} USD spent`);
    const atSpend = Number(/data-extra-ksi-at-ranking-spend="([^"]+)"/.exec(html)![1]);
    expect(atSpend).toBe(plan.justification.rankingComparison.atRankingSpend.extraKsiAvoidedByOptimal);
    const overExtended = Number(/data-extra-ksi-over-extended="([^"]+)"/.exec(html)![1]);
    expect(overExtended).toBe(plan.justification.rankingComparison.extendedRanking.extraKsiAvoidedByOptimal);
  });

  it("selection probabilities equal uncertainty --format json's for the same seed and draws", async () => {
    const result = await jsonOf(["uncertainty", "scenarios/demo.yaml", "--format", "json", ...DRAWS]);
    const inPlan = (result.selections as { site: string; probability: number; inPlan: boolean; class: string }[]).filter((s) => s.inPlan);
    expect(inPlan.length).toBe(result.plan.projects);
    for (const selection of inPlan) {
      const cell = new RegExp(`data-site="${selection.site}">[^]*?class="num selection (\\w+)" data-probability="([^"]+)"`).exec(html);
      expect(cell, selection.site).not.toBeNull();
      expect(cell![1]).toBe(selection.class);
      expect(Number(cell![2])).toBe(selection.probability);
    }
    // Not every project is certain at 16 draws, so the check covers more than one class.
    expect(new Set(inPlan.map((s) => s.class)).size).toBeGreaterThan(1);
  });

  it("same input and seed give byte-identical HTML, whatever --threads", async () => {
    // Same file name in another folder: the name is part of the page (the CSV link).
    const again = join(mkdtempSync(join(tmpdir(), "averta-report-")), "a.html");
    expect(await runCli(["report", "scenarios/demo.yaml", "--out", again, "--steps", "2", ...DRAWS, "--threads", "2"], capture())).toBe(0);
    expect(readFileSync(again, "utf8")).toBe(html);
    const otherSeed = join(mkdtempSync(join(tmpdir(), "averta-report-")), "a.html");
    expect(await runCli(["report", "scenarios/demo.yaml", "--out", otherSeed, "--steps", "2", "--draws", "16", "--seed", "100"], capture())).toBe(0);
    // A different seed gives different draws: the comparison above can fail.
    expect(readFileSync(otherSeed, "utf8")).not.toBe(html);
  });
});
