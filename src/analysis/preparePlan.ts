import { buildAlternatives, type SiteAlternatives } from "../model/buildAlternatives.js";
import { siteBaselines, type SiteBaseline } from "../model/siteBaselines.js";
import type { Objective, Scenario } from "../model/types.js";

/** Everything about a scenario that does not depend on the budget, computed once for many solves. */
export interface PreparedPlan {
  readonly scenario: Scenario;
  readonly objective: Objective;
  readonly baselines: readonly SiteBaseline[];
  readonly sites: readonly SiteAlternatives[];
}

/** Baselines and alternatives for every site, ready to be solved at any budget. */
export function preparePlan(scenario: Scenario, objective: Objective = scenario.objective): PreparedPlan {
  const baselines = siteBaselines(scenario);
  return { scenario, objective, baselines, sites: buildAlternatives(scenario, baselines) };
}
