import { jsonNumber } from "./formatNumber.js";
import type { PlanCase } from "../analysis/casePlan.js";

/** The `justification` key of `plan --format json`: infinite or undefined numbers are null. */
export function justificationJson(planCase: PlanCase): object {
  const { justification, upgrades, ranking } = planCase;
  return {
    budgetMarginalValue: justification.budgetMarginalValue,
    marginalValueSource: justification.marginalValueSource,
    valueUnit: planCase.objective === "ksi" ? "KSI avoided" : "benefit PV",
    thresholdMethod: justification.method,
    funded: justification.funded.map((project) => ({
      ...project,
      bcRatio: jsonNumber(project.bcRatio),
      costPerKsi: jsonNumber(project.costPerKsi),
    })),
    notFunded: justification.notFunded.map((site) => ({
      ...site,
      bestBcRatio: site.bestBcRatio === null ? null : jsonNumber(site.bestBcRatio),
      threshold:
        site.threshold === null
          ? null
          : { ...site.threshold, costThreshold: jsonNumber(site.threshold.costThreshold), costCut: jsonNumber(site.threshold.costCut), extraValueNeeded: jsonNumber(site.threshold.extraValueNeeded) },
    })),
    incrementalBenefitCost: upgrades.map((check) => ({ ...check, incrementalBcRatio: check.incrementalBcRatio === null ? null : jsonNumber(check.incrementalBcRatio) })),
    rankingComparison: {
      definition: ranking.definition,
      rankingSites: ranking.rankingSites,
      rankingProjects: ranking.rankingTotals.projects,
      rankingSpend: ranking.rankingTotals.cost,
      rankingKsiAvoided: ranking.rankingTotals.ksiAvoided,
      rankingBenefitPV: ranking.rankingTotals.benefitPV,
      extraKsiAvoidedByOptimal: ranking.extraKsiAvoided,
      extraBenefitPVByOptimal: ranking.extraBenefitPV,
      rankingMeetsRules: ranking.rankingMeetsRules,
    },
  };
}
