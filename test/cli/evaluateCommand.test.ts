// `averta evaluate` on the invented demo (scenarios/vellmar-built-projects.yaml, drawn by
// scripts/evaluationDemo.ts with planted effects): it must recover them within their intervals,
// show the naive estimate's regression-to-the-mean bias, and write its side files.
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/runCli.js";
import { loadCatalogue } from "../../src/io/loadCatalogue.js";
import { evaluationDemoYaml, PLANTED_EFFECTS } from "../../scripts/evaluationDemo.js";
import { captureIo } from "./captureIo.js";

const DEMO = "scenarios/vellmar-built-projects.yaml";
const folder = mkdtempSync(join(tmpdir(), "averta-evaluate-"));

interface EstimateJson { theta: number; lower95: number; upper95: number }
interface GroupJson { name: string; crashGroups: { crashGroup: string; empiricalBayes: EstimateJson | null; naive: EstimateJson | null; comparisonGroup: EstimateJson | null }[] }

async function demoJson(): Promise<{ groups: GroupJson[] }> {
  const io = captureIo();
  expect(await runCli(["evaluate", DEMO, "--format", "json"], io)).toBe(0);
  return JSON.parse(io.out) as { groups: GroupJson[] };
}

describe("averta evaluate", () => {
  it("the committed demo file is what its generator draws (the data are generated, not typed)", () => {
    expect(readFileSync(DEMO, "utf8")).toBe(evaluationDemoYaml(loadCatalogue("catalogs/demo-catalogue.yaml").catalogue));
  });

  it("recovers each planted effect within the Empirical Bayes 95% interval", async () => {
    const json = await demoJson();
    for (const [treatment, planted] of Object.entries(PLANTED_EFFECTS)) {
      const total = json.groups.find((group) => group.name === treatment)!.crashGroups.find((entry) => entry.crashGroup === "total")!;
      expect(total.empiricalBayes!.lower95).toBeLessThanOrEqual(planted);
      expect(total.empiricalBayes!.upper95).toBeGreaterThanOrEqual(planted);
      // The naive estimate is shown beside it (its bias is shown by simulation in test/model/beforeAfterSimulation.test.ts).
      expect(total.naive).not.toBeNull();
    }
    const backplates = json.groups.find((group) => group.name === "retroreflective-backplates")!.crashGroups.find((entry) => entry.crashGroup === "total")!;
    expect(backplates.comparisonGroup).not.toBeNull();
  });

  it("prints a table with the cautions, names the sites that cannot use Empirical Bayes, and writes the local evidence and the chart", async () => {
    const effects = join(folder, "local.yaml");
    const chart = join(folder, "cmfs.svg");
    const io = captureIo();
    expect(await runCli(["evaluate", DEMO, "--emit-effects", effects, "--chart", chart], io)).toBe(0);
    expect(io.out).toContain("Before-after evaluation: Vellmar safety projects built in 2019");
    expect(io.out).toMatch(/cannot use Empirical Bayes \(no AADT for both periods\)/);
    expect(io.out).toMatch(/qualified safety analyst/);
    const local = readFileSync(effects, "utf8");
    expect(local).toMatch(/treatment: "retroreflective-backplates"\n {4}crashTypes: \[all\]\n {4}cmf: 0\.\d+\n {4}standardError: 0\.\d+/);
    // The cameras' catalogue effect covers injury crashes only (K, A, B, C): all crashes overlap it in part, so they are left out, with why.
    expect(local).toMatch(/# left out: speed-safety-cameras, total: its cells overlap, but do not equal, an effect of speed-safety-cameras/);
    expect(readFileSync(chart, "utf8").startsWith("<svg")).toBe(true);
    expect(io.err).toContain(`wrote ${effects}`);
    // The emitted file loads as a catalogue of the demo scenario; the demo's published backplates CMF states no standard error, so check shows both, unpooled, as documented.
    const scenario = join(folder, "with-local.yaml");
    writeFileSync(scenario, readFileSync("scenarios/demo.yaml", "utf8").replace("catalogues: [../catalogs/demo-catalogue.yaml]", `catalogues: [${JSON.stringify(join(process.cwd(), "catalogs/demo-catalogue.yaml"))}, ${JSON.stringify(effects)}]`));
    const check = captureIo();
    expect(await runCli(["check", scenario], check)).toBe(0);
    expect(check.out).toMatch(/retroreflective-backplates[^\n]*local 0\.\d+ \(SE 0\.\d+, averta evaluate: Empirical Bayes[^\n]*not pooled: the published CMF has no standard error/);
  });

  it("a project at an unknown site: exit 2, located, nothing written", async () => {
    const bad = join(folder, "bad.yaml");
    writeFileSync(bad, readFileSync(DEMO, "utf8").replace("catalogues: [../catalogs/demo-catalogue.yaml]", `catalogues: [${join(process.cwd(), "catalogs/demo-catalogue.yaml")}]`).replace("  - site: J-", "  - site: Q-"));
    const out = join(folder, "never.json");
    const io = captureIo();
    expect(await runCli(["evaluate", bad, "--format", "json", "--out", out], io)).toBe(2);
    expect(io.err).toMatch(/bad\.yaml:\d+:\d+/);
    expect(io.err).not.toMatch(/\n\s+at /);
    expect(existsSync(out)).toBe(false);
  });
});
