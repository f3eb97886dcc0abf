import { planProgramme } from "../src/analysis/planProgramme.js";
import { preparePlan } from "../src/analysis/preparePlan.js";
import { crossCheckScenario } from "./crossCheckScenario.js";
import { referenceOptimum, referenceViolations, type ReferenceOption } from "./referenceOptimum.js";

/** How averta's plan and the independent reference compare on one seeded scenario. */
export interface CrossCheckCase {
  readonly seed: number;
  readonly sites: number;
  readonly options: number;
  readonly rules: readonly string[];
  readonly avertaStatus: string;
  readonly referenceStatus: string;
  readonly avertaObjective: number;
  readonly referenceObjective: number;
  /** |averta − reference| / max(1, |reference|), 0 when either has no list. */
  readonly relativeDifference: number;
  /** Rules or budget broken by averta's list, by the reference's own test (empty when none). */
  readonly avertaViolations: readonly string[];
  /** Averta's alternatives are not the reference's allowed treatment sets. */
  readonly enumerationDiffers: boolean;
  readonly engine: string;
  readonly objective: string;
  /** Some site lists two candidates of one exclusive group. */
  readonly exclusive: boolean;
  /** Some spending rule names neither a district nor a tag (the whole programme). */
  readonly wholeProgramme: boolean;
}

/** Totals over a cross-check run, with the targets beside them (all 0). */
export interface CrossCheckSummary {
  readonly cases: number;
  readonly withKsiShareFloor: number;
  readonly infeasible: number;
  /** Cases the reference could not decide in its time (no proof): not compared by status, only by value. */
  readonly referenceUndecided: number;
  readonly statusMismatches: number;
  readonly objectiveMismatches: number;
  readonly infeasibleAnswers: number;
  readonly enumerationMismatches: number;
  readonly referenceCuts: number;
  /** Scenarios with each kind of rule, and with exclusive groups, whole-programme rules and each objective. */
  readonly coverage: Readonly<Record<string, number>>;
}

/** Objectives must agree within this relative difference. */
export const CROSS_CHECK_OBJECTIVE_TOLERANCE = 1e-6;

/** Runs averta (default engine) and the independent reference on one seeded scenario. */
export async function crossCheckCase(seed: number, timeLimitSeconds = 120): Promise<CrossCheckCase & { readonly referenceCuts: number }> {
  const scenario = crossCheckScenario(seed);
  const prepared = preparePlan(scenario);
  const plan = await planProgramme(prepared, scenario.budget, { timeLimitSeconds });
  const reference = await referenceOptimum(scenario, scenario.budget, scenario.objective, timeLimitSeconds);
  const key = (site: string, treatments: readonly string[]): string => `${site}|${[...treatments].sort().join("+")}`;
  const averta = new Set(prepared.sites.flatMap((entry) => entry.alternatives.map((a) => key(a.site, a.treatments))));
  const independent = new Set(reference.options.flatMap((list) => list.map((o) => key(o.site, o.treatments))));
  const enumerationDiffers = averta.size !== independent.size || [...averta].some((k) => !independent.has(k));
  const bySet = new Map(reference.options.flatMap((list) => list.map((o) => [key(o.site, o.treatments), o] as const)));
  const picks: (ReferenceOption | null)[] = scenario.sites.map((site) => {
    const funded = plan.funded.find((project) => project.entry.site.id === site.id);
    return funded === undefined ? null : (bySet.get(key(site.id, funded.alternative.treatments)) ?? null);
  });
  const solved = plan.solution.status === "optimal" || plan.solution.status === "time-limit";
  const avertaObjective = plan.solution.objective;
  const both = solved && reference.status === "optimal";
  // Without a proof the reference's list is only a lower bound: averta's must be at least as good.
  const undecided = reference.status === "time-limit" || reference.status === "unsolved";
  return {
    seed,
    sites: scenario.sites.length,
    options: reference.options.reduce((n, list) => n + list.length, 0),
    rules: scenario.rules.map((r) => r.kind),
    avertaStatus: plan.solution.status,
    referenceStatus: reference.status,
    avertaObjective,
    referenceObjective: reference.objective,
    relativeDifference: both
      ? Math.abs(avertaObjective - reference.objective) / Math.max(1, Math.abs(reference.objective))
      : undecided && reference.status === "time-limit"
        ? Math.max(0, reference.objective - (solved ? avertaObjective : Number.NEGATIVE_INFINITY)) / Math.max(1, Math.abs(reference.objective))
        : 0,
    avertaViolations: solved ? referenceViolations(scenario, scenario.budget, picks) : [],
    enumerationDiffers,
    engine: plan.solution.engine,
    objective: scenario.objective,
    exclusive: scenario.sites.some((site) => {
      const groups = site.candidates.flatMap((id) => scenario.catalogue.treatments.find((t) => t.id === id)?.exclusiveGroup ?? []);
      return new Set(groups).size < groups.length;
    }),
    wholeProgramme: scenario.rules.some((r) => (r.kind === "spend-cap" || r.kind === "spend-floor") && r.district === undefined && r.tag === undefined),
    referenceCuts: reference.cutOff,
  };
}

