import type { BuiltProject, BuiltProjects, ComparisonSite, StudyPeriod, StudySite } from "../model/builtProjectTypes.js";
import { DAYS_PER_YEAR } from "../model/builtProjectTypes.js";
import { completeCrashMatrix } from "../model/crashMatrix.js";
import type { Catalogue } from "../model/types.js";
import { builtProjectWarnings } from "./builtProjectWarnings.js";
import { checkBuiltProjects } from "./checkBuiltProjects.js";
import { InputError, type InputProblem } from "./InputError.js";
import { loadListedCatalogues } from "./loadListedCatalogues.js";
import { mergeCatalogues } from "./mergeCatalogues.js";
import { parseIsoDay } from "./parseIsoDay.js";
import { projectCompletion } from "./projectCompletion.js";
import type { RawBuiltProjects, RawComparisonSite, RawPeriod, RawProject, RawStudySite } from "./RawBuiltProjects.js";
import { readYamlFile, type YamlSource } from "./readYamlFile.js";
import { resolveCrashRecords } from "./resolveCrashRecords.js";
import { validateWithSchema } from "./validateWithSchema.js";

/** A projects file ready for the evaluation, with its catalogues merged and what is worth a warning. */
export interface LoadedBuiltProjects {
  /** The study; crashRecords paths are absolute. */
  readonly projects: BuiltProjects;
  /** The treatments and SPFs of the listed catalogues, merged in order. */
  readonly catalogue: Catalogue;
  /** Problems that do not stop the evaluation (codes: site-without-project, few-after-years, construction-overlap, no-empirical-bayes). */
  readonly warnings: readonly InputProblem[];
  readonly source: YamlSource;
}

/**
 * Reads a projects file (schema/projects.schema.json) and the catalogues it lists, checks them
 * against each other, and converts them to the model's BuiltProjects. Reading the file registers
 * it as an input of the run, so no output can replace it. Crash-record files are resolved and
 * checked to exist, not read. Throws InputError with every problem found.
 */
export function loadBuiltProjects(file: string): LoadedBuiltProjects {
  const source = readYamlFile(file);
  const schemaProblems = validateWithSchema(source, "projects");
  if (schemaProblems.length > 0) throw new InputError(schemaProblems);
  const raw = source.data as RawBuiltProjects;

  const merged = mergeCatalogues(loadListedCatalogues(raw.catalogues, source, file));
  const records = resolveCrashRecords(file, raw.crashRecords, source);
  const problems = [...merged.problems, ...records.problems, ...checkBuiltProjects(raw, source, merged.catalogue)];
  if (problems.length > 0) throw new InputError(problems);

  const projects: BuiltProjects = {
    evaluation: raw.evaluation,
    projects: raw.projects.map(toProject),
    sites: raw.sites.map(toStudySite),
    comparisonSites: (raw.comparisonSites ?? []).map(toComparisonSite),
    ...(records.records !== undefined && { crashRecords: records.records }),
  };
  return { projects, catalogue: merged.catalogue, warnings: builtProjectWarnings(raw, source), source };
}

function toProject(raw: RawProject): BuiltProject {
  // The checks have refused a project with both completion fields or neither.
  const works = projectCompletion(raw)!;
  return {
    site: raw.site,
    treatments: [...raw.treatments],
    completed: works.completed,
    ...(works.constructionStart !== undefined && { constructionStart: works.constructionStart }),
    ...(raw.group !== undefined && { group: raw.group }),
  };
}

function toStudySite(raw: RawStudySite): StudySite {
  return {
    id: raw.id,
    ...(raw.name !== undefined && { name: raw.name }),
    kind: raw.kind,
    ...(raw.lengthKm !== undefined && { lengthKm: raw.lengthKm }),
    ...(raw.performanceFunction !== undefined && { performanceFunction: raw.performanceFunction }),
    before: toPeriod(raw.before),
    after: toPeriod(raw.after),
  };
}

function toComparisonSite(raw: RawComparisonSite): ComparisonSite {
  return { id: raw.id, ...(raw.group !== undefined && { group: raw.group }), before: toPeriod(raw.before), after: toPeriod(raw.after) };
}

function toPeriod(raw: RawPeriod): StudyPeriod {
  // Both ends count: a period from 1 January to 31 December is a whole year.
  const days = parseIsoDay(raw.to)! - parseIsoDay(raw.from)! + 1;
  return {
    from: raw.from,
    to: raw.to,
    years: days / DAYS_PER_YEAR,
    ...(raw.aadt !== undefined && { aadt: raw.aadt }),
    ...(raw.crashes !== undefined && { crashes: completeCrashMatrix(raw.crashes) }),
  };
}
