import { planProgramme } from "../src/analysis/planProgramme.js";
import { preparePlan } from "../src/analysis/preparePlan.js";
import type { Scenario } from "../src/model/types.js";
import { programmeCrossCheckScenario } from "./programmeCrossCheckScenario.js";
import { programmeReference } from "./programmeReference.js";
import { programmeViolations, type ProgrammeReferenceOption } from "./programmeViolations.js";

/** How averta's programme and the independent reference compare on one seeded scenario. */
export interface ProgrammeCrossCheckCase {
  readonly seed: number;
  readonly sites: number;
  readonly years: number;
  readonly options: number;
  readonly rules: readonly string[];
  readonly avertaStatus: string;
  readonly referenceStatus: string;
  readonly avertaObjective: number;
  readonly referenceObjective: number;
  /** |averta − reference| / max(1, |reference|) when both have a proven list; else 0. */
  readonly relativeDifference: number;
  /** |averta's reported objective − its list valued by the reference's figures| / max(1, |reference|). */
  readonly listValueDifference: number;
  /** Conditions averta's list breaks by the independent checker (empty when none). */
  readonly avertaViolations: readonly string[];
  /** Averta's options (site, treatment set, build year) are not the reference's. */
  readonly enumerationDiffers: boolean;
  readonly figureMismatches: readonly string[];
  readonly referenceCuts: number;
  readonly avertaSeconds: number;
  readonly referenceSeconds: number;
  /** The features this case exercises (see runProgrammeCrossCheck's coverage). */
  readonly features: readonly string[];
}

/** Totals over a run, with the targets (0) beside the mismatches. */
export interface ProgrammeCrossCheckSummary {
  readonly cases: number;
  readonly withRules: number;
  readonly infeasible: number;
  /** Cases the reference could not prove in its time limit: compared by value only (averta ≥ its list). */
  readonly referenceUndecided: number;
  readonly statusMismatches: number;
  readonly objectiveMismatches: number;
  readonly infeasibleAnswers: number;
  readonly enumerationMismatches: number;
  readonly figureMismatches: number;
  readonly referenceCuts: number;
  readonly largestSites: number;
  readonly largestOptions: number;
  readonly avertaSeconds: number;
  readonly referenceSeconds: number;
  /** Cases with each feature: carry-over rules, escalation, phasing, committed projects, windows, rule kinds, objectives. */
  readonly coverage: Readonly<Record<string, number>>;
}

/** Objectives must agree within this relative difference (averta's optimality promise, README). */
export const PROGRAMME_OBJECTIVE_TOLERANCE = 1e-9;

const key = (site: string, treatments: readonly string[], year: number | undefined): string => `${site}|${[...treatments].sort().join("+")}|${year}`;

