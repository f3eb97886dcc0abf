import type { FrontierSummary } from "../analysis/summariseFrontier.js";
import type { FrontierContext } from "./frontierTable.js";
import { formatFixed, formatMoney } from "./formatNumber.js";
import { niceTicks } from "./niceTicks.js";
import { escapeXml } from "./escapeXml.js";

const WIDTH = 760;
const HEIGHT = 460;
const MARGIN = { left: 78, right: 24, top: 56, bottom: 64 };
// Okabe & Ito (2008) colour-blind-safe palette: blue for the curve, vermillion for the budget mark.
const CURVE = "#0072B2";
const MARK = "#D55E00";
const INK = "#222222";
const GRID = "#DDDDDD";

/**
 * The budget frontier as a self-contained SVG: K+A crashes avoided against budget as a step curve (the
 * optimum at a level holds until the next level is reached), axes with ticks and labels, and the
 * scenario's own budget marked by a dashed line. Accessible (role="img", title and desc), no
 * external fonts, styles or scripts. Pure: summary in, text out.
 */
export function frontierSvg(summary: FrontierSummary, context: FrontierContext): string {
  // Levels without a solved list (below the must-fund cost) have no point on the curve.
  const rows = summary.rows.filter((row) => row.status === "optimal" || row.status === "time-limit");
  const budgets = rows.map((row) => row.budget);
  const xMax = Math.max(...budgets, context.scenarioBudget, 1);
  const xMin = Math.min(...budgets, context.scenarioBudget, 0);
  const yMax = Math.max(...rows.map((row) => row.ksiAvoided), 1);
  const xTicks = niceTicks(xMin, xMax, 6);
  const yTicks = niceTicks(0, yMax, 5);
  const xTop = Math.max(xMax, xTicks.at(-1) ?? xMax);
  const yTop = Math.max(yMax, yTicks.at(-1) ?? yMax);
  const plotW = WIDTH - MARGIN.left - MARGIN.right;
  const plotH = HEIGHT - MARGIN.top - MARGIN.bottom;
  const x = (budget: number) => MARGIN.left + ((budget - xMin) / (xTop - xMin || 1)) * plotW;
  const y = (ksi: number) => MARGIN.top + plotH - (ksi / (yTop || 1)) * plotH;
  const n = (value: number) => value.toFixed(1);

  const path: string[] = [];
  rows.forEach((row, index) => {
    if (index === 0) path.push(`M${n(x(row.budget))},${n(y(row.ksiAvoided))}`);
    else path.push(`H${n(x(row.budget))}`, `V${n(y(row.ksiAvoided))}`);
  });
  const title = `Budget frontier: K+A crashes avoided against budget, ${context.scenarioName}`;
  const last = rows.at(-1);
  const desc =
    `Step chart of the most K+A crashes avoided that each budget from ${formatMoney(rows[0]?.budget ?? 0)} to ${formatMoney(last?.budget ?? 0)} ${context.currency} can buy, ` +
    `solved at ${rows.length} levels. At the top level ${formatFixed(last?.ksiAvoided ?? 0, 1)} K+A crashes are avoided. ` +
    `The scenario's budget of ${formatMoney(context.scenarioBudget)} is marked with a dashed line.` +
    (summary.diminishingFrom === null ? "" : ` Past ${formatMoney(summary.diminishingFrom)}, each further million buys less than half of what the first million bought.`);

  const parts: string[] = [
    `<svg xmlns="http://www.w3.org/2000/svg" width="${WIDTH}" height="${HEIGHT}" viewBox="0 0 ${WIDTH} ${HEIGHT}" role="img" aria-labelledby="frontier-title frontier-desc" font-family="sans-serif" font-size="12" fill="${INK}">`,
    `<title id="frontier-title">${escapeXml(title)}</title>`,
    `<desc id="frontier-desc">${escapeXml(desc)}</desc>`,
    `<rect width="${WIDTH}" height="${HEIGHT}" fill="#FFFFFF"/>`,
    `<text x="${MARGIN.left}" y="24" font-size="15" font-weight="bold">${escapeXml(`Budget frontier: ${context.scenarioName}`)}</text>`,
    `<text x="${MARGIN.left}" y="42">Most K+A crashes avoided at each budget (optimal list per level)</text>`,
  ];
  for (const tick of yTicks) {
    parts.push(
      `<line x1="${MARGIN.left}" x2="${MARGIN.left + plotW}" y1="${n(y(tick))}" y2="${n(y(tick))}" stroke="${GRID}"/>`,
      `<text x="${MARGIN.left - 8}" y="${n(y(tick) + 4)}" text-anchor="end">${escapeXml(formatFixed(tick, tick % 1 === 0 ? 0 : 1))}</text>`,
    );
  }
  for (const tick of xTicks) {
    parts.push(
      `<line x1="${n(x(tick))}" x2="${n(x(tick))}" y1="${MARGIN.top + plotH}" y2="${MARGIN.top + plotH + 5}" stroke="${INK}"/>`,
      `<text x="${n(x(tick))}" y="${MARGIN.top + plotH + 19}" text-anchor="middle">${escapeXml(compactMoney(tick))}</text>`,
    );
  }
  parts.push(
    `<line x1="${MARGIN.left}" x2="${MARGIN.left + plotW}" y1="${MARGIN.top + plotH}" y2="${MARGIN.top + plotH}" stroke="${INK}"/>`,
    `<line x1="${MARGIN.left}" x2="${MARGIN.left}" y1="${MARGIN.top}" y2="${MARGIN.top + plotH}" stroke="${INK}"/>`,
    `<text x="${MARGIN.left + plotW / 2}" y="${HEIGHT - 16}" text-anchor="middle">${escapeXml(`Budget (${context.currency})`)}</text>`,
    `<text transform="translate(18 ${MARGIN.top + plotH / 2}) rotate(-90)" text-anchor="middle">K+A crashes avoided</text>`,
    `<path d="${path.join(" ")}" fill="none" stroke="${CURVE}" stroke-width="2.5"/>`,
    ...rows.map((row) => `<circle cx="${n(x(row.budget))}" cy="${n(y(row.ksiAvoided))}" r="3" fill="${CURVE}"><title>${escapeXml(`${formatMoney(row.budget)}: ${formatFixed(row.ksiAvoided, 1)} K+A crashes avoided`)}</title></circle>`),
    `<line x1="${n(x(context.scenarioBudget))}" x2="${n(x(context.scenarioBudget))}" y1="${MARGIN.top}" y2="${MARGIN.top + plotH}" stroke="${MARK}" stroke-width="2" stroke-dasharray="6 4"/>`,
    `<text x="${n(x(context.scenarioBudget) + 6)}" y="${MARGIN.top + 14}" fill="${MARK}">${escapeXml(`scenario budget ${compactMoney(context.scenarioBudget)}`)}</text>`,
    "</svg>",
  );
  return parts.join("\n") + "\n";
}

function compactMoney(amount: number): string {
  if (Math.abs(amount) >= 1e6) return `${Number((amount / 1e6).toFixed(2))}M`;
  if (Math.abs(amount) >= 1e3) return `${Number((amount / 1e3).toFixed(1))}k`;
  return String(Math.round(amount));
}
