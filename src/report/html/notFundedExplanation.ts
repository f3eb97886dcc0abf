import type { NotFundedCase, NotFundedReason } from "../../analysis/justifyPlan.js";
import type { Objective, Scenario } from "../../model/types.js";
import { formatFixed, formatMoney } from "../formatNumber.js";
import { treatmentNames } from "./treatmentNames.js";

/** Short labels for the justification's reasons, as the report's table shows them. */
export const NOT_FUNDED_LABELS: Readonly<Record<NotFundedReason, string>> = {
  budget: "budget",
  "bc-below-1": "B/C below 1",
  "no-effect": "no effect",
  "no-alternatives": "no treatment applies",
  excluded: "never-fund rule",
};

/**
 * The justification's reason for leaving a site out, in plain words: for the budget (or a B/C
 * below 1) with the entry threshold of its option nearest to entering, how much cheaper it would
 * need to be or how many more K+A crashes it would need to avoid; `entersAtBudget` is the lowest budget
 * on the report's chart whose optimal list includes the site, if any.
 */
export function notFundedExplanation(scenario: Scenario, objective: Objective, site: NotFundedCase, entersAtBudget: number | undefined): string {
  const chart = entersAtBudget === undefined ? "" : ` On the budget chart it enters the optimal list at a budget of ${formatMoney(entersAtBudget)}.`;
  switch (site.reason) {
    case "excluded":
    case "no-alternatives":
    case "no-effect":
      return `${sentence(site.explanation)}${chart}`;
    case "bc-below-1":
      return `Its best option returns less than it costs (best B/C ${formatFixed(site.bestBcRatio ?? Number.NaN, 2)}, below 1).${thresholdText(scenario, objective, site)}${chart}`;
    case "budget":
      return `Left out for the budget: the money avoids more ${objective === "ksi" ? "K+A crashes" : "crash cost"} in the funded projects.${thresholdText(scenario, objective, site)}${chart}`;
  }
}

function thresholdText(scenario: Scenario, objective: Objective, site: NotFundedCase): string {
  const threshold = site.threshold;
  if (threshold === null) return " No entry threshold: policy rules besides the budget price the margin.";
  const option = `${treatmentNames(scenario, threshold.treatments)} (${formatMoney(threshold.cost)})`;
  if (threshold.costCut <= 0) {
    return ` Its option ${option} is within its entry threshold but does not fit the money left beside the funded projects: a near miss, an integer effect at the margin rather than a weak project.`;
  }
  const more = objective === "ksi" ? `${formatFixed(threshold.extraValueNeeded, 2)} more K+A crashes` : `${formatMoney(threshold.extraValueNeeded)} more benefit PV`;
  if (!(threshold.costThreshold > 0)) {
    return ` Its option nearest to entering, ${option}, would enter only if it avoided about ${more} at its cost; no price cut alone is enough.`;
  }
  const cutShare = (100 * threshold.costCut) / threshold.cost;
  return (
    ` Its option nearest to entering, ${option}, would enter if it cost at most about ${formatMoney(threshold.costThreshold)} ` +
    `(${formatMoney(threshold.costCut)} or ${formatFixed(cutShare, 0)}% cheaper), or if it avoided about ${more} at its cost.`
  );
}

function sentence(text: string): string {
  return `${text.charAt(0).toUpperCase()}${text.slice(1)}.`;
}
