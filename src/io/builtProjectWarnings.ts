import { formatFieldPath } from "./fieldPath.js";
import type { InputProblem } from "./InputError.js";
import { isoDayText, parseIsoDay, sameDayYearsLater } from "./parseIsoDay.js";
import { projectCompletion } from "./projectCompletion.js";
import type { RawBuiltProjects } from "./RawBuiltProjects.js";
import type { PathSegment, YamlSource } from "./readYamlFile.js";

/** After-years below which an estimate is weak (common practice: at least 2; HSM Part B ch. 9 and Hauer 1997 advise several years). */
export const FEW_AFTER_YEARS = 2;

/**
 * What a checked projects file allows but a reader should know: a treated site without a project,
 * an after period under FEW_AFTER_YEARS, before or after windows that reach into the works (whose
 * disrupted traffic and crashes bias the estimate), and sites that cannot enter an Empirical Bayes
 * estimate. Assumes checkBuiltProjects found nothing, so every date is a real day.
 */
export function builtProjectWarnings(raw: RawBuiltProjects, source: YamlSource): InputProblem[] {
  const warnings: InputProblem[] = [];
  const warn = (code: string, path: PathSegment[], message: string, hint: string) =>
    warnings.push({ code, file: source.file, ...source.positionOf(path), path: formatFieldPath(path), message, hint });
  const projects = new Map(raw.projects.map((project) => [project.site, project]));
  raw.sites.forEach((site, index) => {
    const at: PathSegment[] = ["sites", index];
    const project = projects.get(site.id);
    if (project === undefined) warn("site-without-project", [...at, "id"], `site '${site.id}' has no project, so it is not evaluated`, "add its project under projects:, list it under comparisonSites if it was not treated, or remove it");

    const from = parseIsoDay(site.after.from)!;
    const to = parseIsoDay(site.after.to)!;
    const yearsOn = sameDayYearsLater(from, FEW_AFTER_YEARS) - 1;
    if (to < yearsOn) {
      warn("few-after-years", [...at, "after"], `too few after-years: the after period ${site.after.from} to ${site.after.to} covers ${to - from + 1} day(s), under ${FEW_AFTER_YEARS} years (which would end ${isoDayText(yearsOn)})`, "the estimate rests on few crashes and may catch a passing fluctuation; extend the after period once more crashes are on record");
    }

    const works = project === undefined ? undefined : projectCompletion(project);
    if (works !== undefined) {
      const start = works.constructionStart ?? works.completed;
      const overlap = "construction overlaps the window: crashes of the works period bias the estimate";
      if (site.before.to >= start) {
        warn("construction-overlap", [...at, "before", "to"], `${overlap} (the before period ends ${site.before.to}, the works began ${start})`, `end the before period before ${start}`);
      }
      if (site.after.from <= works.completed) {
        warn("construction-overlap", [...at, "after", "from"], `${overlap} (the after period starts ${site.after.from}, the works finished ${works.completed})`, `start the after period after ${works.completed}`);
      }
    }

    const withAadt = site.before.aadt !== undefined && site.after.aadt !== undefined;
    if (site.performanceFunction === undefined || !withAadt) {
      const lacks = site.performanceFunction === undefined ? (withAadt ? "no performanceFunction" : "no performanceFunction and no AADT in both periods") : "no AADT in both periods";
      warn("no-empirical-bayes", at, `site '${site.id}' has ${lacks}, so it cannot use Empirical Bayes; it enters the naive and comparison-group estimates only`, site.performanceFunction === undefined ? "name a catalogue SPF, and give aadt in the before and the after period" : "give aadt in the before and the after period");
    }
  });
  // In file order, as the errors are.
  return warnings.sort((a, b) => (a.line ?? 0) - (b.line ?? 0) || (a.column ?? 0) - (b.column ?? 0));
}
