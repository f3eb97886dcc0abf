import { avoidedOverSpans } from "../../model/avoidedOverSpans.js";
import { CELL_COUNT, drawBaselineCells } from "../../model/baselineDraws.js";
import { sampleLognormal } from "../../model/random/lognormalFromMeanSd.js";
import type { RandomSource } from "../../model/random/pcg32.js";
import { SEVERITIES, type Economics } from "../../model/types.js";
import type { DrawTables } from "./drawTables.js";

/** Every alternative's K+A crashes avoided and benefit PV in one draw, flat (see DrawTables.offsets). */
export interface DrawnFigures {
  readonly ksiAvoided: Float64Array;
  readonly benefitPV: Float64Array;
}

/**
 * One draw: every uncertain CMF from its lognormal (catalogue order), then each site's baseline
 * by its own method (site order), then every alternative's figures through the model's own
 * avoidedOverSpans, on the same numbers in the same order as the plan evaluates them, so a draw
 * whose factors were all 1 would reproduce the plan exactly. Costs do not change between draws.
 * With `benefitNeeded` (1 per flat alternative index that needs it), the others get only their
 * K+A avoided, from their K and A cells (the same sums), and benefit NaN: a K+A objective needs
 * benefits for the plan's own list only.
 */
export function drawFigures(tables: DrawTables, economics: Economics, random: RandomSource, benefitNeeded?: Uint8Array): DrawnFigures {
  const effectCmf = tables.pointCmf.slice();
  tables.drawnEffects.forEach((effect, k) => (effectCmf[effect] = sampleLognormal(random, tables.lognormals[k]!)));
  const costPerCrash = Float64Array.from(SEVERITIES, (severity) => economics.crashCosts.perCrash[severity]);
  const total = tables.offsets[tables.offsets.length - 1]!;
  const figures: DrawnFigures = { ksiAvoided: new Float64Array(total), benefitPV: new Float64Array(total) };
  const siteCells = new Float64Array(CELL_COUNT);
  const actingExpected = new Float64Array(CELL_COUNT);
  const actingSeverity = new Int32Array(CELL_COUNT);
  const cmfs = new Float64Array(CELL_COUNT * tables.maxTreatments);
  const active = new Float64Array(tables.maxTreatments);
  const out = { ksiAvoided: 0, benefitPV: 0 };
  for (const site of tables.sites) {
    if (site.baseline === undefined) siteCells.set(site.pointCells);
    else if (!drawBaselineCells(site.baseline, random, siteCells)) siteCells.set(site.pointCells);
    let at = tables.offsets[site.group]!;
    for (const alternative of site.alternatives) {
      const { actingCells, effects } = alternative;
      for (let j = 0; j < actingCells.length; j += 1) {
        actingExpected[j] = siteCells[actingCells[j]!]!;
        actingSeverity[j] = actingCells[j]! % SEVERITIES.length;
      }
      for (let k = 0; k < effects.length; k += 1) cmfs[k] = effects[k]! < 0 ? 1 : effectCmf[effects[k]!]!;
      const full = benefitNeeded === undefined || benefitNeeded[at] === 1;
      avoidedOverSpans(alternative.spans, full ? actingCells.length : alternative.ksiCellCount, actingExpected, actingSeverity, cmfs, economics.cmfCombination, costPerCrash, active, out);
      figures.ksiAvoided[at] = out.ksiAvoided;
      figures.benefitPV[at] = full ? out.benefitPV : Number.NaN;
      at += 1;
    }
  }
  return figures;
}
