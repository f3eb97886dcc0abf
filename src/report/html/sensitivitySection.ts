import type { SensitivityCase } from "../../analysis/uncertainty/oneAtATimeSensitivity.js";
import { formatFixed } from "../formatNumber.js";
import { tornadoSvg } from "../tornadoSvg.js";
import { escapeHtml } from "./escapeHtml.js";
import type { ReportInput } from "./ReportInput.js";

/**
 * One-at-a-time sensitivity of the list (discount rate, crash costs, service lives, each CMF at
 * ±2 SE): the tornado chart inline and a table of the changes and of whether re-optimising
 * changes the list. Empty when no uncertainty analysis was given.
 */
export function sensitivitySection(input: ReportInput): string {
  const { uncertainty } = input;
  if (uncertainty === undefined) return "";
  const { sensitivity } = uncertainty;
  const rows = sensitivity.rows
    .map(
      (row) =>
        `<tr><td>${escapeHtml(row.parameter)}</td><td class="num">${escapeHtml(row.base)}</td>${caseCells(row.low)}${caseCells(row.high)}</tr>`,
    )
    .join("\n");
  const changing = sensitivity.rows.filter((row) => row.low.listChanges || row.high.listChanges).length;
  return `<section id="sensitivity">
<h2>Which assumptions matter</h2>
<p>Each assumption moved on its own to a low and a high value, the rest held: the change in this list's KSI avoided (base ${formatFixed(sensitivity.baseKsiAvoided, 1)}) and B/C (base ${formatFixed(sensitivity.baseBcRatio, 2)}), widest swing first, and whether re-optimising would pick a different list (${changing} of ${sensitivity.rows.length} assumptions would change it).</p>
<figure class="tornado">${tornadoSvg(sensitivity, "One-at-a-time sensitivity of the capital list")}</figure>
<table class="list compact">
<thead><tr><th>Assumption</th><th class="num">Base</th><th class="num">Low</th><th class="num">KSI</th><th class="num">B/C</th><th>List</th><th class="num">High</th><th class="num">KSI</th><th class="num">B/C</th><th>List</th></tr></thead>
<tbody>${rows}</tbody>
</table>
</section>`;
}

function caseCells(value: SensitivityCase): string {
  const signed = (n: number, decimals: number) => `${n > 0 ? "+" : ""}${formatFixed(n, decimals)}`;
  const moves = [...value.entering.map((key) => `enters ${key}`), ...value.leaving.map((key) => `leaves ${key}`)].join("; ");
  const list = value.listChanges ? `<span class="change" title="${escapeHtml(moves)}">changes (${value.entering.length} in, ${value.leaving.length} out)</span>` : "same";
  return `<td class="num">${escapeHtml(value.label)}</td><td class="num">${signed(value.ksiAvoidedChange, 1)}</td><td class="num">${signed(value.bcRatioChange, 2)}</td><td>${list}</td>`;
}
