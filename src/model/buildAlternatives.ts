import { cellCmfTable } from "./cellCmfTable.js";
import { countTreatmentSets } from "./countTreatmentSets.js";
import { MAX_ALTERNATIVES_PER_SITE, MAX_ALTERNATIVES_TOTAL } from "./countAlternatives.js";
import { enumerateTreatmentSets } from "./enumerateTreatmentSets.js";
import { evaluateAlternative } from "./evaluateAlternative.js";
import type { SiteBaseline } from "./siteBaselines.js";
import { siteTreatmentSetRules } from "./siteTreatmentSetRules.js";
import type { Alternative, Scenario, Site } from "./types.js";

/** A site with the alternatives the optimiser may choose from. */
export interface SiteAlternatives {
  readonly site: Site;
  readonly alternatives: readonly Alternative[];
  /** A must-fund rule names this site: one of its alternatives must be chosen. */
  readonly required: boolean;
  /** Why the site has no alternatives, when it has none (e.g. a never-fund rule). */
  readonly excludedBy?: string;
}

/**
 * Every site's alternatives: the combinations its candidates allow under exclusivity, the
 * per-site limit and the must-fund / never-fund rules, each evaluated against the site's baseline.
 * The sets are counted before any is built: more than MAX_ALTERNATIVES_PER_SITE at a site or
 * MAX_ALTERNATIVES_TOTAL in all is a RangeError (the loader refuses such scenarios first, with
 * the site's line), so no scenario can exhaust memory here.
 */
export function buildAlternatives(scenario: Scenario, baselines: readonly SiteBaseline[]): SiteAlternatives[] {
  const treatments = new Map(scenario.catalogue.treatments.map((t) => [t.id, t]));
  const baselineBySite = new Map(baselines.map((baseline) => [baseline.site, baseline]));
  const rules = scenario.sites.map((site) => siteTreatmentSetRules(scenario, site, treatments));
  let total = 0;
  rules.forEach((rule, index) => {
    if (rule.excludedBy !== undefined) return;
    const count = countTreatmentSets(rule.candidates, rule.limits);
    if (count > MAX_ALTERNATIVES_PER_SITE) throw new RangeError(`site ${scenario.sites[index]!.id} has ${count} alternatives, more than ${MAX_ALTERNATIVES_PER_SITE}`);
    total += count;
  });
  if (total > MAX_ALTERNATIVES_TOTAL) throw new RangeError(`the sites have ${total} alternatives in all, more than ${MAX_ALTERNATIVES_TOTAL}`);
  // The same CMFs as treatmentCmf, looked up per cell instead of searched through the effects each time.
  const cellCmf = cellCmfTable(scenario.catalogue.treatments);
  return scenario.sites.map((site, index) => {
    const rule = rules[index]!;
    if (rule.excludedBy !== undefined) {
      // A must-fund rule on the same site stays required, so the solver reports the conflict instead of hiding it.
      return { site, alternatives: [], required: rule.required, excludedBy: rule.excludedBy };
    }
    const sets = enumerateTreatmentSets(rule.candidates, rule.limits);
    const baseline = baselineBySite.get(site.id);
    if (!baseline) throw new RangeError(`no baseline for site ${site.id}`);
    return {
      site,
      alternatives: sets.map((set) => evaluateAlternative(site, set, baseline.expectedPerYear, scenario.economics, cellCmf, baseline.crashGrowthPerYear)),
      required: rule.required,
    };
  });
}
