import { createHash } from "node:crypto";
import { planCsv } from "../planCsv.js";
import { assumptionsSection } from "./assumptionsSection.js";
import { budgetSection } from "./budgetSection.js";
import { BUDGET_SLIDER_SCRIPT } from "./budgetSliderScript.js";
import { capitalListSection } from "./capitalListSection.js";
import { planMethodNotes } from "../../analysis/planMethodNotes.js";
import { cautionsSection } from "./cautionsSection.js";
import { escapeHtml } from "./escapeHtml.js";
import { evidenceSection } from "./evidenceSection.js";
import { exportSection } from "./exportSection.js";
import { programmeSection } from "./programmeSection.js";
import { notFundedSection } from "./notFundedSection.js";
import type { ReportInput } from "./ReportInput.js";
import { REPORT_STYLES } from "./reportStyles.js";
import { robustnessSection } from "./robustnessSection.js";
import { sensitivitySection } from "./sensitivitySection.js";
import { siteMapSvg } from "./siteMapSvg.js";
import { summarySection } from "./summarySection.js";
import { warningsSection } from "./warningsSection.js";

/**
 * The whole report as one self-contained HTML page: inline CSS and SVG, the frontier as embedded
 * JSON and one small inline script for the budget slider. A Content-Security-Policy allows that
 * one script (by its SHA-256 hash) and nothing from the network. Same input → same bytes.
 */
export function reportHtml(input: ReportInput): string {
  const scenario = input.plan.prepared.scenario;
  const scriptHash = createHash("sha256").update(BUDGET_SLIDER_SCRIPT).digest("base64");
  const policy = `default-src 'none'; style-src 'unsafe-inline'; img-src data:; script-src 'sha256-${scriptHash}'; base-uri 'none'; form-action 'none'`;
  return `<!DOCTYPE html>
<html lang="en">
<head>
<meta charset="utf-8">
<meta http-equiv="Content-Security-Policy" content="${policy}">
<meta name="viewport" content="width=device-width, initial-scale=1">
<title>${escapeHtml(scenario.name)}: capital programme report</title>
<style>${REPORT_STYLES}</style>
</head>
<body>
<main>
<header class="report-head">
<h1>${escapeHtml(scenario.name)}</h1>
<p>Road-safety capital programme: the list of treatments to fund, what it achieves, and why.</p>
</header>
${summarySection(input)}
${cautionsSection(planMethodNotes(input.plan).notes)}
${capitalListSection(input)}
${programmeSection(input)}
${budgetSection(input)}
<section id="map">
<h2>Where the money goes</h2>
<figure>${siteMapSvg(input.plan)}</figure>
</section>
${notFundedSection(input)}
${robustnessSection(input)}
${sensitivitySection(input)}
${evidenceSection(input.evaluation)}
${assumptionsSection(input.plan)}
${warningsSection(input.warnings)}
${exportSection(planCsv(input.plan), input.csvFileName)}
</main>
<script>${BUDGET_SLIDER_SCRIPT}</script>
</body>
</html>
`;
}
