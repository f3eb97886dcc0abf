import { mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { preparePlan } from "../../src/analysis/preparePlan.js";
import { buildDrawTables } from "../../src/analysis/uncertainty/drawTables.js";
import { InputError } from "../../src/io/InputError.js";
import { loadScenario, type LoadedScenario } from "../../src/io/loadScenario.js";
import { treatmentCmf } from "../../src/model/treatmentCmf.js";
import type { Effect } from "../../src/model/types.js";

const FOLDER = "test/fixtures/local-evidence";
const SCENARIO = `${FOLDER}/scenario.yaml`;
const DEMO = resolve("catalogs/demo-catalogue.yaml");
const temp = mkdtempSync(join(tmpdir(), "averta-local-evidence-"));

/** The fixture scenario with the demo catalogue followed by other evidence files (absolute paths, so it may sit in a temp folder). */
function scenarioWith(name: string, evidence: readonly string[]): string {
  const listed = [DEMO, ...evidence.map((file) => resolve(FOLDER, file))].map((path) => JSON.stringify(path)).join(", ");
  const text = readFileSync(SCENARIO, "utf8").replace("[../../../catalogs/demo-catalogue.yaml, evidence-pooled.yaml]", `[${listed}]`);
  if (text === readFileSync(SCENARIO, "utf8")) throw new Error("the fixture's catalogues line changed");
  const file = join(temp, `${name}.yaml`);
  writeFileSync(file, text);
  return file;
}

const effectOf = (loaded: LoadedScenario, treatment: string, crashType: string): Effect =>
  loaded.scenario.catalogue.treatments.find((t) => t.id === treatment)!.effects.find((e) => e.crashTypes.length === 1 && e.crashTypes[0] === crashType)!;

function inputError(run: () => unknown): InputError {
  try {
    run();
  } catch (error) {
    if (error instanceof InputError) return error;
    throw error;
  }
  throw new Error("expected an InputError");
}

// Published values: catalogs/demo-catalogue.yaml, traffic-signal-installation, angle crashes:
// CMF 0.33, SE 0.06 (its source: HSM 2010 Part D ch. 14, from memory). Local values: the fixture files.
// Pooling: fixed-effect inverse-variance weighting of ln CMF (common practice), worked by hand and
// checked to 30 digits with mpmath.
describe("local CMF evidence in a scenario's catalogues", () => {
  it("pools a local estimate with the published effect on the same cells, keeping both inputs", () => {
    const loaded = loadScenario(SCENARIO);
    const angle = effectOf(loaded, "traffic-signal-installation", "angle");
    // w = (0.33 / 0.06)² = 5.5² = 30.25 and (0.45 / 0.09)² = 5² = 25; Σ w = 55.25.
    // ln C = (30.25 × ln 0.33 + 25 × ln 0.45) / 55.25 = (30.25 × −1.108662624521 + 25 × −0.798507696218) / 55.25 = −0.968321028004.
    // C = exp(−0.968321028004) = 0.379720; SE = C / sqrt(55.25) = 0.379720 × 0.134534558799 = 0.051085.
    expect(angle.cmf).toBeCloseTo(0.37972, 6);
    expect(angle.standardError!).toBeCloseTo(0.051085, 6);
    expect(angle.evidence?.rule).toBe("inverse-variance");
    expect(angle.evidence?.published).toMatchObject({ cmf: 0.33, standardError: 0.06 });
    expect(angle.evidence?.published?.source).toMatch(/^Highway Safety Manual/);
    expect(angle.evidence?.local).toEqual([{ cmf: 0.45, standardError: 0.09, source: expect.stringMatching(/^averta evaluate: Empirical Bayes before-after, 5 sites/) }]);
    expect(angle.source).toMatch(/^pooled by inverse-variance weighting of ln CMF: published 0\.33 \(SE 0\.06, Highway Safety Manual .*\) and local 0\.45 \(SE 0\.09, averta evaluate: /);
    // The other effect and the published catalogue as loaded are untouched.
    expect(effectOf(loaded, "traffic-signal-installation", "rear-end")).toMatchObject({ cmf: 2.43, standardError: 0.4 });
    expect(loaded.catalogues[0]!.catalogue.treatments.find((t) => t.id === "traffic-signal-installation")!.effects[0]!.cmf).toBe(0.33);
    expect(loaded.warnings.filter((w) => w.code.startsWith("local-evidence"))).toEqual([]);
  });

  it("pools several local files on the same cells together with the published effect", () => {
    const loaded = loadScenario(scenarioWith("two-local", ["evidence-pooled.yaml", "evidence-second.yaml"]));
    const angle = effectOf(loaded, "traffic-signal-installation", "angle");
    // Adds 0.40 (SE 0.08, w = 5² = 25): Σ w = 80.25; ln C = (30.25 × −1.108662624521 + 25 × −0.798507696218 + 25 × −0.916290731874) / 80.25
    // = −0.952112213010; C = 0.385925; SE = C / sqrt(80.25) = 0.043080.
    expect(angle.cmf).toBeCloseTo(0.385925, 6);
    expect(angle.standardError!).toBeCloseTo(0.04308, 6);
    expect(angle.evidence?.local.map((local) => local.cmf)).toEqual([0.45, 0.4]);
  });

  it("keeps a published CMF without a standard error, and warns at the local entry", () => {
    const loaded = loadScenario(scenarioWith("unpooled", ["evidence-unpooled.yaml"]));
    const pedestrian = effectOf(loaded, "leading-pedestrian-interval", "pedestrian");
    // catalogs/demo-catalogue.yaml: leading-pedestrian-interval, pedestrian crashes, CMF 0.87, no standard error.
    expect(pedestrian.cmf).toBe(0.87);
    expect(pedestrian.standardError).toBeUndefined();
    expect(pedestrian.evidence?.rule).toBe("published-only (no standard error)");
    const warning = loaded.warnings.find((w) => w.code === "local-evidence-unpooled")!;
    // Line and column read off evidence-unpooled.yaml by hand: the entry's "- treatment" on line 6, its mapping at column 5.
    expect(warning).toMatchObject({ file: `${FOLDER}/evidence-unpooled.yaml`, line: 6, column: 5, path: "localEvidence[0]" });
    expect(warning.hint).toMatch(/add the published standardError/);
  });

  it("adds local evidence on cells no effect covers as a new effect of the treatment", () => {
    const loaded = loadScenario(scenarioWith("new-effect", ["evidence-new-effect.yaml"]));
    const signal = loaded.scenario.catalogue.treatments.find((t) => t.id === "traffic-signal-installation")!;
    expect(signal.effects).toHaveLength(3);
    expect(effectOf(loaded, "traffic-signal-installation", "pedestrian")).toMatchObject({ cmf: 0.8, standardError: 0.1, evidence: { rule: "local-only" } });
    expect(treatmentCmf(signal, "pedestrian", "A")).toBe(0.8);
    expect(treatmentCmf(signal, "angle", "A")).toBe(0.33);
  });

  it("pools evidence written in the same catalogue as its treatment, whatever the order of the severities", () => {
    const loaded = loadScenario(scenarioWith("with-treatments", ["evidence-with-treatments.yaml"]));
    const daylighting = effectOf(loaded, "corner-daylighting", "pedestrian");
    // Published 0.7 (SE 0.14, w = 5² = 25) and local 0.5 (SE 0.05, w = 10² = 100): Σ w = 125;
    // ln C = (25 × −0.356674943939 + 100 × −0.693147180560) / 125 = −0.625852733236; C = 0.534805; SE = C / sqrt(125) = 0.047834.
    expect(daylighting.cmf).toBeCloseTo(0.534805, 6);
    expect(daylighting.standardError!).toBeCloseTo(0.047834, 6);
  });

  it("feeds the pooled standard error to the uncertainty draws", () => {
    const prepared = preparePlan(loadScenario(SCENARIO).scenario);
    const tables = buildDrawTables(prepared, false);
    const effects = prepared.scenario.catalogue.treatments.flatMap((t) => t.effects);
    const index = effects.findIndex((effect) => effect.evidence?.rule === "inverse-variance");
    const drawn = Array.from(tables.drawnEffects).indexOf(index);
    expect(drawn).toBeGreaterThanOrEqual(0);
    // SE / CMF of the pool is SE(ln C) = 1 / sqrt(55.25), so the lognormal's sigma² = ln(1 + 1 / 55.25) (sampleTreatmentCmfs' rule).
    expect(tables.lognormals[drawn]!.sigma).toBeCloseTo(Math.sqrt(Math.log(1 + 1 / 55.25)), 12);
  });
});

// Lines and columns read off each fixture by hand (1-based; the schema comment is line 1).
describe("bad local evidence is a located error", () => {
  it("evidence covering an effect's cells only in part", () => {
    const error = inputError(() => loadScenario(scenarioWith("partial", ["evidence-partial.yaml"])));
    // "    crashTypes: [angle, rear-end]" is line 6; its value starts at column 17.
    expect(error.problems[0]).toMatchObject({ code: "local-evidence-overlap", file: `${FOLDER}/evidence-partial.yaml`, line: 6, column: 17, path: "localEvidence[0].crashTypes" });
    expect(error.problems[0]!.hint).toMatch(/evaluate the same crash group as the published effect \(angle crashes, all severities\)/);
  });

  it("two new local entries that overlap each other in part", () => {
    const error = inputError(() => loadScenario(scenarioWith("new-overlap", ["evidence-new-overlap.yaml"])));
    // The second entry's "    crashTypes: [pedestrian, bicycle]" is line 11; its value starts at column 17.
    expect(error.problems[0]).toMatchObject({ code: "local-evidence-overlap", line: 11, column: 17, path: "localEvidence[1].crashTypes" });
    expect(error.problems[0]!.message).toContain(`${FOLDER}/evidence-new-overlap.yaml localEvidence[0]`);
  });

  it("evidence for an unknown treatment, with the likely name", () => {
    const error = inputError(() => loadScenario(scenarioWith("unknown", ["evidence-unknown.yaml"])));
    // "  - treatment: trafic-signal-installation" is line 5; the value starts at column 16.
    expect(error.problems[0]).toMatchObject({ code: "unknown-id", file: `${FOLDER}/evidence-unknown.yaml`, line: 5, column: 16, path: "localEvidence[0].treatment" });
    expect(error.problems[0]!.hint).toBe("did you mean 'traffic-signal-installation'?");
  });

  it("the same estimate listed twice", () => {
    const error = inputError(() => loadScenario(scenarioWith("repeated", ["evidence-repeated.yaml"])));
    // The second entry's "- treatment" is line 10; its mapping starts at column 5.
    expect(error.problems[0]).toMatchObject({ code: "local-evidence-repeated", line: 10, column: 5, path: "localEvidence[1]" });
  });

  it("a catalogue with neither treatments nor localEvidence", () => {
    const error = inputError(() => loadScenario(scenarioWith("empty", ["evidence-empty.yaml"])));
    expect(error.problems[0]).toMatchObject({ code: "schema", file: `${FOLDER}/evidence-empty.yaml`, path: "(top level)" });
    expect(error.problems[0]!.message).toBe("a catalogue needs treatments, localEvidence or both");
  });
});
