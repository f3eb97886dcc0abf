// The study composition: grouping, which sites enter each estimate, the SPF predictions by
// crash group, and which estimates may go into the catalogue. The estimators themselves are
// checked against published sources in test/model.
import { describe, expect, it } from "vitest";
import { evaluateBuiltProjects } from "../../src/analysis/evaluateBuiltProjects.js";
import { localEvidenceEntries } from "../../src/analysis/localEvidenceEntries.js";
import { loadCatalogue } from "../../src/io/loadCatalogue.js";
import type { BuiltProjects, StudyPeriod, StudySite } from "../../src/model/builtProjectTypes.js";
import { completeCrashMatrix } from "../../src/model/crashMatrix.js";
import { predictedCrashesPerYear } from "../../src/model/predictedCrashesPerYear.js";

const { catalogue } = loadCatalogue("catalogs/demo-catalogue.yaml");
const spf = catalogue.performanceFunctions.find((entry) => entry.id === "urban-4sg-intersection")!;

function period(from: string, to: string, years: number, aadt: number | undefined, angle: number, pedestrianA: number): StudyPeriod {
  return { from, to, years, ...(aadt !== undefined && { aadt }), crashes: completeCrashMatrix({ angle: { O: angle }, pedestrian: { A: pedestrianA } }) };
}

function site(id: string, aadt: number | undefined, before: [number, number], after: [number, number]): StudySite {
  return { id, kind: "intersection", performanceFunction: "urban-4sg-intersection", before: period("2015-01-01", "2018-12-31", 4, aadt, ...before), after: period("2020-01-01", "2022-12-31", 3, aadt === undefined ? undefined : aadt * 1.1, ...after) };
}

const study: BuiltProjects = {
  evaluation: "test study",
  projects: [
    { site: "A", treatments: ["retroreflective-backplates"], completed: "2019-12-31" },
    { site: "B", treatments: ["retroreflective-backplates"], completed: "2019-12-31" },
    { site: "C", treatments: ["retroreflective-backplates"], completed: "2019-12-31" },
    { site: "D", treatments: ["retroreflective-backplates", "intersection-lighting"], completed: "2019-12-31", group: "mixed" },
    { site: "E", treatments: ["intersection-lighting"], completed: "2019-12-31", group: "mixed" },
  ],
  sites: [site("A", 20000, [30, 2], [18, 1]), site("B", 15000, [12, 1], [9, 0]), site("C", undefined, [8, 0], [7, 1]), site("D", 18000, [10, 1], [8, 1]), site("E", 18000, [10, 1], [8, 1])],
  comparisonSites: [],
};

describe("evaluateBuiltProjects", () => {
  const evaluation = evaluateBuiltProjects(study, catalogue);
  const backplates = evaluation.groups.find((group) => group.name === "retroreflective-backplates")!;

  it("groups by the named group, else by treatment set, and keeps the treatments all projects share", () => {
    expect(evaluation.groups.map((group) => group.name)).toEqual(["retroreflective-backplates", "mixed"]);
    expect(backplates.sameTreatments).toBe(true);
    const mixed = evaluation.groups[1]!;
    expect(mixed.treatments).toEqual(["intersection-lighting"]);
    expect(mixed.sameTreatments).toBe(false);
  });

  it("leaves a site without AADT out of Empirical Bayes, and in the naive estimate", () => {
    const all = backplates.crashGroups.find((entry) => entry.crashGroup.id === "total")!;
    expect(backplates.withoutEmpiricalBayes).toEqual([{ site: "C", why: "no AADT for both periods" }]);
    expect(all.empiricalBayes!.sites).toBe(2);
    expect(all.naive!.sites).toBe(3);
    expect(all.beforeObserved).toBe(30 + 2 + 12 + 1 + 8);
    expect(all.afterObserved).toBe(18 + 1 + 9 + 0 + 7 + 1);
    expect(all.warnings.join(" ")).toMatch(/1 of 3 site\(s\) cannot use Empirical Bayes/);
  });

  it("predicts a crash group as the SPF's crashes a year × years × its share of the group's cells (by hand)", () => {
    const ksi = backplates.crashGroups.find((entry) => entry.crashGroup.id === "ksi")!;
    // The K+A share of the demo SPF: its K and A cells summed.
    let share = 0;
    for (const row of Object.values(spf.shares)) share += row.K + row.A;
    const beforeA = predictedCrashesPerYear(spf, "intersection", 20000, undefined) * 4 * share;
    const beforeB = predictedCrashesPerYear(spf, "intersection", 15000, undefined) * 4 * share;
    const w = (p: number) => 1 / (1 + spf.overdispersion * p);
    // EB before × r, with r = (AADT ratio)^b × 3/4 years, summed over the two sites (HSM Part B ch. 9 appendix steps).
    const r = Math.pow(1.1, spf.aadtExponent) * (3 / 4);
    const expected = (w(beforeA) * beforeA + (1 - w(beforeA)) * 2) * r + (w(beforeB) * beforeB + (1 - w(beforeB)) * 1) * r;
    expect(ksi.empiricalBayes!.expectedAfter).toBeCloseTo(expected, 10);
  });

  it("gives a crash type its own row only when the treated sites saw at least 20 before", () => {
    expect(backplates.crashGroups.map((entry) => entry.crashGroup.id)).toEqual(["total", "ksi", "angle"]);
  });

  it("puts into the catalogue only single-treatment groups and crash groups that match an effect's cells or touch none", () => {
    const entries = localEvidenceEntries(evaluation, catalogue);
    const kept = entries.filter((entry) => entry.kind === "entry");
    // backplates has one effect on all crashes: 'total' pools with it; K+A and angle overlap it in part.
    expect(kept.map((entry) => entry.crashGroup.id)).toEqual(["total"]);
    const skipped = entries.filter((entry) => entry.kind === "skipped");
    expect(skipped.map((entry) => `${entry.group}:${entry.crashGroup}`)).toEqual(["retroreflective-backplates:ksi", "retroreflective-backplates:angle", "mixed:all"]);
    expect(kept[0]!.kind === "entry" && kept[0]!.source).toMatch(/Empirical Bayes before-after, 2 site\(s\)/);
  });
});
