import type { Spread } from "../../analysis/uncertainty/summariseDraws.js";
import { REPLACEMENT_RULE, SHAKY_PROBABILITY } from "../../analysis/uncertainty/shakyProjects.js";
import { CORE_PROBABILITY, MARGINAL_PROBABILITY } from "../../analysis/uncertainty/summariseDraws.js";
import { BASELINE_SAMPLING_RULE } from "../../model/sampleSiteBaseline.js";
import { cmfSamplingRule } from "../../model/sampleTreatmentCmfs.js";
import { baselinesDrawnText } from "../baselinesDrawnText.js";
import { effectsUncertainText } from "../effectsUncertainText.js";
import { formatFixed, formatMoney } from "../formatNumber.js";
import { UNCERTAINTY_DEFINITIONS } from "../uncertaintyJson.js";
import { escapeHtml } from "./escapeHtml.js";
import { shakyProjectsList } from "./shakyProjectsList.js";
import type { ReportInput } from "./ReportInput.js";
import { treatmentNames } from "./treatmentNames.js";

/**
 * How sure the list is, from the Monte Carlo draws: the spread of what it achieves, the chance
 * its B/C exceeds 1, its regret, how many funded projects are core or marginal, the shaky ones
 * with what would replace them, and the projects outside the list that the draws often select;
 * every probability beside "N of M effects uncertain". Empty when no uncertainty analysis was given.
 */
export function robustnessSection(input: ReportInput): string {
  const { uncertainty, plan } = input;
  if (uncertainty === undefined) return "";
  const result = uncertainty.draws;
  const { summary } = result;
  const scenario = plan.prepared.scenario;
  const currency = escapeHtml(scenario.currency);
  const inPlan = summary.selections.filter((s) => s.inPlan);
  const count = (cls: string) => inPlan.filter((s) => s.class === cls).length;
  const contenders = summary.selections.filter((s) => !s.inPlan && s.class !== "rare");
  const range = (label: string, point: number, spread: Spread, format: (n: number) => string) =>
    `<tr><td>${label}</td><td class="num">${format(point)}</td><td class="num">${format(spread.mean)}</td><td class="num">${format(spread.p5)} – ${format(spread.p95)}</td></tr>`;
  const ksi = (n: number) => formatFixed(n, 1);
  const ratio = (n: number) => formatFixed(n, 2);
  const regretUnit = plan.prepared.objective === "ksi" ? "K+A crashes" : currency;
  const effectsUncertain = `<span class="effects-uncertain">${escapeHtml(effectsUncertainText(result.effects))}</span>`;
  const bcAboveOne = Math.round(summary.probabilityBcAboveOne * summary.draws);
  const shakyBlock =
    summary.shaky.length === 0
      ? `<p id="robustness-shaky">No funded project is shaky: each is selected in ${SHAKY_PROBABILITY * 100}% or more of the draws' best lists (${effectsUncertain}).</p>`
      : `<div id="robustness-shaky"><p><strong>${summary.shaky.length}</strong> funded project${summary.shaky.length === 1 ? " is" : "s are"} <strong>shaky</strong>: selected in fewer than ${SHAKY_PROBABILITY * 100}% of the draws' best lists (${effectsUncertain}). Largest first, each with what would replace it:</p>
${shakyProjectsList(scenario, summary.shaky)}</div>`;
  const regret = plan.prepared.objective === "ksi" ? ksi : formatMoney;
  const contenderRows = contenders
    .map(
      (s) =>
        `<tr data-site="${escapeHtml(s.site)}"><td><span class="site-id">${escapeHtml(s.site)}</span></td><td>${escapeHtml(treatmentNames(scenario, s.treatments))}</td><td class="num" data-probability="${s.probability}">${formatFixed(100 * s.probability, 0)}%</td><td>${s.class}</td></tr>`,
    )
    .join("\n");
  const contendersBlock =
    contenders.length === 0
      ? `<p>No project outside the list is selected in ${MARGINAL_PROBABILITY * 100}% or more of the draws.</p>`
      : `<table class="list compact contenders"><caption>Outside the list but selected in ${MARGINAL_PROBABILITY * 100}% or more of the draws (candidates to hold in reserve; ${effectsUncertain})</caption>
<thead><tr><th>Site</th><th>Treatments</th><th class="num">Selected in draws</th><th>Class</th></tr></thead>
<tbody>${contenderRows}</tbody></table>`;
  const unsolved = summary.solvedDraws < summary.draws ? ` ${summary.draws - summary.solvedDraws} draws had no solved list and are left out of the selection shares.` : "";
  const broken = summary.planInfeasibleDraws > 0 ? ` In ${summary.planInfeasibleDraws} draws the list breaks a rule (a KSI-share floor moved).` : "";
  return `<section id="robustness">
<h2>How sure is the list?</h2>
<p>CMFs are estimates and a few years of crashes are a small sample. ${result.draws} random draws (seed ${result.seed}) each redraw them and re-optimise the list at the same budget; the same seed always gives the same figures. CMFs: ${effectsUncertain}. ${escapeHtml(result.sampleBaselines ? `Baselines: ${baselinesDrawnText(result.baselines)}` : "Baselines held at their point estimates")}.${unsolved}${broken}</p>
<table class="list compact spreads">
<thead><tr><th>This list</th><th class="num">As planned</th><th class="num">Mean over draws</th><th class="num">90% of draws within</th></tr></thead>
<tbody>
${range("K+A crashes avoided", plan.totals.ksiAvoided, summary.planKsiAvoided, ksi)}
${range(`Benefit PV (${currency})`, plan.totals.benefitPV, summary.planBenefitPV, formatMoney)}
${range("Benefit / cost", plan.totals.bcRatio, summary.planBcRatio, ratio)}
</tbody>
</table>
<p>The list's benefit exceeds its lifecycle cost in <strong id="robustness-bc-above-one">${formatFixed(100 * summary.probabilityBcAboveOne, 1)}%</strong> of draws (${bcAboveOne} of ${summary.draws}; ${effectsUncertain}). Against each draw's own best list it gives up ${regret(summary.regret.mean)} ${regretUnit} on average (regret; 95% of draws: ${regret(summary.regret.p95)} or less).</p>
<p id="robustness-classes">Selection shares, over ${summary.solvedDraws} solved draws with ${effectsUncertain}: of the ${inPlan.length} funded projects, <strong>${count("core")}</strong> are <strong>core</strong> (selected in ${CORE_PROBABILITY * 100}% or more of the draws), <strong>${count("marginal")}</strong> <strong>marginal</strong> (${MARGINAL_PROBABILITY * 100}% or more) and <strong>${count("rare")}</strong> rarely best (under ${MARGINAL_PROBABILITY * 100}%): see the "Selected in draws" column of the capital list. Core projects are safe to commit; marginal ones are where a site study or better local CMFs matter most.</p>
${shakyBlock}
${contendersBlock}
<p class="note">Method: ${escapeHtml(UNCERTAINTY_DEFINITIONS.ksiAvoided)}. CMFs: ${escapeHtml(cmfSamplingRule(result.effects.assumedCmfCv))}. ${escapeHtml(result.sampleBaselines ? `Baselines: ${BASELINE_SAMPLING_RULE}` : "Baselines held at their point estimates")}. Shaky projects: ${escapeHtml(REPLACEMENT_RULE)}. Percentiles by Hyndman–Fan type 7.</p>
</section>`;
}
