import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/runCli.js";
import { captureIo } from "./captureIo.js";

const scratch = mkdtempSync(join(tmpdir(), "averta-no-candidates-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

/** 1-based line of the first line of `text` that contains `needle`. */
function lineOf(text: string, needle: string): number {
  return text.split("\n").findIndex((line) => line.includes(needle)) + 1;
}

describe("sites without candidate treatments, through the commands", () => {
  // The demo with I-01 listing no candidates and I-02 leaving the key out.
  const text = readFileSync("scenarios/demo.yaml", "utf8")
    .replace("../catalogs/demo-catalogue.yaml", resolve("catalogs/demo-catalogue.yaml"))
    .replace("candidates: [leading-pedestrian-interval, retroreflective-backplates, raised-crosswalk]", "candidates: []")
    .replace("    candidates: [rapid-flashing-beacon, pedestrian-refuge-island, raised-crosswalk]\n", "");
  const file = join(scratch, "no-candidates.yaml");
  writeFileSync(file, text);

  it("are listed by check as notes, and check succeeds", async () => {
    const io = captureIo();
    expect(await runCli(["check", file], io)).toBe(0);
    expect(io.out).toMatch(/no candidates {2}2 site\(s\): screened and counted, but they cannot be funded/);
    const notes = io.err.split("\n").filter((line) => line.startsWith("note: "));
    expect(notes).toHaveLength(2);
    expect(notes[0]).toContain(`${file}:${lineOf(text, "candidates: []")}:`);
    expect(io.err).not.toMatch(/^error/m);
  });

  it("are ranked by screen, counted by plan and left out of the list as not fundable", async () => {
    const screen = captureIo();
    expect(await runCli(["screen", file, "--format", "json"], screen)).toBe(0);
    const screening = JSON.parse(screen.out) as { sites: { site: string }[]; sitesWithoutCandidates: string[] };
    expect(screening.sites.map((entry) => entry.site)).toContain("I-01");
    expect(screening.sitesWithoutCandidates).toEqual(["I-01", "I-02"]);

    const plan = captureIo();
    expect(await runCli(["plan", file, "--format", "json"], plan)).toBe(0);
    const json = JSON.parse(plan.out) as { status: string; selected: { site: string }[]; sitesWithoutCandidates: string[]; justification: { notFunded: { site: string; reason: string; explanation: string }[] } };
    expect(json.status).toBe("optimal");
    expect(json.sitesWithoutCandidates).toEqual(["I-01", "I-02"]);
    expect(json.selected.map((entry) => entry.site)).not.toContain("I-01");
    const i01 = json.justification.notFunded.find((entry) => entry.site === "I-01")!;
    expect(i01.reason).toBe("no-alternatives");
    expect(i01.explanation).toMatch(/no candidate treatments are listed/);

    const table = captureIo();
    expect(await runCli(["plan", file], table)).toBe(0);
    expect(table.out).toContain("2 sites have no candidate treatments and cannot be funded: I-01, I-02.");
  });

  it("are counted in the report", async () => {
    const out = join(scratch, "report.html");
    const io = captureIo();
    expect(await runCli(["report", file, "--draws", "0", "--steps", "2", "--out", out], io)).toBe(0);
    expect(readFileSync(out, "utf8")).toContain('<span id="no-candidates">2 sites have no candidate treatments and cannot be funded: I-01, I-02.</span>');
  });
});
