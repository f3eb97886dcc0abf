import { svgNumber } from "../svgNumber.js";
import type { Evaluation } from "../../analysis/evaluateBuiltProjects.js";
import { escapeXml } from "../escapeXml.js";
import { niceTicks } from "../niceTicks.js";
import { preferredEstimate } from "../../analysis/preferredEstimate.js";

const LABEL_WIDTH = 340;
const PLOT_WIDTH = 380;
const ROW_HEIGHT = 22;
const TOP = 54;
const BOTTOM_MARGIN = 44;
// Okabe–Ito blue for the estimates and grey for the no-effect line (colour-blind safe, as the other charts).
const ESTIMATE_COLOUR = "#0072B2";
const REFERENCE_COLOUR = "#777777";


/**
 * The evaluation's estimates as a standalone SVG interval chart: one row per group of projects ×
 * crash group, θ as a dot with its 95% interval as a line, a dashed line at θ = 1 (no effect).
 * The Empirical Bayes estimate where there is one, else the comparison group's; rows with
 * neither are listed without a mark. Pure: results in, text out.
 */
export function evaluationSvg(evaluation: Evaluation): string {
  const rows = evaluation.groups.flatMap((group) => group.crashGroups.map((entry) => ({ label: `${group.name}: ${entry.crashGroup.label}`, estimate: preferredEstimate(entry), method: entry.empiricalBayes !== null ? "EB" : "comparison" })));
  const highest = Math.max(1.2, ...rows.map((row) => (row.estimate === null ? 0 : row.estimate.upper95)));
  const ticks = niceTicks(0, highest, 5);
  // The ticks stop at or below `highest`; one more step keeps every interval inside the plot.
  if (ticks[ticks.length - 1]! < highest) ticks.push(Number((2 * ticks[ticks.length - 1]! - ticks[ticks.length - 2]!).toPrecision(12)));
  const top = ticks[ticks.length - 1]!;
  const x = (value: number) => LABEL_WIDTH + (Math.min(value, top) / top) * PLOT_WIDTH;
  const height = TOP + rows.length * ROW_HEIGHT + BOTTOM_MARGIN;
  const width = LABEL_WIDTH + PLOT_WIDTH + 40;
  const parts = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif" font-size="12" role="img" aria-label="Local CMF estimates with 95% intervals">`,
    `<title>${escapeXml(`Local CMF estimates: ${evaluation.title}`)}</title>`,
    `<text x="8" y="20" font-size="14" font-weight="bold">${escapeXml(`Local CMF (θ) with 95% interval: ${evaluation.title}`)}</text>`,
    `<text x="8" y="38" fill="#444">Left of the dashed line: fewer crashes than expected without the treatment. Estimates are uncertain; see the cautions.</text>`,
  ];
  for (const tick of ticks) {
    parts.push(`<line x1="${svgNumber(x(tick))}" y1="${TOP - 4}" x2="${svgNumber(x(tick))}" y2="${TOP + rows.length * ROW_HEIGHT}" stroke="#e0e0e0"/>`);
    parts.push(`<text x="${svgNumber(x(tick))}" y="${TOP + rows.length * ROW_HEIGHT + 16}" text-anchor="middle">${svgNumber(tick)}</text>`);
  }
  parts.push(`<line x1="${svgNumber(x(1))}" y1="${TOP - 4}" x2="${svgNumber(x(1))}" y2="${TOP + rows.length * ROW_HEIGHT}" stroke="${REFERENCE_COLOUR}" stroke-dasharray="4 3"/>`);
  parts.push(`<text x="${svgNumber(LABEL_WIDTH + PLOT_WIDTH / 2)}" y="${height - 8}" text-anchor="middle">θ: crashes with ÷ expected without the treatment</text>`);
  rows.forEach((row, index) => {
    const y = TOP + index * ROW_HEIGHT + ROW_HEIGHT / 2;
    const label = row.label.length > 52 ? `${row.label.slice(0, 51)}…` : row.label;
    parts.push(`<text x="8" y="${svgNumber(y + 4)}">${escapeXml(label)}</text>`);
    if (row.estimate === null) {
      parts.push(`<text x="${LABEL_WIDTH + 4}" y="${svgNumber(y + 4)}" fill="#777">no estimate</text>`);
      return;
    }
    const { theta, lower95, upper95 } = row.estimate;
    parts.push(`<line x1="${svgNumber(x(lower95))}" y1="${svgNumber(y)}" x2="${svgNumber(x(upper95))}" y2="${svgNumber(y)}" stroke="${ESTIMATE_COLOUR}" stroke-width="2"/>`);
    parts.push(`<circle cx="${svgNumber(x(theta))}" cy="${svgNumber(y)}" r="4" fill="${ESTIMATE_COLOUR}"><title>${escapeXml(`${row.label}: θ ${theta.toFixed(3)} (${lower95.toFixed(3)}–${upper95.toFixed(3)}), ${row.method}`)}</title></circle>`);
  });
  parts.push("</svg>");
  return parts.join("\n") + "\n";
}