/** Runs averta (planProgramme, default engine) and the independent reference on one seeded programme (or a variant of it). */
export async function programmeCrossCheckCase(seed: number, timeLimitSeconds = 60, scenario: Scenario = programmeCrossCheckScenario(seed)): Promise<ProgrammeCrossCheckCase> {
  const started = performance.now();
  const prepared = preparePlan(scenario);
  const plan = await planProgramme(prepared, scenario.budget, { timeLimitSeconds });
  const avertaSeconds = (performance.now() - started) / 1000;
  const reference = await programmeReference(scenario, timeLimitSeconds);
  const averta = new Set(prepared.sites.flatMap((entry) => entry.alternatives.map((a) => key(a.site, a.treatments, a.buildYear))));
  const independent = new Map(reference.options.flatMap((list) => list.map((o) => [key(o.site, o.treatments, o.buildYear), o] as const)));
  const enumerationDiffers = averta.size !== independent.size || [...averta].some((k) => !independent.has(k));
  const solved = plan.solution.status === "optimal" || plan.solution.status === "time-limit";
  const unknown: string[] = [];
  const picks: (ProgrammeReferenceOption | null)[] = scenario.sites.map((site) => {
    const funded = plan.funded.find((project) => project.entry.site.id === site.id);
    if (funded === undefined) return null;
    const option = independent.get(key(site.id, funded.alternative.treatments, funded.alternative.buildYear));
    if (option === undefined) unknown.push(`${site.id}: ${funded.alternative.treatments.join("+")} in ${funded.alternative.buildYear} is no allowed option`);
    return option ?? null;
  });
  const value = (o: ProgrammeReferenceOption | null): number => (o === null ? 0 : scenario.objective === "ksi" ? o.ksiAvoided : o.benefitPV);
  const avertaObjective = plan.solution.objective;
  const scale = Math.max(1, Math.abs(reference.objective));
  const both = solved && reference.status === "optimal";
  // Without a proof the reference's list is only a lower bound: averta's must be at least as good.
  const shortfall = reference.status === "time-limit" ? Math.max(0, reference.objective - (solved ? avertaObjective : Number.NEGATIVE_INFINITY)) / scale : 0;
  return {
    seed,
    sites: scenario.sites.length,
    years: scenario.programme!.years,
    options: independent.size,
    rules: scenario.rules.map((r) => r.kind),
    avertaStatus: plan.solution.status,
    referenceStatus: reference.status,
    avertaObjective,
    referenceObjective: reference.objective,
    relativeDifference: both ? Math.abs(avertaObjective - reference.objective) / scale : shortfall,
    listValueDifference: solved ? Math.abs(avertaObjective - picks.reduce((t, o) => t + value(o), 0)) / scale : 0,
    avertaViolations: solved ? [...unknown, ...programmeViolations(scenario, picks)] : [],
    enumerationDiffers,
    figureMismatches: reference.figureMismatches,
    referenceCuts: reference.cutOff,
    avertaSeconds,
    referenceSeconds: reference.seconds,
    features: features(scenario, reference.phasingExcluded, solved ? picks : []),
  };
}

function features(scenario: Scenario, phasingExcluded: number, picks: readonly (ProgrammeReferenceOption | null)[]): string[] {
  const programme = scenario.programme!;
  const catalogue = new Map(scenario.catalogue.treatments.map((t) => [t.id, t]));
  const lead = (ids: readonly string[]): number => Math.max(0, ...ids.flatMap((id) => (catalogue.get(id)?.phasing ?? []).map((p) => p.yearsBeforeBuild)));
  const chosen = picks.filter((o): o is ProgrammeReferenceOption => o !== null);
  const spendRules = scenario.rules.flatMap((r) => (r.kind === "spend-cap" || r.kind === "spend-floor" ? [r] : []));
  const list: [string, boolean][] = [
    [`carry-over ${programme.carryOver}`, true],
    [`objective ${scenario.objective}`, true],
    [`renewal ${scenario.economics.renewal ?? "none"}`, true],
    ["with rules", scenario.rules.length > 0],
    ["cost escalation", programme.costEscalationRate > 0],
    ["traffic growth", (scenario.economics.trafficGrowthRate ?? 0) > 0],
    ["phasing", scenario.sites.some((site) => lead(site.candidates) > 0)],
    ["options ruled out by phasing", phasingExcluded > 0],
    ["committed project", programme.committed.length > 0],
    ["committed spend before the first year", programme.committed.some((p) => lead(p.treatments) > p.year - programme.firstYear)],
    ["site windows", scenario.sites.some((site) => site.earliestYear !== undefined || site.latestYear !== undefined)],
    ["a year with no budget", programme.budgets.some((b) => b === 0)],
    ["spend rule for one year", spendRules.some((r) => r.year !== undefined)],
    ["spend share rule", spendRules.some((r) => r.share !== undefined)],
    ["whole-programme spend rule", spendRules.some((r) => r.district === undefined && r.tag === undefined)],
    ["answer builds after the first year", chosen.some((o) => o.buildYear > programme.firstYear)],
    ["answer spends before a build year", chosen.some((o) => o.spendByYear.some((v, y) => v > 0 && programme.firstYear + y < o.buildYear))],
    [`${scenario.sites.length} sites × ${programme.years} years`, scenario.sites.length >= 300],
    ...[...new Set(scenario.rules.map((r) => r.kind))].map((kind): [string, boolean] => [kind, true]),
  ];
  return list.filter(([, on]) => on).map(([what]) => what);
}

