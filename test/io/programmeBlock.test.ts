import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, describe, expect, it } from "vitest";
import { formatProblem, InputError, type InputProblem } from "../../src/io/InputError.js";
import { loadScenario } from "../../src/io/loadScenario.js";

const scratch = mkdtempSync(join(tmpdir(), "averta-programme-block-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const PROGRAMME = "programme:\n  firstYear: 2027\n  years: 3\n  budgets: [100k, 200k, 300k]\n";
const COMMIT = (entry: string) => `${PROGRAMME}  committed:\n    - ${entry}\n`;

/** A valid three-year programme on two sites of the demo catalogue; each case edits one part. */
function scenarioText(parts: { money?: string; rules?: string; i01?: string; s01?: string; catalogue?: string; horizon?: number } = {}): string {
  return `name: Programme block
catalogues: [${parts.catalogue ?? resolve("catalogs/demo-catalogue.yaml")}]
currency: USD
${parts.money ?? PROGRAMME}crashWindow: { firstYear: 2021, lastYear: 2025 }
economics:
  discountRate: 0.04
  horizonYears: ${parts.horizon ?? 20}
  renewal: renew
  crashCosts: { K: 11295400, A: 655000, B: 198500, C: 125600, O: 11900, source: test values }
baseline: observed
${parts.rules ?? ""}sites:
  - id: I-01
    name: Alder Street / Brook Road
    kind: intersection
    district: North
    crashes:
      pedestrian: { K: 1, A: 4, B: 3 }
    candidates: [leading-pedestrian-interval, raised-crosswalk]
${parts.i01 ?? ""}  - id: S-01
    name: Quay Road
    kind: segment
    district: South
${parts.s01 ?? "    lengthKm: 1.2\n"}    crashes:
      run-off-road: { K: 1, A: 3, C: 3 }
    candidates: [curve-chevrons]
`;
}

let written = 0;
function write(text: string, name = `case-${(written += 1)}.yaml`): string {
  const file = join(scratch, name);
  writeFileSync(file, text);
  return file;
}

function problemsOf(file: string): readonly InputProblem[] {
  try {
    loadScenario(file);
  } catch (error) {
    if (error instanceof InputError) return error.problems;
    throw error;
  }
  throw new Error(`${file} loaded without error`);
}

/** 1-based number of the one line of `text` that contains `needle`. */
function lineOf(text: string, needle: string): number {
  const lines = text.split("\n").map((line, index) => [line, index + 1] as const).filter(([line]) => line.includes(needle));
  expect(lines, `'${needle}' once in the file`).toHaveLength(1);
  return lines[0]![1];
}

interface Case {
  readonly name: string;
  readonly text: string;
  readonly code: string;
  /** Field path; "" for the top level. */
  readonly path: string;
  /** Text of the line the problem points at (line 1 when absent). */
  readonly at?: string;
  readonly what: RegExp;
  readonly fix: RegExp;
}

const YEAR_RULE = (list: string, rule: string) => `rules:\n  ${list}:\n    - ${rule}\n`;
const ONE_YEAR = "budget: 300k\n";

const CASES: readonly Case[] = [
  // the budget: one of budget or programme, and the programme's own fields
  { name: "budget and programme both", text: scenarioText({ money: `budget: 1M\n${PROGRAMME}` }), code: "rule-conflict", path: "budget", at: "budget: 1M", what: /programme gives its budgets in programme\.budgets/, fix: /remove budget:, or the programme: block/ },
  { name: "neither budget nor programme", text: scenarioText({ money: "" }), code: "schema", path: "", what: /missing required field 'budget'/, fix: /programme: block/ },
  { name: "fewer budgets than years", text: scenarioText({ money: "programme:\n  firstYear: 2027\n  years: 3\n  budgets: [100k, 200k]\n" }), code: "budget-years", path: "programme.budgets", at: "budgets: [100k, 200k]", what: /2 budget\(s\) for a 3-year programme/, fix: /one amount per year \(3\)/ },
  { name: "a budget that is not an amount", text: scenarioText({ money: "programme:\n  firstYear: 2027\n  years: 3\n  budgets: [100k, 2000B, 300k]\n" }), code: "bad-amount", path: "programme.budgets[1]", at: "2000B", what: /'2000B' is not an amount/, fix: /1e12/ },
  { name: "one budget for every year that is not an amount", text: scenarioText({ money: "programme:\n  firstYear: 2027\n  years: 3\n  budgets: 4,5M\n" }), code: "schema", path: "programme.budgets", at: "budgets: 4,5M", what: /'4,5M' has the wrong form/, fix: /4\.5M.*decimals take a point/ },
  { name: "zero years", text: scenarioText({ money: "programme:\n  firstYear: 2027\n  years: 0\n  budgets: 100k\n" }), code: "schema", path: "programme.years", at: "years: 0", what: />= 1, found 0/, fix: /1 to 10/ },
  { name: "eleven years", text: scenarioText({ money: "programme:\n  firstYear: 2027\n  years: 11\n  budgets: 100k\n" }), code: "schema", path: "programme.years", at: "years: 11", what: /<= 10, found 11/, fix: /1 to 10/ },
  { name: "carry-over misspelt", text: scenarioText({ money: `${PROGRAMME}  carryOver: unspend\n` }), code: "schema", path: "programme.carryOver", at: "carryOver: unspend", what: /unspend/, fix: /unspent/ },
  { name: "escalation as a percent", text: scenarioText({ money: `${PROGRAMME}  costEscalationRate: 3\n` }), code: "schema", path: "programme.costEscalationRate", at: "costEscalationRate: 3", what: /<= 1, found 3/, fix: /fraction/ },
  { name: "horizon shorter than the programme", text: scenarioText({ horizon: 2 }), code: "horizon-short", path: "economics.horizonYears", at: "horizonYears: 2", what: /horizon \(2 years\) is shorter than the 3-year programme/, fix: /horizonYears at least 3/ },
  // committed projects
  { name: "committed at an unknown site", text: scenarioText({ money: COMMIT("{ site: I-011, treatments: [raised-crosswalk], year: 2027 }") }), code: "unknown-id", path: "programme.committed[0].site", at: "site: I-011", what: /unknown site 'I-011'/, fix: /did you mean 'I-01'/ },
  { name: "committed with an unknown treatment", text: scenarioText({ money: COMMIT("{ site: I-01, treatments: [raised-crosswalck], year: 2027 }") }), code: "unknown-id", path: "programme.committed[0].treatments[0]", at: "raised-crosswalck", what: /unknown treatment 'raised-crosswalck'/, fix: /did you mean 'raised-crosswalk'/ },
  { name: "committed before the programme", text: scenarioText({ money: COMMIT("{ site: I-01, treatments: [raised-crosswalk], year: 2026 }") }), code: "year-outside", path: "programme.committed[0].year", at: "year: 2026", what: /2026 is not a year of the programme \(2027–2029\)/, fix: /drop it/ },
  { name: "committed after the programme", text: scenarioText({ money: COMMIT("{ site: I-01, treatments: [raised-crosswalk], year: 2030 }") }), code: "year-outside", path: "programme.committed[0].year", at: "year: 2030", what: /2030 is not a year of the programme/, fix: /use a year from 2027–2029/ },
  { name: "a site committed twice", text: scenarioText({ money: `${COMMIT("{ site: I-01, treatments: [raised-crosswalk], year: 2027 }")}    - { site: I-01, treatments: [leading-pedestrian-interval], year: 2028 }\n` }), code: "duplicate-id", path: "programme.committed[1].site", at: "year: 2028", what: /site 'I-01' is committed twice/, fix: /keep one entry/ },
  { name: "committed on a never-fund site", text: scenarioText({ money: COMMIT("{ site: I-01, treatments: [raised-crosswalk], year: 2027 }"), rules: YEAR_RULE("neverFund", "site: I-01") }), code: "rule-conflict", path: "programme.committed[0].site", at: "year: 2027 }", what: /both committed and never-fund/, fix: /remove one of the two/ },
  { name: "committed with a treatment a never-fund rule bars", text: scenarioText({ money: COMMIT("{ site: I-01, treatments: [raised-crosswalk], year: 2027 }"), rules: YEAR_RULE("neverFund", "{ site: I-01, treatments: [raised-crosswalk] }") }), code: "rule-conflict", path: "programme.committed[0].treatments", at: "year: 2027 }", what: /includes raised-crosswalk, which a never-fund rule bars/, fix: /remove one of the two/ },
  { name: "committed without a must-fund treatment", text: scenarioText({ money: COMMIT("{ site: I-01, treatments: [raised-crosswalk], year: 2027 }"), rules: YEAR_RULE("mustFund", "{ site: I-01, treatments: [leading-pedestrian-interval] }") }), code: "rule-conflict", path: "programme.committed[0].treatments", at: "year: 2027 }", what: /must be funded with leading-pedestrian-interval/, fix: /add them to the committed project/ },
  { name: "committed with a treatment for another kind of site", text: scenarioText({ money: COMMIT("{ site: I-01, treatments: [curve-chevrons], year: 2027 }") }), code: "not-applicable", path: "programme.committed[0].treatments[0]", at: "year: 2027 }", what: /'curve-chevrons' does not apply to an intersection/, fix: /applies to: segment/ },
  { name: "committed per km at a site without a length", text: scenarioText({ money: COMMIT("{ site: S-01, treatments: [road-diet], year: 2027 }"), s01: "" }), code: "missing-length", path: "programme.committed[0].treatments[0]", at: "year: 2027 }", what: /'road-diet' is costed per km but site 'S-01' has no lengthKm/, fix: /add lengthKm/ },
  { name: "committed outside the site's build window", text: scenarioText({ money: COMMIT("{ site: I-01, treatments: [raised-crosswalk], year: 2027 }"), i01: "    earliestYear: 2028\n" }), code: "year-window", path: "programme.committed[0].year", at: "year: 2027 }", what: /committed to 2027 but may be built only from 2028/, fix: /earliestYear/ },
  // site build windows
  { name: "earliest year after latest year", text: scenarioText({ i01: "    earliestYear: 2029\n    latestYear: 2028\n" }), code: "year-window", path: "sites[0]", at: "- id: I-01", what: /may be built from 2029 but only until 2028/, fix: /earliestYear no later than latestYear/ },
  { name: "earliest year after the programme", text: scenarioText({ i01: "    earliestYear: 2031\n" }), code: "year-outside", path: "sites[0]", at: "- id: I-01", what: /may be built only from 2031, outside the programme \(2027–2029\)/, fix: /widen its earliestYear\/latestYear/ },
  { name: "latest year before the programme", text: scenarioText({ i01: "    latestYear: 2026\n" }), code: "year-outside", path: "sites[0]", at: "- id: I-01", what: /only until 2026, outside the programme/, fix: /widen/ },
  { name: "a window wholly after the programme", text: scenarioText({ i01: "    earliestYear: 2031\n    latestYear: 2032\n" }), code: "year-outside", path: "sites[0]", at: "- id: I-01", what: /only in 2031–2032, outside the programme/, fix: /widen/ },
  { name: "earliest year without a programme", text: scenarioText({ money: ONE_YEAR, i01: "    earliestYear: 2028\n" }), code: "needs-programme", path: "sites[0].earliestYear", at: "earliestYear: 2028", what: /only applies in a multi-year programme/, fix: /add a programme: block, or remove it/ },
  { name: "latest year without a programme", text: scenarioText({ money: ONE_YEAR, i01: "    latestYear: 2028\n" }), code: "needs-programme", path: "sites[0].latestYear", at: "latestYear: 2028", what: /only applies in a multi-year programme/, fix: /add a programme: block/ },
  // spending rules for one year
  { name: "a one-year cap without a programme", text: scenarioText({ money: ONE_YEAR, rules: YEAR_RULE("spendCaps", "{ district: North, amount: 50k, year: 2028 }") }), code: "needs-programme", path: "rules.spendCaps[0].year", at: "year: 2028", what: /a rule for one year only applies in a multi-year programme/, fix: /remove year/ },
  { name: "a one-year floor outside the programme", text: scenarioText({ rules: YEAR_RULE("spendFloors", "{ district: North, amount: 50k, year: 2032 }") }), code: "year-outside", path: "rules.spendFloors[0].year", at: "year: 2032", what: /2032 is not a year of the programme \(2027–2029\)/, fix: /use a year from 2027–2029/ },
  { name: "a one-year cap as a share", text: scenarioText({ rules: YEAR_RULE("spendCaps", "{ district: North, share: 0.5, year: 2028 }") }), code: "rule-amount", path: "rules.spendCaps[0]", at: "share: 0.5", what: /takes an amount, not a share/, fix: /amount: 1\.2M/ },
];

describe("loader errors for the programme block, committed projects, site windows and one-year rules", () => {
  it("the base scenario loads, as a programme and as a one-year list", () => {
    expect(loadScenario(write(scenarioText())).scenario.programme?.budgets).toEqual([100_000, 200_000, 300_000]);
    expect(loadScenario(write(scenarioText({ money: ONE_YEAR }))).scenario.budget).toBe(300_000);
  });

  it.each(CASES)("$name: $code at $path, with the file, line, what is wrong and a fix", (c) => {
    const file = write(c.text);
    const problem = problemsOf(file).find((p) => p.code === c.code && (p.path ?? "") === c.path);
    expect(problem, JSON.stringify(problemsOf(file))).toBeDefined();
    expect(problem!.file).toBe(file);
    expect(problem!.line).toBe(c.at === undefined ? 1 : lineOf(c.text, c.at));
    expect(problem!.message).toMatch(c.what);
    expect(problem!.hint).toMatch(c.fix);
    // The text a user reads: file:line:column: path: what (how to fix).
    const text = formatProblem(problem!);
    expect(text.startsWith(`${file}:${problem!.line}:${problem!.column}:`)).toBe(true);
    if (c.path !== "") expect(text).toContain(` ${c.path}: `);
    expect(text).toContain(`(${problem!.hint})`);
  });

  it("reports every problem of a file at once", () => {
    const text = scenarioText({ money: `budget: 1M\n${COMMIT("{ site: I-011, treatments: [raised-crosswalk], year: 2030 }")}`, i01: "    earliestYear: 2031\n" });
    expect(problemsOf(write(text)).map((p) => `${p.code} ${p.path}`)).toEqual(expect.arrayContaining(["rule-conflict budget", "unknown-id programme.committed[0].site", "year-outside programme.committed[0].year", "year-outside sites[0]"]));
  });
});

/** A catalogue of one treatment with the given phasing lines, and a scenario on it. */
function phasedScenario(phasing: string): { file: string; catalogue: string; text: string } {
  const text = `treatments:
  - id: crossing-upgrade
    name: Crossing upgrade
    appliesTo: [intersection, segment]
    cost: { perSite: 40000 }
    serviceLifeYears: 15
    phasing:
${phasing}    effects:
      - { crashTypes: [pedestrian], cmf: 0.7, source: invented test value }
`;
  const catalogue = write(text, `catalogue-${(written += 1)}.yaml`);
  const scenario = scenarioText({ catalogue: catalogue.split("/").pop()! }).replaceAll("leading-pedestrian-interval, raised-crosswalk", "crossing-upgrade").replace("[curve-chevrons]", "[crossing-upgrade]");
  return { file: write(scenario), catalogue, text };
}

describe("loader errors for a treatment's phasing (in its catalogue)", () => {
  it("a phasing whose shares add up to 1 loads", () => {
    const { file } = phasedScenario("      - { yearsBeforeBuild: 1, share: 0.25 }\n      - { yearsBeforeBuild: 0, share: 0.75 }\n");
    expect(loadScenario(file).scenario.catalogue.treatments[0]!.phasing).toEqual([{ yearsBeforeBuild: 1, share: 0.25 }, { yearsBeforeBuild: 0, share: 0.75 }]);
  });

  const PHASING_CASES = [
    { name: "shares that add up to 0.9", lines: "      - { yearsBeforeBuild: 1, share: 0.2 }\n      - { yearsBeforeBuild: 0, share: 0.7 }\n", code: "phasing", path: "treatments[0].phasing", at: "share: 0.2 }", what: /add up to 0\.9, not 1/, fix: /make the shares add up to 1/ },
    { name: "one year named twice", lines: "      - { yearsBeforeBuild: 0, share: 0.25 }\n      - { yearsBeforeBuild: 0, share: 0.75 }\n", code: "phasing", path: "treatments[0].phasing", at: "share: 0.25 }", what: /names one year twice/, fix: /give each yearsBeforeBuild once/ },
    { name: "a negative yearsBeforeBuild", lines: "      - { yearsBeforeBuild: -1, share: 0.2 }\n      - { yearsBeforeBuild: 0, share: 0.8 }\n", code: "schema", path: "treatments[0].phasing[0].yearsBeforeBuild", at: "yearsBeforeBuild: -1", what: />= 0, found -1/, fix: /0 for the build year/ },
    { name: "more than four years ahead", lines: "      - { yearsBeforeBuild: 5, share: 0.2 }\n      - { yearsBeforeBuild: 0, share: 0.8 }\n", code: "schema", path: "treatments[0].phasing[0].yearsBeforeBuild", at: "yearsBeforeBuild: 5", what: /<= 4, found 5/, fix: /0 for the build year/ },
    { name: "a share of zero", lines: "      - { yearsBeforeBuild: 1, share: 0 }\n      - { yearsBeforeBuild: 0, share: 1 }\n", code: "schema", path: "treatments[0].phasing[0].share", at: "share: 0 }", what: /> 0/, fix: /fraction of the capital/ },
  ];

  it.each(PHASING_CASES)("$name: $code at $path in the catalogue", (c) => {
    const { file, catalogue, text } = phasedScenario(c.lines);
    const problem = problemsOf(file).find((p) => p.code === c.code && p.path === c.path);
    expect(problem, JSON.stringify(problemsOf(file))).toBeDefined();
    expect(problem!.file).toMatch(new RegExp(`${catalogue.split("/").pop()!.replace(".", "\\.")}$`));
    const line = lineOf(text, c.at);
    expect(problem!.line).toBe(line);
    expect(problem!.message).toMatch(c.what);
    expect(problem!.hint).toMatch(c.fix);
    expect(formatProblem(problem!)).toContain(`:${line}:${problem!.column}: ${c.path}: `);
  });
});
