import { mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/runCli.js";
import { InputError } from "../../src/io/InputError.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import { captureIo } from "../cli/captureIo.js";

const scratch = mkdtempSync(join(tmpdir(), "averta-sites-file-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

// The demo split in two at its `sites:` key: the settings (without crashWindow) and the sites block.
const DEMO = readFileSync("scenarios/demo.yaml", "utf8").replace("../catalogs/demo-catalogue.yaml", resolve("catalogs/demo-catalogue.yaml"));
const AT_SITES = DEMO.indexOf("\nsites:\n") + 1;
const SETTINGS = DEMO.slice(0, AT_SITES).replace(/^crashWindow:.*\n/m, "");
const SITES_BLOCK = DEMO.slice(AT_SITES);
const WINDOW = "crashWindow: { firstYear: 2021, lastYear: 2025 }\n";

function write(name: string, text: string): string {
  const file = join(scratch, name);
  writeFileSync(file, text);
  return file;
}

function problemOf(file: string) {
  try {
    loadScenario(file);
  } catch (error) {
    if (error instanceof InputError) return error.problems[0]!;
    throw error;
  }
  throw new Error(`${file} loaded without error`);
}

/** 1-based line of the first line of `text` that contains `needle`. */
function lineOf(text: string, needle: string): number {
  return text.split("\n").findIndex((line) => line.includes(needle)) + 1;
}

describe("a scenario that keeps its sites in a separate file", () => {
  write("split-sites.yaml", WINDOW + SITES_BLOCK);
  const scenarioFile = write("split.yaml", `${SETTINGS}sites: split-sites.yaml\n`);

  it("loads the same scenario as the demo with its sites inline", () => {
    const inline = loadScenario(write("inline.yaml", DEMO)).scenario;
    const loaded = loadScenario(scenarioFile);
    expect(loaded.scenario).toEqual(inline);
    expect(loaded.sitesSource.file).toMatch(/split-sites\.yaml$/);
  });

  it("locates schema problems, reference problems and warnings in the sites file", () => {
    const kindTypo = (WINDOW + SITES_BLOCK).replace("kind: segment", "kind: segmnet");
    write("typo-sites.yaml", kindTypo);
    const typo = problemOf(write("typo.yaml", `${SETTINGS}sites: typo-sites.yaml\n`));
    expect(typo.code).toBe("schema");
    expect(typo.file).toMatch(/typo-sites\.yaml$/);
    expect(typo.line).toBe(lineOf(kindTypo, "kind: segmnet"));
    expect(typo.column).toBe(11);

    const unknown = (WINDOW + SITES_BLOCK).replace("raised-crosswalk]", "raised-crosswlk]");
    write("unknown-sites.yaml", unknown);
    const missing = problemOf(write("unknown.yaml", `${SETTINGS}sites: unknown-sites.yaml\n`));
    expect(missing.code).toBe("unknown-id");
    expect(missing.file).toMatch(/unknown-sites\.yaml$/);
    expect(missing.line).toBe(lineOf(unknown, "raised-crosswlk]"));
    expect(missing.hint).toContain("raised-crosswalk");

    const silent = (WINDOW + SITES_BLOCK).replace(/crashes:\n(\s+[a-z-]+: \{[^}]*\}\n)+/, "crashes: {}\n");
    write("silent-sites.yaml", silent);
    const { warnings } = loadScenario(write("silent.yaml", `${SETTINGS}sites: silent-sites.yaml\n`));
    const noCrashes = warnings.find((warning) => warning.code === "no-crashes")!;
    expect(noCrashes.file).toMatch(/silent-sites\.yaml$/);
    expect(noCrashes.line).toBe(lineOf(silent, "crashes: {}"));
  });

  it("takes the crash window from either file, and refuses two that differ", () => {
    const both = loadScenario(write("both.yaml", `${SETTINGS}${WINDOW}sites: split-sites.yaml\n`));
    expect(both.scenario.crashWindow).toEqual({ firstYear: 2021, lastYear: 2025 });
    write("no-window-sites.yaml", SITES_BLOCK);
    const fromScenario = loadScenario(write("window-here.yaml", `${SETTINGS}${WINDOW}sites: no-window-sites.yaml\n`));
    expect(fromScenario.scenario.crashWindow).toEqual({ firstYear: 2021, lastYear: 2025 });

    const differs = `${SETTINGS}crashWindow: { firstYear: 2022, lastYear: 2025 }\nsites: split-sites.yaml\n`;
    const mismatch = problemOf(write("differs.yaml", differs));
    expect(mismatch.code).toBe("window-mismatch");
    expect(mismatch.line).toBe(lineOf(differs, "crashWindow:"));
    expect(mismatch.message).toMatch(/split-sites\.yaml:1:14/);
    expect(mismatch.hint).toMatch(/--window 2022-2025/);

    const neither = problemOf(write("neither.yaml", `${SETTINGS}sites: no-window-sites.yaml\n`));
    expect(neither.file).toMatch(/no-window-sites\.yaml$/);
    expect(neither.message).toMatch(/no crashWindow/);
  });

  it("points a short-window warning at the file that gives the window", () => {
    write("short-sites.yaml", "crashWindow: { firstYear: 2024, lastYear: 2025 }\n" + SITES_BLOCK);
    const warning = loadScenario(write("short.yaml", `${SETTINGS}sites: short-sites.yaml\n`)).warnings.find((w) => w.code === "short-window")!;
    expect(warning.file).toMatch(/short-sites\.yaml$/);
    expect([warning.line, warning.column]).toEqual([1, 14]);
  });

  it("refuses a scenario that names itself as its sites file", () => {
    const self = problemOf(write("self.yaml", `${SETTINGS}sites: self.yaml\n`));
    expect(self.code).toBe("sites-self");
  });
});

describe("siteCandidates in the scenario", () => {
  it("replaces a site's own candidates, survives a tally rewrite of the sites file, and is located when wrong", async () => {
    const sitesFile = join(scratch, "tallied.yaml");
    const tally = (window: string) =>
      runCli(["tally", "--crashes", "scenarios/vellmar-crashes.csv", "--sites", "scenarios/vellmar-sites.geojson", "--window", window, "--out", sitesFile, "--force"], captureIo());
    expect(await tally("2021-2025")).toBe(0);
    const text = `${SETTINGS}sites: tallied.yaml\nsiteCandidates:\n  I-01: [raised-crosswalk]\n  I-02: []\n`;
    const scenarioFile = write("with-overrides.yaml", text);
    const before = loadScenario(scenarioFile).scenario;
    expect(before.sites.find((site) => site.id === "I-01")!.candidates).toEqual(["raised-crosswalk"]);
    expect(before.sites.find((site) => site.id === "I-02")!.candidates).toEqual([]);
    // Sites the scenario does not name keep the candidates of the sites file (here, from the GeoJSON).
    expect(before.sites.find((site) => site.id === "I-03")!.candidates).toEqual(["rapid-flashing-beacon", "pedestrian-hybrid-beacon", "intersection-lighting"]);

    // tally rewrites the sites file with another window; the scenario is untouched and still applies.
    expect(await tally("2023-2025")).toBe(0);
    expect(readFileSync(scenarioFile, "utf8")).toBe(text);
    const after = loadScenario(scenarioFile).scenario;
    expect(after.crashWindow).toEqual({ firstYear: 2023, lastYear: 2025 });
    expect(after.sites.find((site) => site.id === "I-01")!.candidates).toEqual(["raised-crosswalk"]);
    const total = (scenario: typeof before) => scenario.sites.reduce((sum, site) => sum + Object.values(site.crashes).reduce((s, row) => s + Object.values(row).reduce((a, b) => a + b, 0), 0), 0);
    expect(total(after)).toBeLessThan(total(before));

    const wrongKind = `${SETTINGS}sites: tallied.yaml\nsiteCandidates:\n  I-01: [curve-chevrons]\n`;
    const problem = problemOf(write("wrong-kind.yaml", wrongKind));
    expect(problem.code).toBe("not-applicable");
    expect(problem.file).toMatch(/wrong-kind\.yaml$/);
    expect(problem.line).toBe(lineOf(wrongKind, "I-01: [curve-chevrons]"));
    expect(problem.path).toBe("siteCandidates.I-01[0]");
  });

  it("does not treat inherited object keys as site ids", () => {
    const text = `${SETTINGS}siteCandidates:\n  constructor: [raised-crosswalk]\n${WINDOW}${SITES_BLOCK}`;
    const problem = problemOf(write("constructor.yaml", text));
    expect(problem.code).toBe("unknown-id");
    expect(problem.path).toBe("siteCandidates.constructor");
  });
});

describe("sites without candidate treatments", () => {
  // I-01 lists none; I-02 leaves the key out.
  const text = DEMO.replace("candidates: [leading-pedestrian-interval, retroreflective-backplates, raised-crosswalk]", "candidates: []").replace(
    "    candidates: [rapid-flashing-beacon, pedestrian-refuge-island, raised-crosswalk]\n",
    "",
  );
  const file = write("no-candidates.yaml", text);

  it("load, with a located note for each and no error or warning about it", () => {
    const loaded = loadScenario(file);
    expect(loaded.scenario.sites.filter((site) => site.candidates.length === 0).map((site) => site.id)).toEqual(["I-01", "I-02"]);
    expect(loaded.notes.map((note) => [note.code, note.path, note.line])).toEqual([
      ["no-candidates", "sites[0].candidates", lineOf(text, "candidates: []")],
      ["no-candidates", "sites[1].candidates", lineOf(text, "- id: I-02")], // no key: the site itself
    ]);
    expect(loaded.warnings.some((warning) => /I-0[12]'/.test(warning.message))).toBe(false);
  });

});
