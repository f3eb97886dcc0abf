import { sumCrashMatrix, totalsBySeverity } from "./crashMatrix.js";
import { empiricalBayesCrashesPerYear } from "./empiricalBayesCrashesPerYear.js";
import { empiricalBayesPosterior } from "./empiricalBayesPosterior.js";
import { sampleGamma } from "./random/sampleGamma.js";
import type { RandomSource } from "./random/pcg32.js";
import type { SiteBaseline } from "./siteBaselines.js";
import { CRASH_TYPES, KSI_SEVERITIES, SEVERITIES, type CrashMatrix, type CrashType, type SafetyPerformanceFunction, type Severity, type Site } from "./types.js";

/** Crash cells in a flat array: cell t × 5 + s for crash type t and severity s (CRASH_TYPES and SEVERITIES order). */
export const CELL_COUNT = CRASH_TYPES.length * SEVERITIES.length;

/**
 * How one site's baseline is drawn, worked out once for every draw: plain numbers only.
 * - observed: severity s has its rate drawn from Gamma(`shapes[s]`, `rate`); cell c is
 *   `cells[c]` × the rate of its severity;
 * - scaled (Empirical Bayes): one Gamma(`shapes[0]`, `rate`) draw ÷ its mean scales every cell of `cells`;
 * - fixed: `cells` in every draw.
 */
export interface BaselineDrawPlan {
  readonly kind: "observed" | "scaled" | "fixed";
  readonly shapes: readonly number[];
  readonly rate: number;
  readonly cells: Float64Array;
}

/** Half a crash: the shape the Jeffreys prior adds to a Poisson count. */
const JEFFREYS_SHAPE = 0.5;

/** The draw plan of a site's baseline by its method (see BASELINE_SAMPLING_RULE in sampleSiteBaseline). */
export function baselineDrawPlan(baseline: SiteBaseline, site: Site, windowYears: number, spf?: SafetyPerformanceFunction): BaselineDrawPlan {
  if (baseline.method === "observed") {
    const counts = totalsBySeverity(site.crashes);
    return { kind: "observed", shapes: SEVERITIES.map((s) => counts[s] + JEFFREYS_SHAPE), rate: windowYears, cells: observedCellShares(site.crashes, counts) };
  }
  if (baseline.method === "empirical-bayes") {
    if (spf === undefined) throw new RangeError(`site ${site.id} has an Empirical Bayes baseline but no performance function was given`);
    const estimate = empiricalBayesCrashesPerYear(site, spf, windowYears);
    const posterior = empiricalBayesPosterior(estimate.predictedPerYear, estimate.overdispersion, sumCrashMatrix(site.crashes), windowYears);
    return { kind: "scaled", shapes: [posterior.shape], rate: posterior.rate, cells: flatCells(baseline.expectedPerYear) };
  }
  return { kind: "fixed", shapes: [], rate: 0, cells: flatCells(baseline.expectedPerYear) };
}

/** The expected crashes per year of one draw of `plan` into `out` (CELL_COUNT cells); false when the plan is fixed. */
export function drawBaselineCells(plan: BaselineDrawPlan, random: RandomSource, out: Float64Array): boolean {
  if (plan.kind === "observed") {
    // Every severity draws, in KABCO order, whether or not it saw crashes: one fixed use of the stream.
    const rates = plan.shapes.map((shape) => sampleGamma(random, shape, plan.rate));
    for (let c = 0; c < CELL_COUNT; c += 1) out[c] = plan.cells[c]! * rates[c % SEVERITIES.length]!;
    return true;
  }
  if (plan.kind === "scaled") {
    const shape = plan.shapes[0]!;
    const scale = sampleGamma(random, shape, plan.rate) / (shape / plan.rate);
    for (let c = 0; c < CELL_COUNT; c += 1) out[c] = plan.cells[c]! * scale;
    return true;
  }
  out.set(plan.cells);
  return false;
}

/** A crash matrix as CELL_COUNT flat cells. */
export function flatCells(matrix: CrashMatrix): Float64Array {
  const cells = new Float64Array(CELL_COUNT);
  CRASH_TYPES.forEach((type, t) => SEVERITIES.forEach((severity, s) => (cells[t * SEVERITIES.length + s] = matrix[type][severity])));
  return cells;
}

// Each cell's share of its severity's drawn rate: its own share of that severity's crashes, or
// for a severity with none, the site's crash-type mix of the same group (K+A, or B+C+O), else of
// all its crashes, else an even spread.
function observedCellShares(crashes: CrashMatrix, counts: Record<Severity, number>): Float64Array {
  const groupMix = { ksi: typeMix(crashes, KSI_SEVERITIES), other: typeMix(crashes, SEVERITIES.filter((s) => !KSI_SEVERITIES.includes(s))) };
  const allMix = typeMix(crashes, SEVERITIES);
  const cells = new Float64Array(CELL_COUNT);
  CRASH_TYPES.forEach((type, t) =>
    SEVERITIES.forEach((severity, s) => {
      const n = counts[severity];
      const mix = (KSI_SEVERITIES.includes(severity) ? groupMix.ksi : groupMix.other) ?? allMix;
      cells[t * SEVERITIES.length + s] = n > 0 ? crashes[type][severity] / n : mix === undefined ? 1 / CRASH_TYPES.length : mix[type];
    }),
  );
  return cells;
}

/** Each crash type's share of the site's crashes of these severities, or undefined when it has none. */
function typeMix(crashes: CrashMatrix, severities: readonly Severity[]): Record<CrashType, number> | undefined {
  const total = sumCrashMatrix(crashes, severities);
  if (total === 0) return undefined;
  const mix = {} as Record<CrashType, number>;
  for (const type of CRASH_TYPES) mix[type] = severities.reduce((sum, severity) => sum + crashes[type][severity], 0) / total;
  return mix;
}
