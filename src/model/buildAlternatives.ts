import { cellCmfTable } from "./cellCmfTable.js";
import { countTreatmentSets } from "./countTreatmentSets.js";
import { MAX_ALTERNATIVES_PER_SITE, MAX_ALTERNATIVES_TOTAL } from "./countAlternatives.js";
import { enumerateTreatmentSets } from "./enumerateTreatmentSets.js";
import { alternativesOverBuildYears } from "./alternativesOverBuildYears.js";
import { buildYears } from "./buildYears.js";
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
 * per-site limit and the must-fund / never-fund rules, each evaluated against the site's baseline;
 * in a programme, each in every year the site may be built (a committed site has its one project).
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
    const years = scenario.programme === undefined ? 1 : buildYears(scenario.sites[index]!, scenario.programme).length;
    const count = countTreatmentSets(rule.candidates, rule.limits) * years;
    if (count > MAX_ALTERNATIVES_PER_SITE) throw new RangeError(`site ${scenario.sites[index]!.id} has ${count} alternatives, more than ${MAX_ALTERNATIVES_PER_SITE}`);
    total += count;
  });
  if (total > MAX_ALTERNATIVES_TOTAL) throw new RangeError(`the sites have ${total} alternatives in all, more than ${MAX_ALTERNATIVES_TOTAL}`);
  // The same CMFs as treatmentCmf, looked up per cell instead of searched through the effects each time.
  const cellCmf = cellCmfTable(scenario.catalogue.treatments);
  const committed = new Map((scenario.programme?.committed ?? []).map((project) => [project.site, project]));
  return scenario.sites.map((site, index) => {
    const rule = rules[index]!;
    const baseline = baselineBySite.get(site.id);
    if (!baseline) throw new RangeError(`no baseline for site ${site.id}`);
    const project = committed.get(site.id);
    if (scenario.programme !== undefined && project !== undefined) {
      const set = project.treatments.map((id) => treatments.get(id)!);
      return { site, alternatives: alternativesOverBuildYears(site, [], baseline, scenario.economics, scenario.programme, cellCmf, { project, treatments: set }), required: true };
    }
    if (rule.excludedBy !== undefined) {
      // A must-fund rule on the same site stays required, so the solver reports the conflict instead of hiding it.
      return { site, alternatives: [], required: rule.required, excludedBy: rule.excludedBy };
    }
    const sets = enumerateTreatmentSets(rule.candidates, rule.limits);
    const alternatives = scenario.programme === undefined
      ? sets.map((set) => evaluateAlternative(site, set, baseline.expectedPerYear, scenario.economics, cellCmf, baseline.crashGrowthPerYear))
      : alternativesOverBuildYears(site, sets, baseline, scenario.economics, scenario.programme, cellCmf);
    return { site, alternatives, required: rule.required };
  });
}
