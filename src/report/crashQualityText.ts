import { REJECT_REASONS } from "../geo/CrashRecord.js";
import type { CrashDataQuality } from "../geo/tallyNetwork.js";
import { FULL_YEAR_SHARE } from "../geo/inferCrashWindow.js";
import { MIN_RECOMMENDED_WINDOW_YEARS } from "../model/siteBaselines.js";

/**
 * The data-quality account of a tally as plain text: where every row went (assigned, unassigned,
 * rejected by reason, adding up to the rows read), how a window taken from the data was chosen and
 * the rows it leaves out, untranslated severity and type codes, unassigned shares by district,
 * years with crashes per site, and the rejected rows with their lines. `maxListed` caps the row lists
 * (for the terminal); `savedTo` names the file that lists everything, when one was written, so
 * a capped list never points at a report that does not exist.
 */
export function crashQualityText(quality: CrashDataQuality, inputs: { readonly crashes: string; readonly sites: string }, maxListed = Infinity, savedTo?: string): string {
  const { window } = quality;
  const windowYears = window.lastYear - window.firstYear + 1;
  const rejectedCount = quality.rejected.length;
  const percent = (part: number, whole: number) => (whole > 0 ? `${((100 * part) / whole).toFixed(1)}%` : "-");
  const lines = [
    `Crash data quality: ${inputs.crashes} against ${inputs.sites}, window ${window.firstYear}-${window.lastYear} (${windowYears} year${windowYears === 1 ? "" : "s"})`,
    `  rows read              ${quality.rowsRead}`,
    `  assigned to a site     ${quality.assigned} (${percent(quality.assigned, quality.rowsRead)})`,
    `  unassigned             ${quality.unassigned}, of which ${quality.outsideExtent} outside the sites' extent`,
    `  rejected               ${rejectedCount}`,
    ...REJECT_REASONS.filter((reason) => quality.rejectedByReason[reason] > 0).map((reason) => `    ${reason.padEnd(22)}${quality.rejectedByReason[reason]}`),
    `  ${quality.assigned} assigned + ${quality.unassigned} unassigned + ${rejectedCount} rejected = ${quality.assigned + quality.unassigned + rejectedCount} of ${quality.rowsRead} rows read`,
    "",
    ...windowLines(quality),
    ...unknownCodeLines(quality),
    "Unassigned share by district (an unassigned crash counts in its nearest site's district):",
    ...quality.districts.map((d) => `  ${d.district.padEnd(24)}${d.unassigned} of ${d.crashes} (${percent(d.unassigned, d.crashes)})`),
    "",
  ];
  const gaps = quality.yearsBySite.filter((entry) => entry.years.length < windowYears);
  lines.push(`Years with crashes per site: ${quality.yearsBySite.length - gaps.length} of ${quality.yearsBySite.length} sites have crashes in every year of the window`);
  for (const entry of gaps.slice(0, maxListed)) {
    const missing: number[] = [];
    for (let year = window.firstYear; year <= window.lastYear; year++) if (!entry.years.includes(year)) missing.push(year);
    lines.push(`  ${entry.site}: ${entry.years.length === 0 ? "no crashes" : `crashes in ${entry.years.join(", ")}; none in ${missing.join(", ")}`}`);
  }
  if (gaps.length > maxListed) lines.push(`  … and ${gaps.length - maxListed} more sites`);
  if (rejectedCount > 0) {
    lines.push("", "Rejected rows:");
    for (const row of quality.rejected.slice(0, maxListed)) lines.push(`  line ${row.line}: ${row.reason}: ${row.message}`);
    if (rejectedCount > maxListed) lines.push(`  … and ${rejectedCount - maxListed} more (${savedTo === undefined ? "nothing was saved: fix the problem above and rerun to save the full list" : `all are listed in ${savedTo}`})`);
  }
  if (quality.unassigned > 0) {
    const shown = quality.unassignedLines.slice(0, maxListed);
    lines.push("", `Unassigned rows (no site within reach), lines: ${shown.join(", ")}${quality.unassigned > shown.length ? ", …" : ""}`);
  }
  if (windowYears < MIN_RECOMMENDED_WINDOW_YEARS) {
    lines.push("", `warning: the window covers ${windowYears} year(s); common practice is 3 to 5 years (short windows overstate sites with a chance bad year: regression to the mean)`);
  }
  return lines.join("\n") + "\n";
}

/** How the window was taken from the data and which rows it leaves out (nothing when it was given). */
function windowLines(quality: CrashDataQuality): string[] {
  const inference = quality.windowInference;
  if (inference === undefined) return [];
  const { firstYear, lastYear } = inference.window;
  const leftOut = inference.leftOut.map((entry) => `${entry.year} (${entry.rows})`).join(", ");
  return [
    `Window taken from the data (no --window): ${firstYear}-${lastYear}, the latest run of consecutive full years; a year is full when it holds at least ${100 * FULL_YEAR_SHARE}% of the median year's ${inference.medianYearRows} rows`,
    `  rows by year: ${inference.rowsByYear.map((entry) => `${entry.year} ${entry.rows}`).join(", ")}`,
    inference.leftOutRows === 0
      ? "  left out: none"
      : `  left out: ${inference.leftOutRows} row${inference.leftOutRows === 1 ? "" : "s"} from ${leftOut} (rejected as outside-window; pass --window to choose the years)`,
    "",
  ];
}

/** The severity and type codes no mapping translated, with their rows and first lines. */
function unknownCodeLines(quality: CrashDataQuality): string[] {
  const codes = quality.unknownCodes ?? [];
  if (codes.length === 0) return [];
  return [
    "Unknown codes (their rows are rejected; translate them in a --mapping file, e.g. severity: { \"9\": O } or type: { SS: other }):",
    ...codes.map((code) => `  ${code.field} ${code.code === "" ? "(empty)" : JSON.stringify(code.code)}: ${code.rows} row${code.rows === 1 ? "" : "s"}, first on line ${code.firstLine}`),
    "",
  ];
}