/** Runs seeds first … first + count − 1 and counts every kind of disagreement. */
export async function runProgrammeCrossCheck(first: number, count: number, timeLimitSeconds = 60): Promise<{ summary: ProgrammeCrossCheckSummary; failures: ProgrammeCrossCheckCase[]; cases: ProgrammeCrossCheckCase[] }> {
  const cases: ProgrammeCrossCheckCase[] = [];
  for (let seed = first; seed < first + count; seed += 1) cases.push(await programmeCrossCheckCase(seed, timeLimitSeconds));
  const counted = (test: (c: ProgrammeCrossCheckCase) => boolean): number => cases.filter(test).length;
  const undecided = (c: ProgrammeCrossCheckCase): boolean => c.referenceStatus === "time-limit" || c.referenceStatus === "unsolved";
  const statusWrong = (c: ProgrammeCrossCheckCase): boolean => !undecided(c) && c.avertaStatus !== c.referenceStatus;
  const objectiveWrong = (c: ProgrammeCrossCheckCase): boolean => c.relativeDifference > PROGRAMME_OBJECTIVE_TOLERANCE || c.listValueDifference > PROGRAMME_OBJECTIVE_TOLERANCE;
  const coverage: Record<string, number> = {};
  for (const c of cases) for (const what of c.features) coverage[what] = (coverage[what] ?? 0) + 1;
  const summary: ProgrammeCrossCheckSummary = {
    cases: count,
    withRules: counted((c) => c.rules.length > 0),
    infeasible: counted((c) => c.referenceStatus === "infeasible"),
    referenceUndecided: counted(undecided),
    statusMismatches: counted(statusWrong),
    objectiveMismatches: counted(objectiveWrong),
    infeasibleAnswers: counted((c) => c.avertaViolations.length > 0),
    enumerationMismatches: counted((c) => c.enumerationDiffers),
    figureMismatches: counted((c) => c.figureMismatches.length > 0),
    referenceCuts: cases.reduce((t, c) => t + c.referenceCuts, 0),
    largestSites: Math.max(...cases.map((c) => c.sites)),
    largestOptions: Math.max(...cases.map((c) => c.options)),
    avertaSeconds: cases.reduce((t, c) => t + c.avertaSeconds, 0),
    referenceSeconds: cases.reduce((t, c) => t + c.referenceSeconds, 0),
    coverage,
  };
  const failures = cases.filter((c) => statusWrong(c) || objectiveWrong(c) || c.avertaViolations.length > 0 || c.enumerationDiffers || c.figureMismatches.length > 0 || undecided(c));
  return { summary, failures, cases };
}

/** The summary as lines for `npm run bench`, each count beside its target. */
export function formatProgrammeCrossCheck(summary: ProgrammeCrossCheckSummary): string {
  return [
    `  programmes: ${summary.cases} (${summary.withRules} with rules, ${summary.infeasible} infeasible by the reference; up to ${summary.largestSites} sites, ${summary.largestOptions} options)`,
    `  status mismatches: ${summary.statusMismatches} (target 0)`,
    `  cases the reference could not decide within its time limit: ${summary.referenceUndecided} (target 0)`,
    `  objective mismatches (> ${PROGRAMME_OBJECTIVE_TOLERANCE} relative): ${summary.objectiveMismatches} (target 0)`,
    `  programmes breaking a rule or a year budget: ${summary.infeasibleAnswers} (target 0)`,
    `  option enumeration / spend-by-year mismatches: ${summary.enumerationMismatches} / ${summary.figureMismatches} (target 0)`,
    `  seconds: averta ${summary.avertaSeconds.toFixed(1)}, reference ${summary.referenceSeconds.toFixed(1)}`,
    `  programmes with: ${Object.entries(summary.coverage).sort(([a], [b]) => (a < b ? -1 : 1)).map(([what, n]) => `${what} ${n}`).join(", ")}`,
  ].join("\n");
}
