import type { ShakyProject } from "../../analysis/uncertainty/shakyProjects.js";
import type { Scenario } from "../../model/types.js";
import { formatFixed, formatMoney } from "../formatNumber.js";
import { escapeHtml } from "./escapeHtml.js";
import { treatmentNames } from "./treatmentNames.js";

/**
 * The shaky funded projects as an HTML list, in the order given (largest cost first), each with
 * its selection share and the alternatives outside the list that the draws fund more often without it.
 */
export function shakyProjectsList(scenario: Scenario, shaky: readonly ShakyProject[]): string {
  const currency = escapeHtml(scenario.currency);
  const items = shaky.map((project) => {
    const instead =
      project.replacements.length === 0
        ? "no project outside the list is funded more often when the draws leave it out"
        : `would be replaced by ${project.replacements
            .map(
              (r) =>
                `<span class="site-id">${escapeHtml(r.site)}</span> ${escapeHtml(treatmentNames(scenario, r.treatments))} (${formatMoney(r.cost)} ${currency}; in ${formatFixed(100 * r.shareOfDrawsWithout, 0)}% of the draws without it${r.shareOfDrawsWith === null ? "" : `, ${formatFixed(100 * r.shareOfDrawsWith, 0)}% with it`})`,
            )
            .join(", ")}`;
    return `<li data-site="${escapeHtml(project.site)}" data-probability="${project.probability}"><span class="site-id">${escapeHtml(project.site)}</span> ${escapeHtml(treatmentNames(scenario, project.treatments))}, ${formatMoney(project.cost)} ${currency}: selected in ${formatFixed(100 * project.probability, 0)}% of the draws; ${instead}.</li>`;
  });
  return `<ul class="shaky-projects">\n${items.join("\n")}\n</ul>`;
}
