import type { Treatment } from "../model/types.js";
import { closestName } from "./closestName.js";
import type { RawScenario } from "./loadScenario.js";
import { parseAmount, amountHint } from "./parseAmount.js";
import type { PathSegment } from "./readYamlFile.js";

type Problem = (code: string, path: PathSegment[], message: string, hint?: string) => void;

/** A money amount parseAmount accepts. */
export function checkAmount(value: number | string, path: PathSegment[], problem: Problem): void {
  if (parseAmount(value) === undefined) problem("bad-amount", path, `'${String(value)}' is not an amount`, typeof value === "string" ? amountHint(value) : "write 4500000, 4.5M or 750k");
}

/**
 * The budget and the programme block: one of `budget` or `programme` (whose budgets, one per year
 * or one for all, must parse), committed projects that name real sites and treatments in a
 * programme year, site build windows inside the programme, per-year rules inside it, and a
 * horizon long enough for its last year's projects to act.
 */
export function checkProgrammeBlock(raw: RawScenario, treatments: ReadonlyMap<string, Treatment>, problem: Problem): void {
  const programme = raw.programme;
  if (programme === undefined) {
    if (raw.budget === undefined) problem("schema", [], "missing required field 'budget'", "add 'budget:' here, or a programme: block with the budget of each year");
    else checkAmount(raw.budget, ["budget"], problem);
    raw.sites.forEach((site, index) => {
      for (const field of ["earliestYear", "latestYear"] as const) {
        if (site[field] !== undefined) problem("needs-programme", ["sites", index, field], `${field} only applies in a multi-year programme`, "add a programme: block, or remove it");
      }
    });
    for (const listName of ["spendCaps", "spendFloors"] as const) {
      (raw.rules?.[listName] ?? []).forEach((rule, index) => {
        if (rule.year !== undefined) problem("needs-programme", ["rules", listName, index, "year"], "a rule for one year only applies in a multi-year programme", "add a programme: block, or remove year");
      });
    }
    return;
  }
  if (raw.budget !== undefined) problem("rule-conflict", ["budget"], "a programme gives its budgets in programme.budgets", "remove budget:, or the programme: block");
  const { firstYear, years } = programme;
  const lastYear = firstYear + years - 1;
  const inProgramme = (year: number) => year >= firstYear && year <= lastYear;
  const span = `${firstYear}–${lastYear}`;
  if (Array.isArray(programme.budgets)) {
    if (programme.budgets.length !== years) {
      problem("budget-years", ["programme", "budgets"], `${programme.budgets.length} budget(s) for a ${years}-year programme`, `give one amount per year (${years}), or one amount for every year`);
    }
    programme.budgets.forEach((amount, index) => checkAmount(amount, ["programme", "budgets", index], problem));
  } else checkAmount(programme.budgets, ["programme", "budgets"], problem);
  if (raw.economics.horizonYears < years) {
    problem("horizon-short", ["economics", "horizonYears"], `the horizon (${raw.economics.horizonYears} years) is shorter than the ${years}-year programme, so its last years' projects would have no year of benefit`, `make horizonYears at least ${years}`);
  }

  const siteIds = new Map(raw.sites.map((site, index) => [site.id, index]));
  const neverFund = new Set((raw.rules?.neverFund ?? []).filter((rule) => (rule.treatments ?? []).length === 0).map((rule) => rule.site));
  const committedSites = new Set<string>();
  (programme.committed ?? []).forEach((project, index) => {
    const path: PathSegment[] = ["programme", "committed", index];
    const siteIndex = siteIds.get(project.site);
    if (siteIndex === undefined) {
      const guess = closestName(project.site, siteIds.keys());
      problem("unknown-id", [...path, "site"], `unknown site '${project.site}'`, guess ? `did you mean '${guess}'?` : "use a site id from sites");
    } else if (committedSites.has(project.site)) {
      problem("duplicate-id", [...path, "site"], `site '${project.site}' is committed twice`, "a site is treated at most once in a programme: keep one entry");
    } else if (neverFund.has(project.site)) {
      problem("rule-conflict", [...path, "site"], `site '${project.site}' is both committed and never-fund`, "remove one of the two");
    }
    committedSites.add(project.site);
    project.treatments.forEach((id, treatmentIndex) => {
      if (!treatments.has(id)) {
        const guess = closestName(id, treatments.keys());
        problem("unknown-id", [...path, "treatments", treatmentIndex], `unknown treatment '${id}'`, guess ? `did you mean '${guess}'?` : "add it to a catalogue, or check the catalogue list");
      }
    });
    if (siteIndex !== undefined) checkCommittedAtSite(raw, raw.sites[siteIndex]!, project, path, treatments, span, problem);
    if (!inProgramme(project.year)) {
      problem("year-outside", [...path, "year"], `${project.year} is not a year of the programme (${span})`, project.year < firstYear ? "a project built before the first year is no longer part of the programme: drop it from committed, and keep its site out with a neverFund rule, as the yearly routine in the README does" : `use a year from ${span}`);
    }
  });
  raw.sites.forEach((site, index) => {
    const earliest = site.earliestYear ?? firstYear;
    const latest = site.latestYear ?? lastYear;
    // Only a stated pair can be reversed; one stated year beyond the programme is outside it.
    if (site.earliestYear !== undefined && site.latestYear !== undefined && earliest > latest) problem("year-window", ["sites", index], `site '${site.id}' may be built from ${earliest} but only until ${latest}`, "make earliestYear no later than latestYear");
    else if (earliest > lastYear || latest < firstYear) problem("year-outside", ["sites", index], `site '${site.id}' may be built only ${statedWindow(site.earliestYear, site.latestYear)}, outside the programme (${span})`, "widen its earliestYear/latestYear, or remove them");
  });
  for (const listName of ["spendCaps", "spendFloors"] as const) {
    (raw.rules?.[listName] ?? []).forEach((rule, index) => {
      if (rule.year !== undefined && !inProgramme(rule.year)) problem("year-outside", ["rules", listName, index, "year"], `${rule.year} is not a year of the programme (${span})`, `use a year from ${span}`);
      if (rule.year !== undefined && rule.share !== undefined) problem("rule-amount", ["rules", listName, index], "a rule for one year takes an amount, not a share", "write amount: 1.2M");
    });
  }
}

