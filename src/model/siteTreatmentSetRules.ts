import type { TreatmentSetLimits } from "./enumerateTreatmentSets.js";
import type { Scenario, Site, Treatment } from "./types.js";

/** What decides a site's treatment sets: its candidates, the limits on combining them, and its must-fund rule. */
export interface SiteTreatmentSetRules {
  readonly candidates: readonly Treatment[];
  readonly limits: TreatmentSetLimits;
  /** A must-fund rule names this site. */
  readonly required: boolean;
  /** Why the site has no alternatives at all (a never-fund rule without treatments). */
  readonly excludedBy?: string;
}

/**
 * A site's candidates (those in the catalogue) and limits: the scenario's per-site maximum, the
 * treatments a must-fund rule requires and those never-fund rules forbid. Shared by the counting
 * and the building of alternatives so the two cannot disagree.
 */
export function siteTreatmentSetRules(scenario: Scenario, site: Site, treatments: ReadonlyMap<string, Treatment>): SiteTreatmentSetRules {
  const mustFund = scenario.rules.find((rule) => rule.kind === "must-fund" && rule.site === site.id);
  const neverFund = scenario.rules.filter((rule) => rule.kind === "never-fund" && rule.site === site.id);
  const candidates = site.candidates.map((id) => treatments.get(id)).filter((t): t is Treatment => t !== undefined);
  const limits: TreatmentSetLimits = {
    maxTreatments: scenario.maxTreatmentsPerSite,
    required: mustFund?.kind === "must-fund" ? mustFund.treatments : [],
    forbidden: neverFund.flatMap((rule) => (rule.kind === "never-fund" ? rule.treatments : [])),
  };
  const excluded = neverFund.some((rule) => rule.kind === "never-fund" && rule.treatments.length === 0);
  return { candidates, limits, required: mustFund !== undefined, ...(excluded && { excludedBy: "never-fund rule" }) };
}
