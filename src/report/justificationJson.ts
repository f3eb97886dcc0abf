import type { PlanCase } from "../analysis/casePlan.js";
import type { ProgrammeTotals } from "../analysis/summariseSelection.js";
import { jsonNumber } from "./formatNumber.js";
import { KSI_AVOIDED_DEFINITION } from "./ksiAvoidedLabel.js";
import { marginalValueDefinition } from "./marginalValueWords.js";

/** The `justification` key of `plan --format json`: infinite or undefined numbers are null. */
export function justificationJson(planCase: PlanCase): object {
  const { justification, upgrades, ranking, atRankingSpend, extendedRanking, currency, objective } = planCase;
  const lambda = justification.budgetMarginalValue;
  const atSpendListed = atRankingSpend.extraKsiAvoided !== null;
  return {
    budgetMarginalValue: lambda,
    budgetMarginalValuePerMillion: lambda === null ? null : lambda * 1e6,
    budgetMarginalValueDefinition: marginalValueDefinition(objective, currency),
    marginalValueSource: justification.marginalValueSource,
    valueUnit: objective === "ksi" ? "K+A crashes avoided" : `${currency} of benefit PV`,
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
      optimalProjects: ranking.optimalTotals.projects,
      optimalSpend: ranking.optimalTotals.cost,
      optimalKsiAvoided: ranking.optimalTotals.ksiAvoided,
      optimalBenefitPV: ranking.optimalTotals.benefitPV,
      extraSpendByOptimal: ranking.optimalTotals.cost - ranking.rankingTotals.cost,
      atRankingSpend: {
        definition: atRankingSpend.definition,
        budget: atRankingSpend.budget,
        status: atRankingSpend.plan.solution.status,
        ...(atRankingSpend.plan.solution.diagnosis !== undefined && { diagnosis: atRankingSpend.plan.solution.diagnosis }),
        ...listJson(atSpendListed ? atRankingSpend.plan.totals : null),
        sites: atRankingSpend.plan.funded.map((project) => project.entry.site.id),
        extraKsiAvoidedByOptimal: atRankingSpend.extraKsiAvoided,
        extraBenefitPVByOptimal: atRankingSpend.extraBenefitPV,
      },
      extendedRanking: {
        definition: extendedRanking.definition,
        ...listJson(extendedRanking.totals),
        sites: extendedRanking.sites,
        steps: extendedRanking.steps.map((step) => ({ ...step, incrementalBcRatio: jsonNumber(step.incrementalBcRatio) })),
        meetsRules: extendedRanking.meetsRules,
        extraKsiAvoidedByOptimal: extendedRanking.extraKsiAvoided,
        extraBenefitPVByOptimal: extendedRanking.extraBenefitPV,
      },
      definitions: {
        ksiAvoided: KSI_AVOIDED_DEFINITION,
        spend: `capital cost of the list, in ${currency}`,
        extraKsiAvoidedByOptimal: "the optimal list's K+A crashes avoided minus the other list's (positive: the optimal list avoids more)",
        extraSpendByOptimal: "the optimal list's capital spend minus the B/C ranking's: the part of the plain comparison that is more money, not better choice",
        atRankingSpend: "comparison at equal spend (a): the optimal list solved with the budget set to the ranking's spend",
        extendedRanking: "comparison at equal spend (b): the ranking carried on by incremental B/C until nothing more fits the budget",
      },
    },
  };
}

/** A list's totals as the comparison shows them; null figures when there is no list. */
function listJson(totals: ProgrammeTotals | null): object {
  return {
    projects: totals?.projects ?? null,
    spend: totals?.cost ?? null,
    ksiAvoided: totals?.ksiAvoided ?? null,
    benefitPV: totals?.benefitPV ?? null,
    bcRatio: totals === null ? null : jsonNumber(totals.bcRatio),
  };
}
