import { resolve } from "node:path";
import { describe, expect, it } from "vitest";
import { InputError, type InputProblem } from "../../src/io/InputError.js";
import { loadBuiltProjects } from "../../src/io/loadBuiltProjects.js";
import { loadCatalogue } from "../../src/io/loadCatalogue.js";
import { forgetRunInputs, runInputAt } from "../../src/io/runInputs.js";
import { completeCrashMatrix } from "../../src/model/crashMatrix.js";

const FOLDER = "test/fixtures/projects";
const fixture = (name: string) => `${FOLDER}/${name}.yaml`;

function problemsOf(name: string): readonly InputProblem[] {
  try {
    loadBuiltProjects(fixture(name));
  } catch (error) {
    if (error instanceof InputError) return error.problems;
    throw error;
  }
  throw new Error(`${name} loaded without error`);
}

// Day counts by hand (common practice: Gregorian calendar, leap years 2016 and 2020); a year is
// 365.25 days, the average Gregorian year the study periods are measured in (common practice).
const YEAR = 365.25;

describe("a valid projects file", () => {
  const loaded = loadBuiltProjects(fixture("valid"));

  it("loads to the plain data it states", () => {
    expect(loaded.projects).toEqual({
      evaluation: "Vellmar test projects",
      projects: [
        { site: "I-31", treatments: ["leading-pedestrian-interval", "retroreflective-backplates"], completed: "2020-06-30", constructionStart: "2020-03-01", group: "signal retiming" },
        // completedYear alone: the year's last day completes the works, its first day starts them.
        { site: "S-07", treatments: ["road-diet"], completed: "2019-12-31", constructionStart: "2019-01-01" },
      ],
      sites: [
        {
          id: "I-31",
          name: "Ostring / Mühlweg",
          kind: "intersection",
          performanceFunction: "urban-4sg-intersection",
          before: { from: "2016-01-01", to: "2019-12-31", years: 4, aadt: 14200, crashes: completeCrashMatrix({ angle: { A: 1, B: 3 }, pedestrian: { K: 1 } }) },
          after: { from: "2020-07-01", to: "2023-06-30", years: 1095 / YEAR, aadt: 14900, crashes: completeCrashMatrix({ angle: { B: 1 } }) },
        },
        {
          id: "S-07",
          kind: "segment",
          lengthKm: 0.8,
          performanceFunction: "urban-2u-segment",
          before: { from: "2015-01-01", to: "2018-12-31", years: 4, aadt: 9100, crashes: completeCrashMatrix({ "rear-end": { C: 2, O: 5 } }) },
          after: { from: "2020-01-01", to: "2022-12-31", years: 1096 / YEAR, aadt: 9400, crashes: completeCrashMatrix({}) },
        },
      ],
      comparisonSites: [
        {
          id: "I-90",
          group: "signal retiming",
          before: { from: "2016-01-01", to: "2019-12-31", years: 4, crashes: completeCrashMatrix({ angle: { B: 2 } }) },
          after: { from: "2020-07-01", to: "2023-06-30", years: 1095 / YEAR, crashes: completeCrashMatrix({ angle: { C: 1 } }) },
        },
      ],
    });
  });

  it("counts both ends of a period: 2016-01-01 to 2019-12-31 is 1461 days, 4.0 years exactly", () => {
    expect(loaded.projects.sites[0]!.before.years).toBe(4);
    // 2020-07-01 to 2023-06-30 holds no 29 February: 3 × 365 days.
    expect(loaded.projects.sites[0]!.after.years).toBeCloseTo(2.99795, 5);
  });

  it("fills the cells a matrix leaves out with zero", () => {
    const before = loaded.projects.sites[0]!.before.crashes!;
    expect(before.angle.B).toBe(3);
    expect(before.pedestrian.K).toBe(1);
    expect(before["head-on"].K).toBe(0);
  });

  it("has nothing to warn about", () => {
    expect(loaded.warnings).toEqual([]);
  });

  it("gives the treatments and SPFs of its one catalogue", () => {
    expect(loaded.catalogue).toEqual(loadCatalogue("catalogs/demo-catalogue.yaml").catalogue);
    expect(loaded.source.file).toBe(fixture("valid"));
  });

  it("registers the file as an input of the run, so no output may replace it", () => {
    forgetRunInputs();
    expect(runInputAt(fixture("valid"))).toBeUndefined();
    loadBuiltProjects(fixture("valid"));
    expect(runInputAt(resolve(fixture("valid")))).toBe(fixture("valid"));
    forgetRunInputs();
  });
});

describe("a projects file that counts crashes from records", () => {
  const loaded = loadBuiltProjects(fixture("with-records"));

  it("resolves the record files against the projects file, without counting anything", () => {
    expect(loaded.projects.crashRecords).toEqual({ crashes: resolve(FOLDER, "records/crashes.csv"), sites: resolve(FOLDER, "records/sites.geojson") });
    const periods = [...loaded.projects.sites, ...loaded.projects.comparisonSites].flatMap((site) => [site.before, site.after]);
    expect(periods).toHaveLength(4);
    for (const period of periods) expect(period.crashes).toBeUndefined();
    // 2021 to 2023, no leap year: 1095 days.
    expect(loaded.projects.sites[0]!.after.years).toBe(1095 / YEAR);
    expect(loaded.projects.projects[0]).toEqual({ site: "I-31", treatments: ["leading-pedestrian-interval"], completed: "2020-12-31", constructionStart: "2020-01-01" });
  });
});

interface Case {
  readonly name: string;
  readonly code: string;
  readonly line: number;
  readonly column: number;
  readonly path: string;
  /** The file the problem is in, when not the projects file itself. */
  readonly file?: string;
}

