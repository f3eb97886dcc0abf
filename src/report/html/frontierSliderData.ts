import type { FrontierLevel } from "../../analysis/budgetFrontier.js";
import { totalsJson, type TotalsJson } from "../totalsJson.js";
import { hasList } from "../hasList.js";
import { treatmentNames } from "./treatmentNames.js";
import type { Scenario } from "../../model/types.js";

/** One budget level: its totals (null when no list is possible) and funded projects as [site index, treatments, cost, K+A crashes avoided]. */
export interface SliderLevel {
  readonly budget: number;
  readonly status: string;
  readonly totals: TotalsJson | null;
  readonly funded: readonly (readonly [number, string, number, number])[];
}

/** The JSON embedded in the report for the budget slider. */
export interface SliderData {
  readonly currency: string;
  readonly chosen: number;
  readonly sites: readonly { readonly id: string; readonly name: string; readonly district: string }[];
  readonly levels: readonly SliderLevel[];
}

/** Precomputed optimal lists at every frontier level, compact enough to embed in the page. */
export function frontierSliderData(scenario: Scenario, frontier: readonly FrontierLevel[], chosenBudget: number): SliderData {
  const siteIndex = new Map(scenario.sites.map((site, index) => [site.id, index]));
  const chosen = frontier.findIndex((level) => level.budget === chosenBudget);
  return {
    currency: scenario.currency,
    chosen: chosen < 0 ? 0 : chosen,
    sites: scenario.sites.map((site) => ({ id: site.id, name: site.name, district: site.district })),
    levels: frontier.map(({ budget, plan }) => {
      const { totals } = plan;
      return {
        budget,
        status: plan.solution.status,
        totals: hasList(plan) ? totalsJson(totals) : null,
        funded: plan.funded.map(({ entry, alternative }) => [siteIndex.get(entry.site.id)!, treatmentNames(scenario, alternative.treatments), alternative.cost, alternative.ksiAvoided] as const),
      };
    }),
  };
}
