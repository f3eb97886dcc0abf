import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { runCaptured } from "./captureIo.js";

const FOLDER = "test/fixtures/local-evidence";
const SCENARIO = `${FOLDER}/scenario.yaml`;
const temp = mkdtempSync(join(tmpdir(), "averta-local-evidence-cli-"));

/** The fixture scenario listing the demo catalogue and then `evidence` (none: the published CMFs alone). */
function scenarioWith(name: string, evidence: readonly string[]): string {
  const listed = [resolve("catalogs/demo-catalogue.yaml"), ...evidence.map((file) => resolve(FOLDER, file))].map((path) => JSON.stringify(path)).join(", ");
  const file = join(temp, `${name}.yaml`);
  writeFileSync(file, readFileSync(SCENARIO, "utf8").replace("[../../../catalogs/demo-catalogue.yaml, evidence-pooled.yaml]", `[${listed}]`));
  return file;
}

interface PlannedProject {
  readonly site: string;
  readonly treatments: readonly string[];
  readonly ksiAvoided: number;
}

// Pooled angle CMF of traffic-signal-installation: published 0.33 (SE 0.06, catalogs/demo-catalogue.yaml)
// with local 0.45 (SE 0.09, evidence-pooled.yaml) by inverse-variance weighting of ln CMF = 0.379720042515
// (worked by hand, checked with mpmath; see test/io/localEvidence.test.ts).
const POOLED_ANGLE_CMF = 0.379720042515;

describe("local evidence in the commands' output", () => {
  it("check lists the pooled effect with both inputs and the result", async () => {
    const { code, stdout } = await runCaptured(["check", SCENARIO]);
    expect(code).toBe(0);
    expect(stdout).toContain("  local evidence 1 effect(s) with a local CMF:\n");
    expect(stdout).toMatch(
      /\n {4}- traffic-signal-installation on angle crashes, all severities: CMF 0\.380 \(SE 0\.051\), pooled by inverse-variance weighting of ln CMF: published 0\.33 \(SE 0\.06, Highway Safety Manual [^\n]*\) and local 0\.45 \(SE 0\.09, averta evaluate: Empirical Bayes before-after, 5 sites[^\n]*\)\n/,
    );
  });

  it("check warns, at the local entry, when the published CMF has no standard error to pool with", async () => {
    const { code, stdout, stderr } = await runCaptured(["check", scenarioWith("unpooled", ["evidence-unpooled.yaml"])]);
    expect(code).toBe(0);
    expect(stdout).toMatch(/leading-pedestrian-interval on pedestrian crashes, all severities: CMF 0\.870 \(no standard error\), published 0\.87 \(no standard error, FHWA/);
    expect(stderr).toContain(`warning: ${FOLDER}/evidence-unpooled.yaml:6:5: localEvidence[0]: the published CMF 0.87`);
  });

  it("plan uses the pooled CMF: fewer K+A crashes avoided at the signal site, by (1 − pooled) ÷ (1 − published), and says so", async () => {
    const pooledRun = await runCaptured(["plan", SCENARIO, "--format", "json"]);
    const publishedRun = await runCaptured(["plan", scenarioWith("published", []), "--format", "json"]);
    expect([pooledRun.code, publishedRun.code]).toEqual([0, 0]);
    const pooled = JSON.parse(pooledRun.stdout);
    const published = JSON.parse(publishedRun.stdout);
    const signal = (plan: { selected: PlannedProject[] }) => plan.selected.find((project) => project.site === "V-01" && project.treatments.includes("traffic-signal-installation"))!;
    // V-01's K+A crashes are all angle crashes, so its K+A crashes avoided are baseline × (1 − angle CMF)
    // over the service life (crashes avoided = expected crashes × (1 − CMF), common practice).
    expect(signal(pooled).ksiAvoided).toBeLessThan(signal(published).ksiAvoided);
    expect(signal(pooled).ksiAvoided / signal(published).ksiAvoided).toBeCloseTo((1 - POOLED_ANGLE_CMF) / (1 - 0.33), 9);
    expect(pooled.assumptions.localEvidence).toEqual([expect.stringMatching(/^traffic-signal-installation on angle crashes, all severities: CMF 0\.380 \(SE 0\.051\), pooled by inverse-variance/)]);
    expect(pooled.method.notes).toContainEqual(expect.stringMatching(/^Local evidence \(funded at V-01\): traffic-signal-installation on angle crashes/));
    expect(published.assumptions.localEvidence).toBeUndefined();
  });

  it("bad local evidence exits 2 with the located problem and writes nothing to stdout", async () => {
    const { code, stdout, stderr } = await runCaptured(["plan", scenarioWith("partial", ["evidence-partial.yaml"]), "--format", "json"]);
    expect(code).toBe(2);
    expect(stdout).toBe("");
    expect(stderr).toContain(`error: ${FOLDER}/evidence-partial.yaml:6:17: localEvidence[0].crashTypes:`);
    expect(stderr).not.toMatch(/\n\s+at /);
  });
});
