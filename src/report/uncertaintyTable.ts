import type { UncertaintyResult } from "../analysis/uncertainty/analyseUncertainty.js";
import type { SensitivityCase, SensitivityResult } from "../analysis/uncertainty/oneAtATimeSensitivity.js";
import type { Spread } from "../analysis/uncertainty/summariseDraws.js";
import { REPLACEMENT_RULE, SHAKY_PROBABILITY, type ShakyProject } from "../analysis/uncertainty/shakyProjects.js";
import { CORE_PROBABILITY, MARGINAL_PROBABILITY } from "../analysis/uncertainty/summariseDraws.js";
import { BASELINE_SAMPLING_RULE } from "../model/sampleSiteBaseline.js";
import { cmfSamplingRule } from "../model/sampleTreatmentCmfs.js";
import { baselinesDrawnText } from "./baselinesDrawnText.js";
import { CAUTIONS } from "./cautions.js";
import { effectsUncertainText } from "./effectsUncertainText.js";
import { formatFixed, formatMoney } from "./formatNumber.js";
import { UNCERTAINTY_DEFINITIONS } from "./uncertaintyJson.js";
import { textTable } from "./textTable.js";


function signed(value: number, decimals: number): string {
  return (value > 0 ? "+" : "") + formatFixed(value, decimals);
}

function caseText(value: SensitivityCase): string {
  return `${value.label}: ${signed(value.ksiAvoidedChange, 2)} K+A crashes avoided, B/C ${signed(value.bcRatioChange, 2)}${value.listChanges ? ", list changes" : ""}`;
}

function shakyLine(project: ShakyProject): string {
  const instead =
    project.replacements.length === 0
      ? "no alternative outside the list is picked more often when the draws leave it out"
      : `replaced by ${project.replacements.map((r) => `${r.site}: ${r.treatments.join(" + ")} (${formatMoney(r.cost)}; in ${formatFixed(100 * r.shareOfDrawsWithout, 1)}% of the draws without it${r.shareOfDrawsWith === null ? "" : `, ${formatFixed(100 * r.shareOfDrawsWith, 1)}% with it`})`).join(", ")}`;
  return `- ${project.site}: ${project.treatments.join(" + ")} (${formatMoney(project.cost)}): selected in ${formatFixed(100 * project.probability, 1)}% of the draws' best lists; ${instead}`;
}

/**
 * The uncertainty report for a terminal: spreads, P(B/C > 1), regret, selection probabilities,
 * shaky funded projects and the tornado table; every probability beside "N of M effects uncertain".
 */
export function uncertaintyTable(result: UncertaintyResult, sensitivity: SensitivityResult): string {
  const { plan, summary } = result;
  const { scenario } = plan.prepared;
  const currency = scenario.currency;
  const row = (label: string, point: number, value: Spread, format: (n: number) => string) => [label, format(point), format(value.mean), format(value.p5), format(value.p50), format(value.p95)];
  const spreads = textTable(
    [{ heading: "Chosen list over the draws" }, ...["Point", "Mean", "P5", "P50", "P95"].map((heading) => ({ heading, align: "right" as const }))],
    [
      row("K+A crashes avoided", plan.totals.ksiAvoided, summary.planKsiAvoided, (n) => formatFixed(n, 2)),
      row(`Benefit PV (${currency})`, plan.totals.benefitPV, summary.planBenefitPV, formatMoney),
      row("B/C", plan.totals.bcRatio, summary.planBcRatio, (n) => formatFixed(n, 2)),
    ],
  );

  const shown = summary.selections.filter((s) => s.inPlan || s.class !== "rare");
  const selections = textTable(
    [{ heading: "Site" }, { heading: "Treatments", maxWidth: 42 }, { heading: "Selected", align: "right" }, { heading: "In plan" }, { heading: "Class" }],
    shown.map((s) => [s.site, s.treatments.join(" + "), `${formatFixed(100 * s.probability, 1)}%`, s.inPlan ? "yes" : "", s.class]),
  );
  const tornado = textTable(
    [{ heading: "Parameter (base)", maxWidth: 38 }, { heading: "Low", maxWidth: 38 }, { heading: "High", maxWidth: 38 }],
    sensitivity.rows.map((r) => [`${r.parameter} (${r.base})`, caseText(r.low), caseText(r.high)]),
  );

  const unit = plan.prepared.objective === "ksi" ? "K+A crashes" : currency;
  const format = plan.prepared.objective === "ksi" ? (n: number) => formatFixed(n, 2) : formatMoney;
  const effectsUncertain = effectsUncertainText(result.effects);
  const bcAboveOne = Math.round(summary.probabilityBcAboveOne * summary.draws);
  const lines = [
    `${scenario.name}: how sure is the list?`,
    `${result.draws} draws, seed ${result.seed}; budget ${formatMoney(plan.budget)} ${currency}; plan status ${plan.solution.status}; ${plan.totals.projects} project(s)`,
    `CMFs: ${effectsUncertain}.`,
    `Baselines: ${result.sampleBaselines ? baselinesDrawnText(result.baselines) : "held at their point estimates (--fixed-baseline)"}.`,
    "",
    spreads,
    `Probability the list's B/C exceeds 1: ${formatFixed(100 * summary.probabilityBcAboveOne, 1)}% (${bcAboveOne} of ${summary.draws} draws; ${effectsUncertain})`,
    `Regret (what the list loses against each draw's best list, ${unit}): mean ${format(summary.regret.mean)}, P95 ${format(summary.regret.p95)}`,
    ...(summary.planInfeasibleDraws > 0 ? [`The list breaks a rule in ${summary.planInfeasibleDraws} draw(s) (a KSI-share floor moved).`] : []),
    ...(summary.solvedDraws < summary.draws ? [`${summary.draws - summary.solvedDraws} draw(s) had no solved list: ${JSON.stringify(summary.statusCounts)}`] : []),
    "",
    `Selection probability: share of the ${summary.solvedDraws} solved draws' best lists, ${effectsUncertain} (core: ≥ ${CORE_PROBABILITY * 100}%; marginal: ≥ ${MARGINAL_PROBABILITY * 100}%; rare: below)`,
    selections,
    ...(shown.length < summary.selections.length ? [`${summary.selections.length - shown.length} other site-alternative(s) were best in under ${MARGINAL_PROBABILITY * 100}% of draws (listed in --format json).`] : []),
    "",
    ...(summary.shaky.length === 0
      ? [`Shaky projects: none; every funded project is selected in ${SHAKY_PROBABILITY * 100}% or more of the draws' best lists (${effectsUncertain}).`]
      : [`Shaky projects: ${summary.shaky.length} funded project(s) selected in fewer than ${SHAKY_PROBABILITY * 100}% of the draws' best lists, largest cost first (${effectsUncertain}):`, ...summary.shaky.map(shakyLine)]),
    "",
    `One at a time: change in the chosen list's K+A crashes avoided (base ${formatFixed(sensitivity.baseKsiAvoided, 2)}) and B/C (base ${formatFixed(sensitivity.baseBcRatio, 2)}); "list changes" when re-optimising picks another list`,
    tornado,
    "",
    "Method:",
    `- ${UNCERTAINTY_DEFINITIONS.ksiAvoided}`,
    `- ${cmfSamplingRule(result.effects.assumedCmfCv)}`,
    `- ${result.sampleBaselines ? BASELINE_SAMPLING_RULE : "baselines held at their point estimates"}`,
    `- Shaky projects: ${REPLACEMENT_RULE}`,
    "",
    "Cautions:",
    ...CAUTIONS.map((caution) => `- ${caution}`),
  ];
  return lines.join("\n") + "\n";
}
