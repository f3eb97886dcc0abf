import { CMF_COMBINATION_RULE } from "../model/combineCmfs.js";
import { SERVICE_LIFE_RULE } from "../model/evaluateAlternative.js";
import type { Scenario } from "../model/types.js";
import { KSI_AVOIDED_DEFINITION } from "./ksiAvoidedLabel.js";

/** The assumptions behind every figure, as the JSON and reports state them. */
export interface Assumptions {
  readonly currency: string;
  readonly discountRate: number;
  readonly horizonYears: number;
  readonly crashWindow: { readonly firstYear: number; readonly lastYear: number };
  readonly baseline: string;
  readonly crashCosts: Readonly<Record<string, number>>;
  readonly crashCostSource: string;
  readonly crashCostPriceYear: number | null;
  readonly cmfCombination: string;
  readonly serviceLives: string;
  readonly ksiDefinition: string;
}

/** Collects the scenario's economic and method assumptions in one plain object. */
export function describeAssumptions(scenario: Scenario): Assumptions {
  const { economics } = scenario;
  return {
    currency: scenario.currency,
    discountRate: economics.discountRate,
    horizonYears: economics.horizonYears,
    crashWindow: scenario.crashWindow,
    baseline: scenario.baseline,
    crashCosts: economics.crashCosts.perCrash,
    crashCostSource: economics.crashCosts.source,
    crashCostPriceYear: economics.crashCosts.priceYear ?? null,
    cmfCombination: CMF_COMBINATION_RULE,
    serviceLives: SERVICE_LIFE_RULE,
    ksiDefinition: KSI_AVOIDED_DEFINITION,
  };
}
