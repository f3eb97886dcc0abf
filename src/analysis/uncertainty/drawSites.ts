import { cellCmfTable } from "../../model/cellCmfTable.js";
import { evaluateAlternative } from "../../model/evaluateAlternative.js";
import { drawRandomSource } from "../../model/random/drawRandomSource.js";
import { sampleSiteBaseline } from "../../model/sampleSiteBaseline.js";
import { assumedCmfCv, sampleTreatmentCmfs } from "../../model/sampleTreatmentCmfs.js";
import { windowYears } from "../../model/siteBaselines.js";
import type { SiteAlternatives } from "../../model/buildAlternatives.js";
import type { Treatment } from "../../model/types.js";
import type { PreparedPlan } from "../preparePlan.js";
import type { DrawSettings } from "./drawSettings.js";

/**
 * The prepared sites as they look in one uncertainty draw: CMFs drawn first (catalogue order,
 * effects without a standard error with the scenario's assumed CV), then each site's baseline
 * (site order) by that site's own method, and every alternative re-evaluated with the model's own
 * `evaluateAlternative`. Costs do not change between draws; the sets of treatments do not either.
 */
export function drawSites(prepared: PreparedPlan, drawIndex: number, settings: DrawSettings): SiteAlternatives[] {
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
    if (baseline.site !== entry.site.id) throw new RangeError(`baselines and sites are out of step at ${entry.site.id}`);
    const spf = entry.site.performanceFunction === undefined ? undefined : performanceFunctions.get(entry.site.performanceFunction);
    const expected = settings.sampleBaselines ? sampleSiteBaseline(baseline, entry.site, years, random, spf).expectedPerYear : baseline.expectedPerYear;
    const alternatives = entry.alternatives.map((alternative) =>
      evaluateAlternative(entry.site, alternative.treatments.map((id) => treatments.get(id) as Treatment), expected, scenario.economics, cellCmf, baseline.crashGrowthPerYear),
    );
    return { ...entry, alternatives };
  });
}
