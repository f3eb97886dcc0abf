// The straightforward uncertainty draw, kept as the reference the fast path (drawTables +
// drawFigures) is compared against: every treatment object rebuilt with drawn CMFs, every
// baseline drawn as a crash matrix, every alternative re-evaluated by the model's own
// evaluateAlternative, exactly as the release before the fast path computed a draw.
import type { PreparedPlan } from "../../../src/analysis/preparePlan.js";
import type { DrawSettings } from "../../../src/analysis/uncertainty/drawSettings.js";
import type { SiteAlternatives } from "../../../src/model/buildAlternatives.js";
import { cellCmfTable } from "../../../src/model/cellCmfTable.js";
import { evaluateAlternative } from "../../../src/model/evaluateAlternative.js";
import { drawRandomSource } from "../../../src/model/random/drawRandomSource.js";
import { lognormalFromMeanSd, sampleLognormal } from "../../../src/model/random/lognormalFromMeanSd.js";
import type { RandomSource } from "../../../src/model/random/pcg32.js";
import { sampleSiteBaseline } from "../../../src/model/sampleSiteBaseline.js";
import { assumedCmfCv, drawnStandardError } from "../../../src/model/sampleTreatmentCmfs.js";
import { windowYears } from "../../../src/model/siteBaselines.js";
import type { Treatment } from "../../../src/model/types.js";

/**
 * The treatments with every uncertain CMF replaced by one lognormal draw whose mean is the
 * published CMF and whose standard deviation is `drawnStandardError`; effects held exact keep
 * their CMF. Effects are drawn in catalogue order.
 */
export function sampleTreatmentCmfs(treatments: readonly Treatment[], random: RandomSource, assumedCv: number | "off"): Treatment[] {
  return treatments.map((treatment) => {
    if (!treatment.effects.some((effect) => drawnStandardError(effect, assumedCv) > 0)) return treatment;
    return {
      ...treatment,
      effects: treatment.effects.map((effect) => {
        const standardError = drawnStandardError(effect, assumedCv);
        return standardError > 0 ? { ...effect, cmf: sampleLognormal(random, lognormalFromMeanSd(effect.cmf, standardError)) } : effect;
      }),
    };
  });
}

/** The prepared sites as they look in one draw: CMFs drawn first, then each site's baseline, then every alternative re-evaluated. */
export function referenceDrawSites(prepared: PreparedPlan, drawIndex: number, settings: Pick<DrawSettings, "seed" | "sampleBaselines">): SiteAlternatives[] {
  const { scenario } = prepared;
  const random = drawRandomSource(settings.seed, drawIndex);
  const sampled = sampleTreatmentCmfs(scenario.catalogue.treatments, random, assumedCmfCv(scenario));
  const treatments = new Map(sampled.map((t) => [t.id, t]));
  const cellCmf = cellCmfTable(sampled);
  const years = windowYears(scenario);
  const performanceFunctions = new Map(scenario.catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
  return prepared.sites.map((entry, index) => {
    if (entry.alternatives.length === 0) return entry;
    const baseline = prepared.baselines[index]!;
    const spf = entry.site.performanceFunction === undefined ? undefined : performanceFunctions.get(entry.site.performanceFunction);
    const expected = settings.sampleBaselines ? sampleSiteBaseline(baseline, entry.site, years, random, spf).expectedPerYear : baseline.expectedPerYear;
    const alternatives = entry.alternatives.map((alternative) =>
      evaluateAlternative(entry.site, alternative.treatments.map((id) => treatments.get(id) as Treatment), expected, scenario.economics, cellCmf, baseline.crashGrowthPerYear),
    );
    return { ...entry, alternatives };
  });
}
