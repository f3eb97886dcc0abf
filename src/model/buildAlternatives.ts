import { enumerateTreatmentSets } from "./enumerateTreatmentSets.js";
import { evaluateAlternative } from "./evaluateAlternative.js";
import type { SiteBaseline } from "./siteBaselines.js";
import type { Alternative, Scenario, Site, Treatment } from "./types.js";

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
 */
export function buildAlternatives(scenario: Scenario, baselines: readonly SiteBaseline[]): SiteAlternatives[] {
  const treatments = new Map(scenario.catalogue.treatments.map((t) => [t.id, t]));
  const baselineBySite = new Map(baselines.map((baseline) => [baseline.site, baseline]));
  return scenario.sites.map((site) => {
    const mustFund = scenario.rules.find((rule) => rule.kind === "must-fund" && rule.site === site.id);
    const neverFund = scenario.rules.filter((rule) => rule.kind === "never-fund" && rule.site === site.id);
    if (neverFund.some((rule) => rule.kind === "never-fund" && rule.treatments.length === 0)) {
      // A must-fund rule on the same site stays required, so the solver reports the conflict instead of hiding it.
      return { site, alternatives: [], required: mustFund !== undefined, excludedBy: "never-fund rule" };
    }
    const candidates = site.candidates.map((id) => treatments.get(id)).filter((t): t is Treatment => t !== undefined);
    const sets = enumerateTreatmentSets(candidates, {
      maxTreatments: scenario.maxTreatmentsPerSite,
      required: mustFund?.kind === "must-fund" ? mustFund.treatments : [],
      forbidden: neverFund.flatMap((rule) => (rule.kind === "never-fund" ? rule.treatments : [])),
    });
    const baseline = baselineBySite.get(site.id);
    if (!baseline) throw new RangeError(`no baseline for site ${site.id}`);
    return {
      site,
      alternatives: sets.map((set) => evaluateAlternative(site, set, baseline.expectedPerYear, scenario.economics, undefined, baseline.crashGrowthPerYear)),
      required: mustFund !== undefined,
    };
  });
}
