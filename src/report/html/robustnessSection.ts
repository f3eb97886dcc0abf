import { formatFixed } from "../formatNumber.js";
import { escapeHtml } from "./escapeHtml.js";
import type { ReportInput } from "./ReportInput.js";

/** How often each funded site stays funded under uncertainty; empty when no analysis was given. */
export function robustnessSection(input: ReportInput): string {
  const { robustness, plan } = input;
  if (robustness === undefined) return "";
  const shares = plan.funded.map(({ entry }) => robustness.selectionProbability.get(entry.site.id) ?? 0);
  const firm = shares.filter((share) => share >= 0.9).length;
  const shaky = shares.filter((share) => share < 0.5).length;
  return `<section id="robustness">
<h2>Robustness</h2>
<p>${escapeHtml(robustness.method)}; ${robustness.draws} draws, each solved to optimality at the chosen budget.</p>
<p>Of the ${plan.funded.length} funded projects, <strong>${firm}</strong> are funded in at least 90% of draws and <strong>${shaky}</strong> in fewer than half (see the "Funded in draws" column of the capital list; ${formatFixed(shares.length > 0 ? (100 * firm) / shares.length : 0, 0)}% of the list is firm).</p>
</section>`;
}
