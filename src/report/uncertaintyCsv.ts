import type { UncertaintyResult } from "../analysis/uncertainty/analyseUncertainty.js";
import { CORE_PROBABILITY, MARGINAL_PROBABILITY } from "../analysis/uncertainty/summariseDraws.js";
import { SHAKY_PROBABILITY } from "../analysis/uncertainty/shakyProjects.js";
import { csvPreamble } from "./csvPreamble.js";
import { effectsUncertainText } from "./effectsUncertainText.js";
import { formatFixed } from "./formatNumber.js";
import { toCsv } from "./toCsv.js";

/**
 * The uncertainty analysis as CSV: the preamble (scenario, draws, seed, the list's chance of
 * B/C > 1 and the "N of M effects uncertain" basis every probability rests on; units), then one
 * row per site-alternative the draws select, most often first, as the JSON `selections`.
 */
export function uncertaintyCsv(result: UncertaintyResult): string {
  const { plan, summary } = result;
  const shaky = new Map(summary.shaky.map((project) => [`${project.site}\u0000${project.alternativeIndex}`, project]));
  const preamble = csvPreamble(
    [
      `uncertainty of scenario ${plan.prepared.scenario.name}`,
      `${result.draws} draws (${summary.solvedDraws} solved), seed ${result.seed}`,
      `P(B/C > 1) of the chosen list ${formatFixed(100 * summary.probabilityBcAboveOne, 1)}%`,
      effectsUncertainText(result.effects),
    ],
    [
      "probability: share of the solved draws whose best list selects the site-alternative (0 to 1)",
      `class: core (at least ${CORE_PROBABILITY}), marginal (at least ${MARGINAL_PROBABILITY}) or rare`,
      `shaky: yes for a funded project selected in fewer than ${SHAKY_PROBABILITY} of the draws' best lists`,
    ],
  );
  const header = ["site_id", "treatments", "probability", "class", "in_plan", "shaky"];
  const rows = summary.selections.map((selection) => [
    selection.site,
    selection.treatments.join(" + "),
    selection.probability,
    selection.class,
    selection.inPlan ? "yes" : "no",
    shaky.has(`${selection.site}\u0000${selection.alternativeIndex}`) ? "yes" : "no",
  ]);
  return preamble + toCsv(header, rows);
}
