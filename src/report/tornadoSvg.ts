import type { SensitivityResult } from "../analysis/uncertainty/oneAtATimeSensitivity.js";
import { escapeXml } from "./escapeXml.js";

function number(value: number): string {
  return Number(value.toFixed(2)).toString();
}

// About 6.2 px a character at 12 px sans-serif (common practice for Latin text), so labels stop short of the change dot.
const LABEL_CHARACTERS = 48;

/** Shortens a label that would run into the bars; the whole label stays in its tooltip. */
function fitLabel(label: string): string {
  return label.length <= LABEL_CHARACTERS ? label : `${label.slice(0, LABEL_CHARACTERS - 1).trimEnd()}…`;
}

const ROW_HEIGHT = 26;
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
  const height = TOP + rows.length * ROW_HEIGHT + 50;
  const width = LABEL_WIDTH + 2 * PANEL_WIDTH + GAP + 20;
  const panels = [
    { key: "ksiAvoidedChange" as const, heading: `Change in KSI avoided (base ${number(sensitivity.baseKsiAvoided)})`, x: LABEL_WIDTH },
    { key: "bcRatioChange" as const, heading: `Change in B/C (base ${number(sensitivity.baseBcRatio)})`, x: LABEL_WIDTH + PANEL_WIDTH + GAP },
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
    parts.push(`<line x1="${zero}" y1="${TOP - 4}" x2="${zero}" y2="${TOP + rows.length * ROW_HEIGHT}" stroke="#555"/>`);
    rows.forEach((row, index) => {
      const y = TOP + index * ROW_HEIGHT + 4;
      for (const [value, colour, label] of [[row.low[panel.key], LOW_COLOUR, row.low.label], [row.high[panel.key], HIGH_COLOUR, row.high.label]] as const) {
        if (!Number.isFinite(value)) continue;
        const length = Math.abs(value) * scale;
        const x = value < 0 ? zero - length : zero;
        parts.push(`<rect x="${number(x)}" y="${y}" width="${number(length)}" height="${ROW_HEIGHT - 8}" fill="${colour}" fill-opacity="0.8"><title>${escapeXml(`${row.parameter}: ${label} → ${number(value)}`)}</title></rect>`);
      }
    });
    parts.push(`<text x="${panel.x}" y="${TOP + rows.length * ROW_HEIGHT + 16}">${number(-extent)}</text>`);
    parts.push(`<text x="${panel.x + PANEL_WIDTH}" y="${TOP + rows.length * ROW_HEIGHT + 16}" text-anchor="end">+${number(extent)}</text>`);
  }
  rows.forEach((row, index) => {
    const y = TOP + index * ROW_HEIGHT + ROW_HEIGHT / 2 + 4;
    const changes = row.low.listChanges || row.high.listChanges;
    const label = `${row.parameter} (${row.low.label} / ${row.high.label})`;
    parts.push(`<text x="10" y="${y}">${escapeXml(fitLabel(label))}<title>${escapeXml(label)}</title></text>`);
    if (changes) parts.push(`<circle cx="${LABEL_WIDTH - 8}" cy="${y - 4}" r="4" fill="${CHANGE_COLOUR}"><title>re-optimising changes the list</title></circle>`);
  });
  const legendY = height - 14;
  parts.push(`<rect x="10" y="${legendY - 10}" width="12" height="12" fill="${LOW_COLOUR}"/><text x="26" y="${legendY}">low value</text>`);
  parts.push(`<rect x="100" y="${legendY - 10}" width="12" height="12" fill="${HIGH_COLOUR}"/><text x="116" y="${legendY}">high value</text>`);
  parts.push(`<circle cx="206" cy="${legendY - 4}" r="4" fill="${CHANGE_COLOUR}"/><text x="216" y="${legendY}">re-optimising changes the list</text>`);
  parts.push("</svg>");
  return parts.join("\n") + "\n";
}
