import type { Evaluation } from "../../analysis/evaluateBuiltProjects.js";
import type { EffectEstimate } from "../../model/beforeAfterTypes.js";
import { csvPreamble } from "../csvPreamble.js";
import { toCsv, type CsvCell } from "../toCsv.js";

const METHODS = ["empirical-bayes", "comparison-group", "naive"] as const;

function estimateCells(estimate: EffectEstimate | null): CsvCell[] {
  if (estimate === null) return [null, null, null, null, null, null, null];
  return [estimate.sites, estimate.observedAfter, estimate.expectedAfter, estimate.theta, estimate.standardError, estimate.lower95, estimate.upper95];
}

/** One row per group of projects × crash group × method (RFC 4180), after the preamble. */
export function evaluationCsv(evaluation: Evaluation): string {
  const preamble = csvPreamble(
    [`before-after evaluation ${evaluation.title}`, `${evaluation.groups.length} group(s) of projects`],
    ["theta: index of effectiveness, bias-corrected (the local CMF); blank where a method has no estimate", "naive: not corrected for regression to the mean"],
  );
  const rows = evaluation.groups.flatMap((group) =>
    group.crashGroups.flatMap((entry) =>
      METHODS.map((method) => {
        const estimate = method === "empirical-bayes" ? entry.empiricalBayes : method === "comparison-group" ? entry.comparisonGroup : entry.naive;
        return [group.name, group.treatments.join(" + "), entry.crashGroup.id, entry.beforeObserved, entry.afterObserved, method, ...estimateCells(estimate), entry.warnings.join("; ")];
      }),
    ),
  );
  return preamble + toCsv(["group", "treatments", "crash_group", "before_observed", "after_observed", "method", "sites", "observed_after", "expected_after", "theta", "standard_error", "lower_95", "upper_95", "warnings"], rows);
}
