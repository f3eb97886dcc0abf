import type { Catalogue, SiteKind } from "../model/types.js";
import { checkStudyPeriods, INVALID_DATE_HINT } from "./checkStudyPeriods.js";
import { closestName } from "./closestName.js";
import { formatFieldPath } from "./fieldPath.js";
import type { InputProblem } from "./InputError.js";
import { parseIsoDay } from "./parseIsoDay.js";
import { projectCompletion } from "./projectCompletion.js";
import type { RawBuiltProjects, RawProject, RawStudySite } from "./RawBuiltProjects.js";
import type { PathSegment, YamlSource } from "./readYamlFile.js";

type Problem = (code: string, path: PathSegment[], message: string, hint: string, key?: boolean) => void;

/**
 * Checks what the schema cannot: site ids unique across treated and comparison sites, projects
 * that name a treated site (one project per site) and catalogue treatments that suit it, one
 * completion date per project after its construction start, lengths of segments and corridors,
 * SPFs that exist and suit the site, and every period (see checkStudyPeriods).
 */
export function checkBuiltProjects(raw: RawBuiltProjects, source: YamlSource, catalogue: Catalogue): InputProblem[] {
  const problems: InputProblem[] = [];
  const problem: Problem = (code, path, message, hint, key = false) =>
    problems.push({ code, file: source.file, ...source.positionOf(path, key), path: formatFieldPath(path), message, hint });

  const treated = new Map<string, RawStudySite>();
  const comparison = new Set<string>();
  const firstAt = new Map<string, string>();
  const noteId = (id: string, path: PathSegment[]) => {
    const earlier = firstAt.get(id);
    if (earlier !== undefined) problem("duplicate-id", [...path, "id"], `site id '${id}' is used twice (first at ${earlier})`, "give each site, treated or comparison, its own id");
    else firstAt.set(id, formatFieldPath(path));
  };
  raw.sites.forEach((site, index) => {
    noteId(site.id, ["sites", index]);
    if (!treated.has(site.id)) treated.set(site.id, site);
    checkSite(site, index, catalogue, problem);
  });
  (raw.comparisonSites ?? []).forEach((site, index) => {
    noteId(site.id, ["comparisonSites", index]);
    comparison.add(site.id);
  });

  const projectAt = new Map<string, number>();
  raw.projects.forEach((project, index) => {
    const path: PathSegment[] = ["projects", index];
    const site = treated.get(project.site);
    if (site === undefined) {
      const guess = closestName(project.site, treated.keys());
      const hint = comparison.has(project.site)
        ? `'${project.site}' is a comparison site; list a treated site under sites:`
        : guess ? `did you mean '${guess}'?` : "use the id of an entry in sites:";
      problem("unknown-id", [...path, "site"], `unknown site '${project.site}'`, hint);
    }
    const earlier = projectAt.get(project.site);
    if (earlier !== undefined) {
      problem("duplicate-project", [...path, "site"], `site '${project.site}' already has a project (projects[${earlier}]); one site's projects must be evaluated as one project with all its treatments`, "merge the two into one project listing every treatment built there");
    } else projectAt.set(project.site, index);
    checkTreatments(project, path, site?.kind, catalogue, problem);
    checkCompletion(project, path, problem);
  });
  // In file order, so a user can fix them top to bottom.
  return [...problems, ...checkStudyPeriods(raw, source)].sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
}

function checkSite(site: RawStudySite, index: number, catalogue: Catalogue, problem: Problem): void {
  if (site.kind !== "intersection" && site.lengthKm === undefined) {
    problem("missing-length", ["sites", index], `site '${site.id}' is a ${site.kind} without lengthKm`, "add lengthKm: the length of the treated road in km");
  }
  if (site.performanceFunction === undefined) return;
  const path: PathSegment[] = ["sites", index, "performanceFunction"];
  const spf = catalogue.performanceFunctions.find((each) => each.id === site.performanceFunction);
  if (spf === undefined) {
    const guess = closestName(site.performanceFunction, catalogue.performanceFunctions.map((each) => each.id));
    problem("unknown-id", path, `unknown performance function '${site.performanceFunction}'`, guess ? `did you mean '${guess}'?` : "name one defined under performanceFunctions in a listed catalogue, or leave it out");
  } else if (!spf.appliesTo.includes(site.kind)) {
    problem("not-applicable", path, `performance function '${spf.id}' does not apply to ${article(site.kind)}`, `it applies to: ${spf.appliesTo.join(", ")}`);
  }
}

function checkTreatments(project: RawProject, path: PathSegment[], kind: SiteKind | undefined, catalogue: Catalogue, problem: Problem): void {
  project.treatments.forEach((id, index) => {
    const at: PathSegment[] = [...path, "treatments", index];
    const treatment = catalogue.treatments.find((each) => each.id === id);
    if (treatment === undefined) {
      const guess = closestName(id, catalogue.treatments.map((each) => each.id));
      problem("unknown-id", at, `unknown treatment '${id}'`, guess ? `did you mean '${guess}'?` : "add it to a catalogue, or check the catalogue list");
    } else if (kind !== undefined && !treatment.appliesTo.includes(kind)) {
      problem("not-applicable", at, `treatment '${id}' does not apply to ${article(kind)}, and site '${project.site}' is one`, `it applies to: ${treatment.appliesTo.join(", ")}`);
    }
  });
}

function checkCompletion(project: RawProject, path: PathSegment[], problem: Problem): void {
  const hasDay = project.completed !== undefined;
  const hasYear = project.completedYear !== undefined;
  if (hasDay && hasYear) problem("completion-both", [...path, "completedYear"], "gives both completed and completedYear", "keep completed (the day the works finished) if it is known, else completedYear", true);
  if (!hasDay && !hasYear) problem("completion-missing", path, `the project at '${project.site}' gives no completion date`, "add completed: YYYY-MM-DD (the day the works finished), or completedYear: YYYY");
  if (hasDay && parseIsoDay(project.completed!) === undefined) problem("invalid-date", [...path, "completed"], `'${project.completed}' is not a day of the calendar`, INVALID_DATE_HINT);
  if (project.constructionStart !== undefined && parseIsoDay(project.constructionStart) === undefined) {
    problem("invalid-date", [...path, "constructionStart"], `'${project.constructionStart}' is not a day of the calendar`, INVALID_DATE_HINT);
    return;
  }
  const works = projectCompletion(project);
  if (works?.constructionStart === undefined || parseIsoDay(works.completed) === undefined) return;
  if (parseIsoDay(works.constructionStart)! > parseIsoDay(works.completed)!) {
    problem("construction-after-completion", [...path, "constructionStart"], `construction starts (${works.constructionStart}) after the works were completed (${works.completed})`, "correct the dates: constructionStart is the first day of the works, on or before completion");
  }
}

function article(kind: SiteKind): string {
  return kind === "intersection" ? "an intersection" : `a ${kind}`;
}