// Lines and columns read off each fixture by hand (1-based; the header comment is line 1).
const CASES: readonly Case[] = [
  { name: "bad-unknown-site", code: "unknown-id", line: 5, column: 11, path: "projects[0].site" },
  { name: "bad-comparison-site-treated", code: "unknown-id", line: 5, column: 11, path: "projects[0].site" },
  { name: "bad-unknown-treatment", code: "unknown-id", line: 6, column: 18, path: "projects[0].treatments[0]" },
  { name: "bad-treatment-not-applicable", code: "not-applicable", line: 6, column: 47, path: "projects[0].treatments[1]" },
  { name: "bad-unknown-spf", code: "unknown-id", line: 11, column: 26, path: "sites[0].performanceFunction" },
  { name: "bad-spf-not-applicable", code: "not-applicable", line: 11, column: 26, path: "sites[0].performanceFunction" },
  // 2019 is no leap year (Gregorian calendar: common practice).
  { name: "bad-invalid-date", code: "invalid-date", line: 12, column: 37, path: "sites[0].before.to" },
  { name: "bad-date-form", code: "schema", line: 7, column: 16, path: "projects[0].completed" },
  { name: "bad-period-reversed", code: "period-reversed", line: 12, column: 37, path: "sites[0].before.to" },
  // 2020-07-01 to 2021-06-29: one day short of a year.
  { name: "bad-after-too-short", code: "after-too-short", line: 13, column: 12, path: "sites[0].after" },
  { name: "bad-completion-both", code: "completion-both", line: 8, column: 5, path: "projects[0].completedYear" },
  { name: "bad-completion-missing", code: "completion-missing", line: 5, column: 5, path: "projects[0]" },
  { name: "bad-construction-after-completion", code: "construction-after-completion", line: 8, column: 24, path: "projects[0].constructionStart" },
  { name: "bad-duplicate-site-id", code: "duplicate-id", line: 15, column: 9, path: "comparisonSites[0].id" },
  { name: "bad-duplicate-project", code: "duplicate-project", line: 8, column: 11, path: "projects[1].site" },
  { name: "bad-missing-length", code: "missing-length", line: 17, column: 5, path: "sites[1]" },
  { name: "bad-missing-crashes", code: "missing-crashes", line: 13, column: 12, path: "sites[0].after" },
  { name: "bad-crashes-with-records", code: "crashes-with-records", line: 12, column: 62, path: "sites[0].before.crashes" },
  { name: "bad-records-outside", code: "records-outside", line: 15, column: 12, path: "crashRecords.crashes" },
  { name: "bad-records-missing", code: "missing-file", line: 16, column: 10, path: "crashRecords.sites" },
  { name: "bad-catalogue-conflict", code: "duplicate-id", line: 4, column: 9, path: "treatments[0].id", file: `${FOLDER}/catalogues/road-diet-again.yaml` },
];

describe("a projects file with a mistake", () => {
  it.each(CASES)("$name: $code at $line:$column", (expected) => {
    const [first] = problemsOf(expected.name);
    expect(first).toMatchObject({ code: expected.code, line: expected.line, column: expected.column, path: expected.path });
    expect(resolve(first!.file)).toBe(resolve(expected.file ?? fixture(expected.name)));
    expect(first!.hint).toBeTruthy();
  });

  it("suggests the id meant, where one is close", () => {
    expect(problemsOf("bad-unknown-site")[0]!.hint).toContain("'I-31'");
    expect(problemsOf("bad-unknown-treatment")[0]!.hint).toContain("'leading-pedestrian-interval'");
    expect(problemsOf("bad-unknown-spf")[0]!.hint).toContain("'urban-4sg-intersection'");
  });

  it("reports crashes in both periods when the file names crash records", () => {
    expect(problemsOf("bad-crashes-with-records").map((problem) => [problem.code, problem.path, problem.line])).toEqual([
      ["crashes-with-records", "sites[0].before.crashes", 12],
      ["crashes-with-records", "sites[0].after.crashes", 13],
    ]);
  });

  it("reports every mistake of a file at once, in file order", () => {
    expect(problemsOf("bad-several-errors").map((problem) => [problem.code, problem.path, problem.line, problem.column])).toEqual([
      ["unknown-id", "projects[0].site", 5, 11],
      ["unknown-id", "projects[1].treatments[0]", 9, 18],
      ["invalid-date", "sites[0].before.to", 14, 37],
      ["missing-length", "sites[1]", 16, 5],
      ["after-too-short", "sites[1].after", 19, 12],
    ]);
  });
});

describe("a projects file worth warnings", () => {
  const loaded = loadBuiltProjects(fixture("warnings"));

  it("loads, and returns each warning located", () => {
    expect(loaded.warnings.map((warning) => [warning.code, warning.path, warning.line, warning.column])).toEqual([
      // Works from 2019-10-01 to 2020-06-30; the before period runs to 2019-12-31, the after one from 2020-06-01.
      ["construction-overlap", "sites[0].before.to", 16, 37],
      ["construction-overlap", "sites[0].after.from", 17, 20],
      // 2020-01-01 to 2020-12-31 is a whole year, so no error, but under the 2 years asked for (common practice).
      ["no-empirical-bayes", "sites[1]", 18, 5],
      ["few-after-years", "sites[1].after", 22, 12],
      ["site-without-project", "sites[2].id", 23, 9],
    ]);
    for (const warning of loaded.warnings) expect(warning.file).toBe(fixture("warnings"));
  });

  it("still loads a treated site that has no project", () => {
    expect(loaded.projects.sites.map((site) => site.id)).toEqual(["I-31", "S-07", "I-44"]);
  });
});
