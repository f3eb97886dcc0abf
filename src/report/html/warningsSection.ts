import { escapeHtml } from "./escapeHtml.js";
import type { ReportWarning } from "./ReportInput.js";

/** The data-quality warnings found while loading the scenario, each with where and what to do. */
export function warningsSection(warnings: readonly ReportWarning[]): string {
  const body =
    warnings.length === 0
      ? "<p>No data-quality warnings were raised when the scenario was loaded.</p>"
      : `<p>${warnings.length} warning${warnings.length === 1 ? "" : "s"} raised when the scenario was loaded. None stops the analysis; each deserves a look before the list goes to approval.</p>
<ul class="warnings">${warnings
          .map((warning) => `<li><span class="where">${escapeHtml(warning.where)}</span> ${escapeHtml(warning.message)}${warning.hint ? ` <span class="hint">(${escapeHtml(warning.hint)})</span>` : ""}</li>`)
          .join("\n")}</ul>`;
  return `<section id="warnings">
<h2>Data-quality warnings</h2>
${body}
</section>`;
}
