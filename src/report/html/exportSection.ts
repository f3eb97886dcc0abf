import { escapeHtml } from "./escapeHtml.js";

/** The capital list as a CSV download embedded as a data: URI (no server needed). */
export function exportSection(csv: string, fileName: string): string {
  const href = `data:text/csv;charset=utf-8,${encodeURIComponent(csv)}`;
  return `<section id="exports" class="screen-only">
<h2>Export</h2>
<p><a id="download-csv" href="${escapeHtml(href)}" download="${escapeHtml(fileName)}">Download the capital list as CSV</a> (one row per project; money in the scenario's currency; text cells that a spreadsheet could run as a formula are prefixed with a quote mark).</p>
</section>`;
}
