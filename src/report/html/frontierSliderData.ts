import type { FrontierLevel } from "../../analysis/budgetFrontier.js";
import { jsonNumber } from "../formatNumber.js";
import { hasList } from "./hasList.js";
import { treatmentNames } from "./treatmentNames.js";
import type { Scenario } from "../../model/types.js";

/** Totals of one level as the slider shows them (null where undefined, e.g. cost per KSI of nothing). */
export interface SliderTotals {
  readonly projects: number;
  readonly cost: number;
  readonly ksiAvoided: number;
  readonly ksiAvoidedPerYear: number;
  readonly benefitPV: number;
  readonly lifecycleCostPV: number;
  readonly bcRatio: number | null;
  readonly npv: number;
  readonly costPerKsi: number | null;
}

/** One budget level: its totals (null when no list is possible) and funded projects as [site index, treatments, cost, KSI avoided]. */
export interface SliderLevel {
  readonly budget: number;
  readonly status: string;
  readonly totals: SliderTotals | null;
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
        totals: hasList(plan)
          ? {
              projects: totals.projects,
              cost: totals.cost,
              ksiAvoided: totals.ksiAvoided,
              ksiAvoidedPerYear: totals.ksiAvoidedPerYear,
              benefitPV: totals.benefitPV,
              lifecycleCostPV: totals.lifecycleCostPV,
              bcRatio: jsonNumber(totals.bcRatio),
              npv: totals.npv,
              costPerKsi: jsonNumber(totals.costPerKsi),
            }
          : null,
        funded: plan.funded.map(({ entry, alternative }) => [siteIndex.get(entry.site.id)!, treatmentNames(scenario, alternative.treatments), alternative.cost, alternative.ksiAvoided] as const),
      };
    }),
  };
}
