import type { Evaluation } from "../../analysis/evaluateBuiltProjects.js";
import type { EffectEstimate } from "../../model/beforeAfterTypes.js";
import { EVALUATION_CAUTIONS } from "../evaluation/evaluationCautions.js";
import { evaluationSvg } from "../evaluation/evaluationSvg.js";
import { escapeHtml } from "./escapeHtml.js";

function cell(estimate: EffectEstimate | null): string {
  return estimate === null ? "<td>–</td>" : `<td class="num">${estimate.theta.toFixed(2)} (${estimate.lower95.toFixed(2)}–${estimate.upper95.toFixed(2)})</td>`;
}

/** "Evidence from our own projects": the before-after evaluation's local CMFs, as a chart and a table, with its cautions. */
export function evidenceSection(evaluation: Evaluation | undefined): string {
  if (evaluation === undefined) return "";
  const rows = evaluation.groups.flatMap((group) =>
    group.crashGroups.map((entry) => `<tr><td>${escapeHtml(group.name)}</td><td>${escapeHtml(entry.crashGroup.label)}</td><td class="num">${group.sites.length}</td><td class="num">${entry.beforeObserved}</td><td class="num">${entry.afterObserved}</td>${cell(entry.empiricalBayes)}${cell(entry.comparisonGroup)}${cell(entry.naive)}</tr>`),
  );
  return `<section id="evidence">
<h2>Evidence from our own projects</h2>
<p>${escapeHtml(evaluation.title)}: what the projects already built did at their own sites, as the index of effectiveness θ (crashes after ÷ crashes expected without the treatment: the local CMF), with its 95% interval. The Empirical Bayes estimate corrects for regression to the mean; the naive one does not and is shown for contrast.</p>
${evaluationSvg(evaluation)}
<table><thead><tr><th>Projects</th><th>Crashes</th><th>Sites</th><th>Before</th><th>After</th><th>Empirical Bayes θ (95%)</th><th>Comparison group θ (95%)</th><th>Naive θ (95%, biased)</th></tr></thead>
<tbody>${rows.join("\n")}</tbody></table>
<ul>${EVALUATION_CAUTIONS.map((caution) => `<li>${escapeHtml(caution)}</li>`).join("")}</ul>
</section>`;
}
