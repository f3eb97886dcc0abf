import { baselineDrawPlan, CELL_COUNT, flatCells, type BaselineDrawPlan } from "../../model/baselineDraws.js";
import { lognormalFromMeanSd, type LognormalParameters } from "../../model/random/lognormalFromMeanSd.js";
import { assumedCmfCv, drawnStandardError } from "../../model/sampleTreatmentCmfs.js";
import { serviceSpans, type ServiceSpans } from "../../model/serviceSpans.js";
import { windowYears } from "../../model/siteBaselines.js";
import { CRASH_TYPES, KSI_SEVERITIES, SEVERITIES } from "../../model/types.js";
import type { PreparedPlan } from "../preparePlan.js";

/**
 * One alternative as the draws evaluate it: its service spans, and the crash cells that can hold
 * crashes in some draw and where at least one of its treatments acts, with the effect setting
 * treatment i's CMF in acting cell j at `effects[j × n + i]` (−1: none, CMF 1). In the other
 * cells every CMF is 1, or no crash is expected, in every draw, so they avoid nothing and are skipped.
 */
export interface DrawAlternative {
  readonly spans: ServiceSpans;
  /** Acting cells, the K and A ones first (each severity's cells stay in cell order, so its sums are unchanged). */
  readonly actingCells: Int32Array;
  /** How many of the acting cells are K or A: all that K+A avoided needs. */
  readonly ksiCellCount: number;
  readonly effects: Int32Array;
}

/** One site with alternatives, as the draws see it. */
export interface DrawSite {
  /** Index of the site in the prepared plan (the programme's group). */
  readonly group: number;
  /** Drawn baseline; undefined when baselines are held at their point estimates. */
  readonly baseline: BaselineDrawPlan | undefined;
  /** The plan's expected crashes per year, CELL_COUNT flat cells. */
  readonly pointCells: Float64Array;
  readonly alternatives: readonly DrawAlternative[];
}

/**
 * Everything about the uncertainty draws that does not change between them, built once: the
 * CMF of every catalogue effect and the lognormal of each one drawn (catalogue order, the order
 * the random stream is used in), which effect sets each treatment's CMF in each crash cell, and
 * per site its baseline draw plan, cells and alternatives' service spans. A draw is then
 * arithmetic on these (see drawFigures), with no objects rebuilt.
 */
export interface DrawTables {
  readonly pointCmf: Float64Array;
  /** Indices (into pointCmf) of the effects drawn in each draw, in stream order, and their lognormals. */
  readonly drawnEffects: Int32Array;
  readonly lognormals: readonly LognormalParameters[];
  /** cellEffect[treatment × CELL_COUNT + cell]: the effect whose CMF applies, −1 for none (CMF 1). */
  readonly cellEffect: Int32Array;
  readonly sites: readonly DrawSite[];
  /** The most treatments any alternative combines (scratch sizes). */
  readonly maxTreatments: number;
  /** Offset of each group's first alternative in the draws' flat figures; the last entry is the total. */
  readonly offsets: Int32Array;
}

/** The draw tables of a prepared plan; `sampleBaselines` false holds every baseline at its point estimate. */
export function buildDrawTables(prepared: PreparedPlan, sampleBaselines: boolean): DrawTables {
  const { scenario } = prepared;
  const treatments = scenario.catalogue.treatments;
  const cv = assumedCmfCv(scenario);
  const effects = treatments.flatMap((treatment) => treatment.effects);
  const pointCmf = Float64Array.from(effects, (effect) => effect.cmf);
  const drawn = effects.flatMap((effect, index) => (drawnStandardError(effect, cv) > 0 ? [index] : []));
  const lognormals = drawn.map((index) => lognormalFromMeanSd(effects[index]!.cmf, drawnStandardError(effects[index]!, cv)));

  // The first effect of a treatment that covers a cell sets its CMF there (as treatmentCmf).
  const cellEffect = new Int32Array(treatments.length * CELL_COUNT).fill(-1);
  let effectIndex = 0;
  treatments.forEach((treatment, t) => {
    for (const effect of treatment.effects) {
      CRASH_TYPES.forEach((type, y) =>
        SEVERITIES.forEach((severity, s) => {
          const at = t * CELL_COUNT + y * SEVERITIES.length + s;
          if (cellEffect[at] === -1 && effect.crashTypes.includes(type) && effect.severities.includes(severity)) cellEffect[at] = effectIndex;
        }),
      );
      effectIndex += 1;
    }
  });

  const treatmentIndex = new Map(treatments.map((treatment, index) => [treatment.id, index]));
  const years = windowYears(scenario);
  const performanceFunctions = new Map(scenario.catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
  const offsets = new Int32Array(prepared.sites.length + 1);
  const sites: DrawSite[] = [];
  prepared.sites.forEach((entry, group) => {
    offsets[group + 1] = offsets[group]! + entry.alternatives.length;
    if (entry.alternatives.length === 0) return;
    const point = prepared.baselines[group]!;
    if (point.site !== entry.site.id) throw new RangeError(`baselines and sites are out of step at ${entry.site.id}`);
    const spf = entry.site.performanceFunction === undefined ? undefined : performanceFunctions.get(entry.site.performanceFunction);
    const baseline = sampleBaselines ? baselineDrawPlan(point, entry.site, years, spf) : undefined;
    const pointCells = flatCells(point.expectedPerYear);
    const cells: number[] = [];
    for (let c = 0; c < CELL_COUNT; c += 1) if (pointCells[c] !== 0 || (baseline !== undefined && baseline.cells[c] !== 0)) cells.push(c);
    sites.push({
      group,
      baseline,
      pointCells,
      alternatives: entry.alternatives.map((alternative) => {
        const ids = alternative.treatments.map((id) => treatmentIndex.get(id)!);
        const acting = cells.filter((cell) => ids.some((t) => cellEffect[t * CELL_COUNT + cell] !== -1));
        const isKsi = (cell: number) => KSI_SEVERITIES.includes(SEVERITIES[cell % SEVERITIES.length]!);
        const actingCells = [...acting.filter(isKsi), ...acting.filter((cell) => !isKsi(cell))];
        const effects = actingCells.flatMap((cell) => ids.map((t) => cellEffect[t * CELL_COUNT + cell]!));
        const spans = serviceSpans(ids.map((t) => treatments[t]!.serviceLifeYears), scenario.economics, point.crashGrowthPerYear);
        return { spans, actingCells: Int32Array.from(actingCells), ksiCellCount: acting.filter(isKsi).length, effects: Int32Array.from(effects) };
      }),
    });
  });
  let maxTreatments = 1;
  for (const entry of prepared.sites) for (const alternative of entry.alternatives) maxTreatments = Math.max(maxTreatments, alternative.treatments.length);
  return { pointCmf, drawnEffects: Int32Array.from(drawn), lognormals, cellEffect, sites, maxTreatments, offsets };
}
