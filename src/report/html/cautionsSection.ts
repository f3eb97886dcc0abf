import { CAUTIONS } from "../cautions.js";
import { escapeHtml } from "./escapeHtml.js";

/** The professional cautions, and what to know about how this list's figures were reached, shown prominently near the top of the report. */
export function cautionsSection(methodNotes: readonly string[] = []): string {
  const notes = methodNotes.length === 0 ? "" : `\n<h3>About this list's figures</h3>\n<ul id="method-notes">${methodNotes.map((note) => `<li>${escapeHtml(note)}</li>`).join("")}</ul>`;
  return `<section id="cautions" class="cautions" role="note">
<h2>Read this first</h2>
<ul>${CAUTIONS.map((caution) => `<li>${escapeHtml(caution)}</li>`).join("")}</ul>${notes}
</section>`;
}
