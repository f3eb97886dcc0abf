import type { PlanResult } from "../../analysis/planProgramme.js";
import type { Severity } from "../../model/types.js";
import type { PolicyRule } from "../../model/policyRule.js";
import { CRASH_TYPES, SEVERITIES } from "../../model/types.js";
import { describeAssumptions } from "../describeAssumptions.js";
import { formatFixed, formatMoney } from "../formatNumber.js";
import { escapeHtml } from "./escapeHtml.js";

const SEVERITY_NAMES: Readonly<Record<Severity, string>> = {
  K: "K fatal",
  A: "A suspected serious injury",
  B: "B suspected minor injury",
  C: "C possible injury",
  O: "O property damage only",
};

const BASELINE_METHODS: Readonly<Record<string, string>> = {
  auto: "auto: Empirical Bayes (Hauer) wherever a site has AADT and a safety performance function, observed counts elsewhere",
  observed: "observed: each site's crashes per year over the crash window",
  "empirical-bayes": "Empirical Bayes (Hauer): observed crashes weighted with a safety performance function's prediction",
};

/**
 * The assumptions behind every figure: economics, crash costs and their source, the baseline,
 * CMF combination and service-life rules, policy rules, and each used treatment's CMF sources.
 */
export function assumptionsSection(plan: PlanResult): string {
  const scenario = plan.prepared.scenario;
  const assumptions = describeAssumptions(scenario, plan.prepared.baselines);
  const currency = escapeHtml(assumptions.currency);
  const item = (term: string, value: string) => `<dt>${term}</dt><dd>${value}</dd>`;
  const costs = SEVERITIES.map(
    (severity) =>
      `<tr><td>${SEVERITY_NAMES[severity]}</td><td class="num">${formatMoney(assumptions.statedCrashCosts[severity] ?? 0)}</td><td class="num">${formatMoney(assumptions.crashCosts[severity] ?? 0)}</td></tr>`,
  ).join("");
  const counts = assumptions.baselineCounts;
  const baselineUsed = counts === null ? "" : ` Used: Empirical Bayes at ${counts.empiricalBayes} site(s), observed counts at ${counts.observed}.`;
  const used = new Set(plan.funded.flatMap(({ alternative }) => alternative.treatments));
  const treatments = scenario.catalogue.treatments
    .filter((treatment) => used.has(treatment.id))
    .map(
      (treatment) =>
        `<li><strong>${escapeHtml(treatment.name)}</strong> (service life ${treatment.serviceLifeYears} years)<ul>${treatment.effects
          .map(
            (effect) =>
              `<li>CMF ${formatFixed(effect.cmf, 2)}${effect.standardError === undefined ? "" : ` (standard error ${formatFixed(effect.standardError, 2)})`} on ${effect.crashTypes.length === CRASH_TYPES.length ? "all crash types" : `${escapeHtml(effect.crashTypes.join(", "))} crashes`}, ${effect.severities.length === SEVERITIES.length ? "all severities" : `severities ${escapeHtml(effect.severities.join(""))}`}: ${escapeHtml(effect.source)}</li>`,
          )
          .join("")}</ul></li>`,
    )
    .join("\n");
  const rules = scenario.rules.map((rule) => `<li>${escapeHtml(ruleText(rule))}</li>`).join("");
  return `<section id="assumptions">
<h2>Assumptions</h2>
<dl class="assumptions">
${item("Currency", currency)}
${item("Discount rate", `${formatFixed(assumptions.discountRate * 100, 1)}% a year`)}
${item("Analysis horizon", `${assumptions.horizonYears} years`)}
${item("Crash window", `${assumptions.crashWindow.firstYear}–${assumptions.crashWindow.lastYear}`)}
${item("Baseline method", escapeHtml((BASELINE_METHODS[assumptions.baseline] ?? assumptions.baseline) + "." + baselineUsed))}
${item("SPF calibration", escapeHtml(assumptions.calibration))}
${item("Traffic growth", escapeHtml(assumptions.trafficGrowth))}
${item("K+A crashes avoided", escapeHtml(assumptions.ksiDefinition))}
${item("Valuing K and A crashes", escapeHtml(assumptions.ksiCosting))}
${item("Price year", escapeHtml(`${assumptions.programmePriceYear === null ? "programme price year not stated" : `programme money: ${assumptions.programmePriceYear} prices`}; crash costs: ${assumptions.crashCostEscalation}`))}
${item("Combining treatments", escapeHtml(assumptions.cmfCombination))}
${item("Service lives", escapeHtml(assumptions.serviceLives))}
${item("Treatments per site", `at most ${scenario.maxTreatmentsPerSite}`)}
</dl>
<h3>Crash costs (${currency} per crash)</h3>
<table class="list compact costs"><thead><tr><th>Severity</th><th>As stated${assumptions.crashCostPriceYear === null ? "" : ` (${assumptions.crashCostPriceYear} prices)`}</th><th>Used for benefits</th></tr></thead><tbody>${costs}</tbody></table>
<p class="source">Source: ${escapeHtml(assumptions.crashCostSource)}</p>
${rules === "" ? "" : `<h3>Policy rules applied</h3><ul>${rules}</ul>`}
<h3>CMF sources of the treatments in the list</h3>
<ul class="sources">
${treatments}
</ul>
</section>`;
}

function scope(rule: { district?: string; tag?: string }): string {
  return rule.district !== undefined ? `district ${rule.district}` : rule.tag !== undefined ? `sites tagged ${rule.tag}` : "all sites";
}

function ruleText(rule: PolicyRule): string {
  switch (rule.kind) {
    case "must-fund":
      return `Must fund site ${rule.site}${rule.treatments.length > 0 ? ` with ${rule.treatments.join(", ")}` : ""}`;
    case "never-fund":
      return `Never fund site ${rule.site}${rule.treatments.length > 0 ? ` with ${rule.treatments.join(", ")}` : ""}`;
    case "spend-cap":
    case "spend-floor":
      return `Spend in ${scope(rule)} ${rule.kind === "spend-cap" ? "at most" : "at least"} ${rule.share !== undefined ? `${formatFixed(rule.share * 100, 1)}% of total spend` : formatMoney(rule.amount ?? 0)}`;
    case "ksi-share-floor":
      return `K+A crashes avoided in ${scope(rule)} at least ${formatFixed(rule.share * 100, 1)}% of all K+A crashes avoided`;
    case "max-projects":
      return `At most ${rule.count} projects in ${scope(rule)}`;
  }
}
