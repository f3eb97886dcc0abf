import type { FrontierSummary } from "../analysis/summariseFrontier.js";
import { CAUTIONS } from "./cautions.js";
import type { FrontierContext } from "./frontierTable.js";
import { jsonNumber } from "./formatNumber.js";
import { KSI_AVOIDED_DEFINITION } from "./ksiAvoidedLabel.js";

/** The budget frontier as a JSON document; undefined or infinite ratios are null. */
export function frontierJson(summary: FrontierSummary, context: FrontierContext): object {
  return {
    scenario: context.scenarioName,
    currency: context.currency,
    objective: context.objective,
    scenarioBudget: context.scenarioBudget,
    marginalRateDefinition: `marginalKsiPerMillion: K+A crashes avoided gained per extra 1,000,000 ${context.currency} of budget since the previous level`,
    referenceKsiPerMillion: summary.referenceKsiPerMillion,
    referenceFromBudget: summary.referenceFromBudget,
    referenceToBudget: summary.referenceToBudget,
    referenceDefinition:
      "the 'first 1M' rate, measured from the first feasible level: K+A crashes avoided per extra 1,000,000 from the lowest budget level with a list (referenceFromBudget) to the next higher level with a list (referenceToBudget); levels below the must-fund sites' cost have no list and are skipped",
    diminishingFrom: summary.diminishingFrom,
    levels: summary.rows.map((row) => ({
      budget: row.budget,
      status: row.status,
      spend: row.spend,
      projects: row.projects,
      ksiAvoided: row.ksiAvoided,
      benefitPV: row.benefitPV,
      bcRatio: jsonNumber(row.bcRatio),
      marginalKsiPerMillion: row.marginalKsiPerMillion === null ? null : jsonNumber(row.marginalKsiPerMillion),
      belowHalfOfFirst: row.diminishing,
    })),
    definitions: { ksiAvoided: KSI_AVOIDED_DEFINITION, spend: `capital cost of the optimal list at the level, in ${context.currency}` },
    cautions: CAUTIONS,
  };
}
