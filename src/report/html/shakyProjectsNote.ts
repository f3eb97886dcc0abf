import { SHAKY_PROBABILITY } from "../../analysis/uncertainty/shakyProjects.js";
import { effectsUncertainText } from "../effectsUncertainText.js";
import { escapeHtml } from "./escapeHtml.js";
import type { ReportInput } from "./ReportInput.js";
import { shakyProjectsList } from "./shakyProjectsList.js";

/**
 * The summary's flag on funded projects that fewer than half of the uncertainty draws' best lists
 * select, largest first, with what would replace each. Empty when no uncertainty analysis was given.
 */
export function shakyProjectsNote(input: ReportInput): string {
  if (input.uncertainty === undefined) return "";
  const result = input.uncertainty.draws;
  const { shaky } = result.summary;
  const basis = escapeHtml(`${result.summary.solvedDraws} uncertainty draws, ${effectsUncertainText(result.effects)}`);
  if (shaky.length === 0) {
    return `<div class="shaky" id="summary-shaky" data-shaky="0"><p>Every funded project is in at least ${SHAKY_PROBABILITY * 100}% of the best lists of ${basis} (see "How sure is the list?").</p></div>`;
  }
  const plural = shaky.length === 1 ? "project is" : "projects are";
  return `<div class="shaky" id="summary-shaky" data-shaky="${shaky.length}">
<p><strong>${shaky.length} funded ${plural} shaky</strong>: in fewer than ${SHAKY_PROBABILITY * 100}% of the best lists of ${basis}. Largest first, each with what would replace it; these deserve a site study before the money is committed.</p>
${shakyProjectsList(input.plan.prepared.scenario, shaky)}
</div>`;
}
