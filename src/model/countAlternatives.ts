import { buildYears } from "./buildYears.js";
import { countTreatmentSets } from "./countTreatmentSets.js";
import { siteTreatmentSetRules } from "./siteTreatmentSetRules.js";
import type { Scenario } from "./types.js";

/**
 * Most alternatives one site may have. Each alternative takes about 4 KB and 0.1 ms to evaluate
 * (as we measured on the demo), and every one is a column of the integer programme; 5,000 is
 * 20 candidates with up to 3 treatments each, or 13 with up to 6.
 */
export const MAX_ALTERNATIVES_PER_SITE = 5_000;

/**
 * Most alternatives over all sites: a statewide list of 100,000 sites with a handful each fits.
 * Measured: a 20,000-site plan with 120,791 alternatives peaks at about 165 MiB, so the limit
 * stays near 1.5 GiB.
 */
export const MAX_ALTERNATIVES_TOTAL = 1_000_000;

/**
 * How many alternatives (in a programme: times its build years) each site of a scenario has (in site order), counted arithmetically
 * before any is built (countTreatmentSets), under the same candidates, per-site limit,
 * exclusive groups and must-fund / never-fund rules as buildAlternatives.
 */
export function countAlternatives(scenario: Scenario): number[] {
  const treatments = new Map(scenario.catalogue.treatments.map((t) => [t.id, t]));
  return scenario.sites.map((site) => {
    const rules = siteTreatmentSetRules(scenario, site, treatments);
    if (rules.excludedBy !== undefined) return 0;
    const years = scenario.programme === undefined ? 1 : buildYears(site, scenario.programme).length;
    return countTreatmentSets(rules.candidates, rules.limits) * years;
  });
}
