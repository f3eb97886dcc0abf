import { svgNumber } from "./svgNumber.js";
import type { SensitivityResult } from "../analysis/uncertainty/oneAtATimeSensitivity.js";
import { escapeXml } from "./escapeXml.js";


// About 6.6 px a character at 12 px sans-serif (common practice for Latin text): lines of 44
// characters end well short of the change dot, so a label is wrapped, never cut.
const LINE_CHARACTERS = 44;
const LINE_HEIGHT = 14;

/** Breaks a label into lines of at most LINE_CHARACTERS, at spaces where it can (a long word is split). */
export function wrapLabel(label: string): string[] {
  const lines: string[] = [];
  let line = "";
  for (const word of label.split(" ")) {
    for (let rest = word; rest.length > 0; ) {
      const room = LINE_CHARACTERS - (line === "" ? 0 : line.length + 1);
      if (rest.length <= room) {
        line = line === "" ? rest : `${line} ${rest}`;
        rest = "";
      } else if (line !== "") {
        lines.push(line);
        line = "";
      } else {
        lines.push(rest.slice(0, LINE_CHARACTERS));
        rest = rest.slice(LINE_CHARACTERS);
      }
    }
  }
  if (line !== "" || lines.length === 0) lines.push(line);
  return lines;
}

const ROW_HEIGHT = 26;
const BAR_HEIGHT = ROW_HEIGHT - 8;
const LABEL_WIDTH = 330;
const PANEL_WIDTH = 300;
const GAP = 40;
const TOP = 56;
// Okabe–Ito blue, orange and vermillion (colour-blind safe, as the other charts).
const LOW_COLOUR = "#0072B2";
const HIGH_COLOUR = "#E69F00";
const CHANGE_COLOUR = "#D55E00";

/**
 * A tornado chart (standalone SVG) of the one-at-a-time sensitivity: one row per parameter,
 * widest swing on top; left panel the change in the chosen list's KSI avoided, right panel the
 * change in its B/C, bars from zero to the low (blue) and high (orange) value; a dot marks rows
 * where re-optimising changes the list. Pure: results in, text out.
 */
export function tornadoSvg(sensitivity: SensitivityResult, title: string): string {
  const rows = sensitivity.rows;
  const labels = rows.map((row) => `${row.parameter} (${row.low.label} / ${row.high.label})`);
  const lines = labels.map(wrapLabel);
  // Each row is tall enough for its wrapped label; rowTop[i] is where row i starts.
  const rowHeights = lines.map((wrapped) => Math.max(ROW_HEIGHT, wrapped.length * LINE_HEIGHT + 12));
  const rowTop = rowHeights.map((_, index) => TOP + rowHeights.slice(0, index).reduce((sum, h) => sum + h, 0));
  const bottom = TOP + rowHeights.reduce((sum, h) => sum + h, 0);
  const height = bottom + 50;
  const width = LABEL_WIDTH + 2 * PANEL_WIDTH + GAP + 20;
  const panels = [
    { key: "ksiAvoidedChange" as const, heading: `Change in KSI avoided (base ${svgNumber(sensitivity.baseKsiAvoided)})`, x: LABEL_WIDTH },
    { key: "bcRatioChange" as const, heading: `Change in B/C (base ${svgNumber(sensitivity.baseBcRatio)})`, x: LABEL_WIDTH + PANEL_WIDTH + GAP },
  ];
  const parts: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${width}" height="${height}" viewBox="0 0 ${width} ${height}" font-family="sans-serif" font-size="12">`,
    `<title>${escapeXml(title)}</title>`,
    `<rect width="${width}" height="${height}" fill="#ffffff"/>`,
    `<text x="10" y="20" font-size="15" font-weight="bold">${escapeXml(title)}</text>`,
  ];
  for (const panel of panels) {
    const extent = Math.max(1e-9, ...rows.flatMap((row) => [Math.abs(row.low[panel.key]), Math.abs(row.high[panel.key])]).filter(Number.isFinite));
    const scale = (PANEL_WIDTH / 2 - 10) / extent;
    const zero = panel.x + PANEL_WIDTH / 2;
    parts.push(`<text x="${panel.x + PANEL_WIDTH / 2}" y="${TOP - 12}" text-anchor="middle">${escapeXml(panel.heading)}</text>`);
    parts.push(`<line x1="${zero}" y1="${TOP - 4}" x2="${zero}" y2="${bottom}" stroke="#555"/>`);
    rows.forEach((row, index) => {
      const y = rowTop[index]! + (rowHeights[index]! - BAR_HEIGHT) / 2;
      for (const [value, colour, label] of [[row.low[panel.key], LOW_COLOUR, row.low.label], [row.high[panel.key], HIGH_COLOUR, row.high.label]] as const) {
        if (!Number.isFinite(value)) continue;
        const length = Math.abs(value) * scale;
        const x = value < 0 ? zero - length : zero;
        parts.push(`<rect x="${svgNumber(x)}" y="${y}" width="${svgNumber(length)}" height="${BAR_HEIGHT}" fill="${colour}" fill-opacity="0.8"><title>${escapeXml(`${row.parameter}: ${label} → ${svgNumber(value)}`)}</title></rect>`);
      }
    });
    parts.push(`<text x="${panel.x}" y="${bottom + 16}">${svgNumber(-extent)}</text>`);
    parts.push(`<text x="${panel.x + PANEL_WIDTH}" y="${bottom + 16}" text-anchor="end">+${svgNumber(extent)}</text>`);
  }
  rows.forEach((row, index) => {
    const middle = rowTop[index]! + rowHeights[index]! / 2;
    const changes = row.low.listChanges || row.high.listChanges;
    const wrapped = lines[index]!;
    const first = middle + 4 - ((wrapped.length - 1) * LINE_HEIGHT) / 2;
    const spans = wrapped.map((line, at) => `<tspan x="10" y="${svgNumber(first + at * LINE_HEIGHT)}">${escapeXml(line)}</tspan>`).join("");
    parts.push(`<text class="tornado-label">${spans}<title>${escapeXml(labels[index]!)}</title></text>`);
    if (changes) parts.push(`<circle cx="${LABEL_WIDTH - 8}" cy="${middle}" r="4" fill="${CHANGE_COLOUR}"><title>re-optimising changes the list</title></circle>`);
  });
  const legendY = height - 14;
  parts.push(`<rect x="10" y="${legendY - 10}" width="12" height="12" fill="${LOW_COLOUR}"/><text x="26" y="${legendY}">low value</text>`);
  parts.push(`<rect x="100" y="${legendY - 10}" width="12" height="12" fill="${HIGH_COLOUR}"/><text x="116" y="${legendY}">high value</text>`);
  parts.push(`<circle cx="206" cy="${legendY - 4}" r="4" fill="${CHANGE_COLOUR}"/><text x="216" y="${legendY}">re-optimising changes the list</text>`);
  parts.push("</svg>");
  return parts.join("\n") + "\n";
}
