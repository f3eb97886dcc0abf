import type { Evaluation } from "../../analysis/evaluateBuiltProjects.js";
import type { EffectEstimate } from "../../model/beforeAfterTypes.js";
import { CAUTIONS } from "../cautions.js";
import { formatFixed } from "../formatNumber.js";
import { textTable } from "../textTable.js";
import { EVALUATION_CAUTIONS } from "./evaluationCautions.js";

function estimateCells(estimate: EffectEstimate | null): string[] {
  if (estimate === null) return ["-", "-", "-"];
  return [formatFixed(estimate.theta, 3), `${formatFixed(estimate.lower95, 3)}–${formatFixed(estimate.upper95, 3)}`, `${estimate.percentChange > 0 ? "+" : ""}${formatFixed(estimate.percentChange, 1)}%`];
}

/** The evaluation as terminal tables: one per group of projects, one row per crash group, then warnings and cautions. */
export function evaluationTable(evaluation: Evaluation): string {
  const right = (heading: string) => ({ heading, align: "right" as const });
  const lines = [`Before-after evaluation: ${evaluation.title}`, "θ is the index of effectiveness (the local CMF: crashes with ÷ expected without), bias-corrected, with its 95% interval.", ""];
  for (const group of evaluation.groups) {
    lines.push(
      `${group.name}: ${group.sites.length} site(s), ${formatFixed(group.beforeSiteYears, 1)} site-years before and ${formatFixed(group.afterSiteYears, 1)} after${group.comparisonSites > 0 ? `, ${group.comparisonSites} comparison site(s)` : ""}`,
      textTable(
        [{ heading: "Crashes" }, right("Before"), right("After"), right("EB θ"), right("EB 95%"), right("EB change"), right("Comparison θ"), right("Comparison 95%"), right("Comparison change"), right("Naive θ (biased)"), right("Naive 95%"), right("Naive change")],
        group.crashGroups.map((entry) => [entry.crashGroup.label, String(entry.beforeObserved), String(entry.afterObserved), ...estimateCells(entry.empiricalBayes), ...estimateCells(entry.comparisonGroup), ...estimateCells(entry.naive)]),
      ),
    );
    for (const site of group.withoutEmpiricalBayes) lines.push(`  ${site.site} cannot use Empirical Bayes (${site.why}): it enters the naive and comparison-group estimates only.`);
    for (const entry of group.crashGroups) for (const warning of entry.warnings) lines.push(`  warning: ${entry.crashGroup.label}: ${warning}`);
    lines.push("");
  }
  lines.push("The naive estimate compares counts before and after and is biased by regression to the mean at sites chosen for their crash record.", "", ...EVALUATION_CAUTIONS, ...CAUTIONS, "");
  return lines.join("\n");
}
