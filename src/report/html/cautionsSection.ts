import { CAUTIONS } from "../cautions.js";
import { escapeHtml } from "./escapeHtml.js";

/** The professional cautions, shown prominently near the top of the report. */
export function cautionsSection(): string {
  return `<section id="cautions" class="cautions" role="note">
<h2>Read this first</h2>
<ul>${CAUTIONS.map((caution) => `<li>${escapeHtml(caution)}</li>`).join("")}</ul>
</section>`;
}