/** Runs seeds first … first + count − 1 and counts every kind of disagreement. */
export async function runCrossCheck(first: number, count: number): Promise<{ summary: CrossCheckSummary; failures: CrossCheckCase[] }> {
  const failures: CrossCheckCase[] = [];
  let withKsiShareFloor = 0;
  let infeasible = 0;
  let statusMismatches = 0;
  let referenceUndecided = 0;
  let objectiveMismatches = 0;
  let infeasibleAnswers = 0;
  let enumerationMismatches = 0;
  let referenceCuts = 0;
  const coverage: Record<string, number> = {};
  const cover = (what: string): void => {
    coverage[what] = (coverage[what] ?? 0) + 1;
  };
  for (let seed = first; seed < first + count; seed += 1) {
    const result = await crossCheckCase(seed);
    for (const kind of new Set(result.rules)) cover(kind);
    if (result.exclusive) cover("exclusive groups");
    if (result.wholeProgramme) cover("whole-programme spending rule");
    cover(`objective ${result.objective}`);
    if (result.rules.includes("ksi-share-floor")) withKsiShareFloor += 1;
    if (result.referenceStatus === "infeasible") infeasible += 1;
    referenceCuts += result.referenceCuts;
    const undecided = result.referenceStatus === "time-limit" || result.referenceStatus === "unsolved";
    if (undecided) referenceUndecided += 1;
    const statusWrong = !undecided && result.avertaStatus !== result.referenceStatus;
    const objectiveWrong = result.relativeDifference > CROSS_CHECK_OBJECTIVE_TOLERANCE;
    const broken = result.avertaViolations.length > 0;
    if (statusWrong) statusMismatches += 1;
    if (objectiveWrong) objectiveMismatches += 1;
    if (broken) infeasibleAnswers += 1;
    if (result.enumerationDiffers) enumerationMismatches += 1;
    if (statusWrong || objectiveWrong || broken || result.enumerationDiffers || undecided) failures.push(result);
  }
  return {
    summary: { cases: count, withKsiShareFloor, infeasible, referenceUndecided, statusMismatches, objectiveMismatches, infeasibleAnswers, enumerationMismatches, referenceCuts, coverage },
    failures,
  };
}

/** The summary as plain text, each count beside its target. */
export function formatCrossCheck(summary: CrossCheckSummary): string {
  return [
    `  scenarios: ${summary.cases} (${summary.withKsiShareFloor} with a K+A share floor, ${summary.infeasible} infeasible by the reference)`,
    `  status mismatches: ${summary.statusMismatches} (target 0)`,
    `  cases the reference could not decide within its time limit (compared by value only): ${summary.referenceUndecided}`,
    `  objective mismatches (> ${CROSS_CHECK_OBJECTIVE_TOLERANCE} relative): ${summary.objectiveMismatches} (target 0)`,
    `  lists breaking a rule: ${summary.infeasibleAnswers} (target 0)`,
    `  alternative enumeration mismatches: ${summary.enumerationMismatches} (target 0)`,
    `  reference answers cut off for breaking a rule within HiGHS's tolerance: ${summary.referenceCuts}`,
    `  scenarios with: ${Object.entries(summary.coverage).sort(([a], [b]) => (a < b ? -1 : 1)).map(([what, n]) => `${what} ${n}`).join(", ")}`,
  ].join("\n");
}