function statedWindow(earliest: number | undefined, latest: number | undefined): string {
  if (earliest !== undefined && latest !== undefined) return `in ${earliest}–${latest}`;
  return earliest !== undefined ? `from ${earliest}` : `until ${latest}`;
}

type RawSite = RawScenario["sites"][number];
type RawCommitted = NonNullable<NonNullable<RawScenario["programme"]>["committed"]>[number];

/**
 * A committed project must be one the site could have had: treatments that apply to its kind (and,
 * costed per km, a length to cost them by), a year in the site's build window, and nothing a
 * must-fund or never-fund rule at the site contradicts (the project is kept whatever the rules say).
 */
function checkCommittedAtSite(raw: RawScenario, site: RawSite, project: RawCommitted, path: PathSegment[], treatments: ReadonlyMap<string, Treatment>, span: string, problem: Problem): void {
  project.treatments.forEach((id, treatmentIndex) => {
    const treatment = treatments.get(id);
    if (treatment === undefined) return; // reported as unknown
    const at: PathSegment[] = [...path, "treatments", treatmentIndex];
    if (!treatment.appliesTo.includes(site.kind)) problem("not-applicable", at, `treatment '${id}' does not apply to ${site.kind === "intersection" ? "an" : "a"} ${site.kind} (site '${site.id}')`, `it applies to: ${treatment.appliesTo.join(", ")}`);
    else if (treatment.cost.basis === "per-km" && site.lengthKm === undefined) problem("missing-length", at, `treatment '${id}' is costed per km but site '${site.id}' has no lengthKm`, "add lengthKm to the site");
  });
  const earliest = site.earliestYear;
  const latest = site.latestYear;
  if ((earliest !== undefined && project.year < earliest) || (latest !== undefined && project.year > latest)) {
    problem("year-window", [...path, "year"], `site '${site.id}' is committed to ${project.year} but may be built only ${statedWindow(earliest, latest)}`, `move the project into the site's window (within ${span}), or change its earliestYear/latestYear`);
  }
  for (const rule of raw.rules?.mustFund ?? []) {
    const missing = (rule.treatments ?? []).filter((id) => !project.treatments.includes(id));
    if (rule.site === site.id && missing.length > 0) problem("rule-conflict", [...path, "treatments"], `site '${site.id}' must be funded with ${missing.join(", ")}, which its committed project does not include`, "add them to the committed project, or remove the must-fund rule");
  }
  for (const rule of raw.rules?.neverFund ?? []) {
    const barred = (rule.treatments ?? []).filter((id) => project.treatments.includes(id));
    if (rule.site === site.id && barred.length > 0) problem("rule-conflict", [...path, "treatments"], `the committed project at '${site.id}' includes ${barred.join(", ")}, which a never-fund rule bars there`, "remove one of the two");
  }
}
