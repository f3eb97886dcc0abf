import { existsSync, mkdtempSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { runCli } from "../../src/cli/runCli.js";
import { InputError } from "../../src/io/InputError.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import { captureIo } from "../cli/captureIo.js";

const FOLDER = "test/fixtures/bad";

/**
 * Every command that reads a scenario, as the arguments it is run with on a bad file.
 * A new command joins the corpus with one line here.
 */
const COMMANDS: readonly { readonly name: string; readonly argv: (file: string, out: string) => string[] }[] = [
  { name: "check", argv: (file) => ["check", file] },
  { name: "plan", argv: (file, out) => ["plan", file, "--out", out] },
  { name: "frontier", argv: (file, out) => ["frontier", file, "--steps", "2", "--out", out] },
  { name: "compare", argv: (file, out) => ["compare", file, "--budget", "1M", "--budget", "2M", "--out", out] },
  { name: "uncertainty", argv: (file, out) => ["uncertainty", file, "--draws", "2", "--threads", "1", "--out", out] },
  { name: "report", argv: (file, out) => ["report", file, "--steps", "2", "--out", out] },
  { name: "screen", argv: (file, out) => ["screen", file, "--out", out] },
];

interface Case {
  /** Fixture name without .yaml; `catalogue-x` scenarios point to catalogues/x.yaml. */
  readonly name: string;
  readonly code: string;
  readonly line: number;
  readonly column: number;
  /** Field path, where the problem sits in one field. */
  readonly path?: string;
  /** True when the problem is in the catalogue the scenario names, not in the scenario. */
  readonly inCatalogue?: boolean;
  /** True when the problem is in the sites file (`sites-file-x` scenarios name sites/x.yaml). */
  readonly inSitesFile?: boolean;
}

// Lines and columns were read off each fixture by hand (1-based; a header comment is line 1).
// The YAML parser reports some syntax errors where it notices them, noted beside those cases.
const CASES: readonly Case[] = [
  // YAML itself
  { name: "yaml-unclosed-flow", code: "yaml-syntax", line: 7, column: 1 }, // the unclosed { on line 6 is noticed at the next key
  { name: "yaml-bad-indent", code: "yaml-syntax", line: 8, column: 17 }, // a deeper next line turns "0.04" into a multi-line key
  { name: "yaml-tab-indent", code: "yaml-syntax", line: 14, column: 1 },
  { name: "yaml-duplicate-key", code: "duplicate-key", line: 6, column: 1 },
  { name: "yaml-two-documents", code: "yaml-syntax", line: 27, column: 1 },
  { name: "yaml-not-a-mapping", code: "schema", line: 2, column: 1, path: "(top level)" },
  { name: "yaml-empty-file", code: "schema", line: 1, column: 1, path: "(top level)" },
  { name: "yaml-alias-bomb", code: "yaml-aliases", line: 5, column: 10 }, // the first alias, *a
  { name: "yaml-deep-nesting", code: "too-deep", line: 3, column: 113 }, // the 100th '['
  { name: "not-utf8", code: "not-utf8", line: 20, column: 25 }, // the Latin-1 byte of "Straße"
  // wrong types, missing and unknown fields
  { name: "type-horizon-text", code: "schema", line: 9, column: 17, path: "economics.horizonYears" },
  { name: "type-sites-mapping", code: "schema", line: 12, column: 3, path: "sites" },
  { name: "type-candidates-scalar", code: "schema", line: 26, column: 17, path: "sites[1].candidates" },
  { name: "missing-currency", code: "schema", line: 2, column: 1, path: "(top level)" },
  { name: "missing-site-name", code: "schema", line: 19, column: 5, path: "sites[1]" },
  { name: "unknown-field-top", code: "schema", line: 5, column: 1, path: "descripton" },
  { name: "unknown-field-site", code: "schema", line: 23, column: 5, path: "sites[1].lenghtKm" },
  { name: "objective-typo", code: "schema", line: 11, column: 12, path: "objective" },
  { name: "kind-typo", code: "schema", line: 14, column: 11, path: "sites[0].kind" },
  { name: "currency-lowercase", code: "schema", line: 4, column: 11, path: "currency" },
  { name: "candidates-repeated", code: "schema", line: 26, column: 18, path: "sites[1].candidates[0]" },
  // ids
  { name: "unknown-treatment", code: "unknown-id", line: 18, column: 47, path: "sites[0].candidates[1]" },
  { name: "unknown-site-in-rule", code: "unknown-id", line: 13, column: 13, path: "rules.mustFund[0].site" },
  { name: "unknown-district-in-rule", code: "unknown-id", line: 13, column: 17, path: "rules.maxProjects[0].district" },
  { name: "must-fund-not-candidate", code: "unknown-id", line: 14, column: 20, path: "rules.mustFund[0].treatments[0]" },
  { name: "duplicate-site-id", code: "duplicate-id", line: 19, column: 9, path: "sites[1].id" },
  { name: "not-applicable", code: "not-applicable", line: 18, column: 47, path: "sites[0].candidates[1]" },
  { name: "missing-length", code: "missing-length", line: 19, column: 5, path: "sites[1]" },
  { name: "area-not-applicable", code: "not-applicable", line: 20, column: 34, path: "sites[0].candidates[1]" },
  { name: "calibration-unknown-spf", code: "unknown-id", line: 12, column: 3, path: "calibration.urban-4sg-intersecton" },
  // method options
  { name: "ksi-costing-both", code: "rule-conflict", line: 11, column: 15, path: "economics.ksiCosting" },
  { name: "escalation-no-price-year", code: "missing-price-year", line: 18, column: 17, path: "economics.crashCosts.escalation" },
  { name: "cmf-combination-typo", code: "schema", line: 11, column: 25, path: "cmfCombination.rule" },
  // numbers
  { name: "negative-budget", code: "schema", line: 5, column: 9, path: "budget" },
  { name: "negative-count", code: "schema", line: 17, column: 24, path: "sites[0].crashes.pedestrian.A" },
  { name: "negative-crash-cost", code: "schema", line: 10, column: 55, path: "economics.crashCosts.C" },
  { name: "negative-cost-override", code: "schema", line: 27, column: 38, path: "sites[1].costOverrides.curve-chevrons" },
  { name: "budget-infinite", code: "schema", line: 5, column: 9, path: "budget" },
  { name: "discount-nan", code: "schema", line: 8, column: 17, path: "economics.discountRate" },
  { name: "length-infinite", code: "schema", line: 23, column: 15, path: "sites[1].lengthKm" },
  { name: "discount-percent", code: "schema", line: 8, column: 17, path: "economics.discountRate" },
  { name: "discount-negative", code: "schema", line: 8, column: 17, path: "economics.discountRate" },
  { name: "window-reversed", code: "window-reversed", line: 6, column: 14, path: "crashWindow" },
  { name: "count-fraction", code: "schema", line: 17, column: 24, path: "sites[0].crashes.pedestrian.A" },
  { name: "budget-words", code: "schema", line: 5, column: 9, path: "budget" },
  { name: "budget-unit-word", code: "schema", line: 5, column: 9, path: "budget" },
  { name: "budget-decimal-comma", code: "schema", line: 5, column: 9, path: "budget" },
  { name: "budget-hex", code: "not-decimal", line: 5, column: 9 }, // YAML would read 0x7A120 as 500000
  { name: "max-treatments-zero", code: "schema", line: 11, column: 23, path: "maxTreatmentsPerSite" },
  { name: "share-above-one", code: "schema", line: 14, column: 14, path: "rules.spendCaps[0].share" },
  { name: "spend-rule-both", code: "rule-amount", line: 13, column: 7, path: "rules.spendCaps[0]" },
  { name: "spend-share-whole-programme", code: "schema", line: 13, column: 7, path: "rules.spendCaps[0]" },
  { name: "ksi-share-no-scope", code: "schema", line: 13, column: 7, path: "rules.ksiShareFloors[0]" },
  { name: "assumed-cv-percent", code: "schema", line: 11, column: 30, path: "uncertainty.assumedCmfCv" },
  { name: "assumed-cv-word", code: "schema", line: 12, column: 17, path: "uncertainty.assumedCmfCv" },
  // sites
  { name: "too-many-alternatives", code: "too-many-alternatives", line: 26, column: 17, path: "sites[1].candidates" },
  { name: "sites-empty", code: "schema", line: 11, column: 8, path: "sites" },
  { name: "sites-null", code: "schema", line: 11, column: 7, path: "sites" },
  // a sites file the scenario names (sites: <file>), and siteCandidates
  { name: "sites-file-missing", code: "missing-file", line: 10, column: 8, path: "sites" },
  { name: "sites-file-escapes", code: "sites-outside", line: 10, column: 8, path: "sites" },
  { name: "sites-file-window-mismatch", code: "window-mismatch", line: 6, column: 14, path: "crashWindow" },
  { name: "sites-file-kind-typo", code: "schema", line: 13, column: 11, path: "sites[1].kind", inSitesFile: true },
  { name: "sites-file-unknown-treatment", code: "unknown-id", line: 18, column: 18, path: "sites[1].candidates[0]", inSitesFile: true },
  { name: "site-candidates-unknown-site", code: "unknown-id", line: 13, column: 3, path: "siteCandidates.I-10" },
  { name: "site-candidates-unknown-treatment", code: "unknown-id", line: 12, column: 28, path: "siteCandidates.I-01[1]" },
  // catalogue paths (see the policy in allowedInputPath.ts)
  { name: "catalogue-missing", code: "missing-file", line: 3, column: 14, path: "catalogues[0]" },
  { name: "catalogue-escapes", code: "catalogue-outside", line: 3, column: 14, path: "catalogues[0]" },
  { name: "catalogue-escapes-far", code: "catalogue-outside", line: 3, column: 14, path: "catalogues[0]" },
  { name: "catalogue-is-folder", code: "not-a-file", line: 3, column: 14, path: "catalogues[0]" },
  { name: "catalogue-listed-twice", code: "duplicate-id", line: 3, column: 53, path: "catalogues[1]" },
  // problems inside a catalogue
  { name: "catalogue-yaml-syntax", code: "yaml-syntax", line: 6, column: 5, inCatalogue: true }, // the unclosed [ on line 5 is noticed on line 6
  { name: "catalogue-cmf-zero", code: "schema", line: 10, column: 14, path: "treatments[0].effects[0].cmf", inCatalogue: true },
  { name: "catalogue-cmf-negative", code: "schema", line: 10, column: 14, path: "treatments[0].effects[0].cmf", inCatalogue: true },
  { name: "catalogue-cmf-huge", code: "schema", line: 10, column: 14, path: "treatments[0].effects[0].cmf", inCatalogue: true },
  { name: "catalogue-cmf-nan", code: "schema", line: 10, column: 14, path: "treatments[0].effects[0].cmf", inCatalogue: true },
  { name: "catalogue-service-life-zero", code: "schema", line: 7, column: 23, path: "treatments[0].serviceLifeYears", inCatalogue: true },
  { name: "catalogue-cost-negative", code: "schema", line: 6, column: 22, path: "treatments[0].cost.perSite", inCatalogue: true },
  { name: "catalogue-cost-infinite", code: "schema", line: 6, column: 22, path: "treatments[0].cost.perSite", inCatalogue: true },
  { name: "catalogue-cost-both-bases", code: "schema", line: 6, column: 11, path: "treatments[0].cost", inCatalogue: true },
  { name: "catalogue-per-km-intersection", code: "cost-basis", line: 6, column: 11, path: "treatments[0].cost", inCatalogue: true },
  { name: "catalogue-duplicate-treatment", code: "duplicate-id", line: 13, column: 9, path: "treatments[1].id", inCatalogue: true },
  { name: "catalogue-missing-effects", code: "schema", line: 3, column: 5, path: "treatments[0]", inCatalogue: true },
  { name: "catalogue-unknown-field", code: "schema", line: 8, column: 5, path: "treatments[0].costSorce", inCatalogue: true },
  { name: "catalogue-applies-to-typo", code: "schema", line: 5, column: 31, path: "treatments[0].appliesTo[1]", inCatalogue: true },
  { name: "catalogue-overlapping-effects", code: "overlapping-effects", line: 13, column: 9, path: "treatments[0].effects[1]", inCatalogue: true },
];

/** The file a case's first problem must name. */
function fileOf(c: Case): string {
  if (c.inSitesFile) return `${FOLDER}/sites/${c.name.replace(/^sites-file-/, "")}.yaml`;
  return c.inCatalogue ? `${FOLDER}/catalogues/${c.name.replace(/^catalogue-/, "")}.yaml` : `${FOLDER}/${c.name}.yaml`;
}

function firstProblem(file: string) {
  try {
    loadScenario(file);
  } catch (error) {
    if (error instanceof InputError) return error.problems[0]!;
    throw error;
  }
  throw new Error(`${file} loaded without error`);
}

const scratch = mkdtempSync(join(tmpdir(), "averta-bad-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

describe("bad-input corpus", () => {
  it("lists every fixture exactly once, and has at least 40", () => {
    const scenarios = readdirSync(FOLDER).filter((name) => name.endsWith(".yaml")).map((name) => name.replace(/\.yaml$/, ""));
    expect(CASES.map((c) => c.name).sort()).toEqual(scenarios.sort());
    const catalogues = readdirSync(`${FOLDER}/catalogues`).map((name) => `catalogue-${name.replace(/\.yaml$/, "")}`);
    const catalogueCases = CASES.filter((c) => c.inCatalogue).map((c) => c.name);
    expect(catalogueCases.sort()).toEqual(catalogues.sort());
    expect(scenarios.length + catalogues.length).toBeGreaterThanOrEqual(40);
  });

  for (const c of CASES) {
    it(`${c.name}: the loader reports ${c.code} at line ${c.line}`, () => {
      const problem = firstProblem(`${FOLDER}/${c.name}.yaml`);
      expect(problem.code).toBe(c.code);
      expect(problem.file).toBe(fileOf(c));
      expect(problem.line).toBe(c.line);
      expect(problem.column).toBe(c.column);
      if (c.path !== undefined) expect(problem.path).toBe(c.path);
      expect(problem.hint ?? "").not.toBe("");
    });

    for (const command of COMMANDS) {
      it(`${c.name}: '${command.name}' exits 2 with a located message and writes nothing`, async () => {
        const out = join(scratch, `${c.name}.${command.name}.out`);
        const io = captureIo();
        const code = await runCli(command.argv(`${FOLDER}/${c.name}.yaml`, out), io);
        expect(code).toBe(2);
        expect(io.out).toBe("");
        const first = io.err.split("\n")[0]!;
        const where = `${fileOf(c)}:${c.line}:${c.column}:`;
        expect(first.startsWith(`error: ${where}`), first).toBe(true);
        if (c.path !== undefined) expect(first).toContain(` ${c.path}: `);
        expect(first).toMatch(/ \(.+\)$/); // every message ends with a hint in brackets
        expect(io.err).not.toMatch(/^\s+at /m);
        expect(existsSync(out)).toBe(false);
        expect(readdirSync(scratch).filter((name) => name.startsWith(`${c.name}.`) || name.startsWith(`.${c.name}.`))).toEqual([]);
      });
    }
  }
});

// The foundation issue asks for one test per kind of error; these name the fixture that covers each.
describe("one fixture per kind of error", () => {
  const kinds: readonly [string, string, string, number][] = [
    ["YAML syntax", "yaml-unclosed-flow", "yaml-syntax", 7],
    ["schema violation", "unknown-field-top", "schema", 5],
    ["unknown id", "unknown-treatment", "unknown-id", 18],
    ["duplicate id", "duplicate-site-id", "duplicate-id", 19],
    ["negative cost", "catalogue-cost-negative", "schema", 6],
    ["CMF <= 0", "catalogue-cmf-zero", "schema", 10],
    ["empty sites", "sites-empty", "schema", 11],
    ["missing catalogue file", "catalogue-missing", "missing-file", 3],
  ];
  for (const [kind, name, code, line] of kinds) {
    it(`${kind}: ${name} gives ${code} at line ${line}`, () => {
      const problem = firstProblem(`${FOLDER}/${name}.yaml`);
      expect(problem.code).toBe(code);
      expect(problem.line).toBe(line);
    });
  }
});
