import { formatFixed, formatMoney } from "../formatNumber.js";
import { escapeHtml } from "./escapeHtml.js";
import type { ReportInput } from "./ReportInput.js";

/** The programme under changed assumptions, beside the base list; empty when no analysis was given. */
export function sensitivitySection(input: ReportInput): string {
  const { sensitivity, plan } = input;
  if (sensitivity === undefined) return "";
  const base = plan.totals;
  const rows = sensitivity.cases
    .map(
      (entry) =>
        `<tr><td>${escapeHtml(entry.label)}</td><td class="num">${entry.projects}</td><td class="num">${formatMoney(entry.cost)}</td><td class="num">${formatFixed(entry.ksiAvoided, 1)}</td><td class="num">${formatFixed(entry.ksiAvoided - base.ksiAvoided, 1)}</td><td class="num">${entry.sitesChanged === undefined ? "–" : entry.sitesChanged}</td></tr>`,
    )
    .join("\n");
  return `<section id="sensitivity">
<h2>Sensitivity</h2>
<p>${escapeHtml(sensitivity.description)}</p>
<table class="list compact">
<thead><tr><th>Case</th><th class="num">Projects</th><th class="num">Spend</th><th class="num">KSI avoided</th><th class="num">Change in KSI</th><th class="num">Sites changed</th></tr></thead>
<tbody><tr><td>Base (this report)</td><td class="num">${base.projects}</td><td class="num">${formatMoney(base.cost)}</td><td class="num">${formatFixed(base.ksiAvoided, 1)}</td><td class="num">0.0</td><td class="num">0</td></tr>
${rows}</tbody>
</table>
</section>`;
}
