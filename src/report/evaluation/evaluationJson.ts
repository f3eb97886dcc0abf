import type { Evaluation } from "../../analysis/evaluateBuiltProjects.js";
import type { EffectEstimate } from "../../model/beforeAfterTypes.js";
import { CAUTIONS } from "../cautions.js";
import { jsonNumber } from "../formatNumber.js";
import { EVALUATION_CAUTIONS } from "./evaluationCautions.js";

function estimateJson(estimate: EffectEstimate | null): unknown {
  if (estimate === null) return null;
  return {
    sites: estimate.sites,
    observedAfter: jsonNumber(estimate.observedAfter),
    expectedAfter: jsonNumber(estimate.expectedAfter),
    expectedAfterVariance: jsonNumber(estimate.expectedAfterVariance),
    theta: jsonNumber(estimate.theta),
    standardError: jsonNumber(estimate.standardError),
    lower95: jsonNumber(estimate.lower95),
    upper95: jsonNumber(estimate.upper95),
    percentChange: jsonNumber(estimate.percentChange),
  };
}

/** The evaluation as a plain JSON-ready object (the contract is in the README): every group, crash group and method. */
export function evaluationJson(evaluation: Evaluation): unknown {
  return {
    evaluation: evaluation.title,
    measure: "theta: index of effectiveness (crashes observed after ÷ expected after without the treatment), bias-corrected (Hauer 1997); the local CMF",
    groups: evaluation.groups.map((group) => ({
      name: group.name,
      treatments: group.treatments,
      sites: group.sites,
      beforeSiteYears: jsonNumber(group.beforeSiteYears),
      afterSiteYears: jsonNumber(group.afterSiteYears),
      comparisonSites: group.comparisonSites,
      withoutEmpiricalBayes: group.withoutEmpiricalBayes,
      crashGroups: group.crashGroups.map((entry) => ({
        crashGroup: entry.crashGroup.id,
        label: entry.crashGroup.label,
        crashTypes: entry.crashGroup.crashTypes,
        severities: entry.crashGroup.severities,
        beforeObserved: entry.beforeObserved,
        afterObserved: entry.afterObserved,
        preferred: entry.empiricalBayes !== null ? "empirical-bayes" : entry.comparisonGroup !== null ? "comparison-group" : null,
        empiricalBayes: estimateJson(entry.empiricalBayes),
        comparisonGroup: estimateJson(entry.comparisonGroup),
        naive: estimateJson(entry.naive),
        warnings: entry.warnings,
      })),
    })),
    cautions: [...EVALUATION_CAUTIONS, ...CAUTIONS],
  };
}
