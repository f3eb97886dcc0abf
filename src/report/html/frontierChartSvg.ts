import type { FrontierLevel } from "../../analysis/budgetFrontier.js";
import { formatFixed, formatMoney } from "../formatNumber.js";
import { compactAmount } from "./compactAmount.js";
import { escapeHtml } from "./escapeHtml.js";
import { hasList } from "../hasList.js";
import { niceTicks } from "../niceTicks.js";
import { OKABE_ITO } from "./okabeIto.js";

const WIDTH = 720;
const HEIGHT = 330;
const MARGIN = { left: 64, right: 24, top: 18, bottom: 56 };

/**
 * Inline SVG of K+A crashes avoided against budget over the frontier's levels (straight lines join the
 * computed levels), with the chosen budget marked (drawn after the points, so no point hides it)
 * and a ring the slider script moves.
 * Each level's point carries data-level (its index) and its coordinates.
 */
export function frontierChartSvg(frontier: readonly FrontierLevel[], chosenBudget: number, currency: string): string {
  const solved = frontier.map((level, index) => ({ level, index })).filter(({ level }) => hasList(level.plan));
  const maxBudget = Math.max(chosenBudget, ...frontier.map((level) => level.budget), 1);
  const maxKsi = Math.max(...solved.map(({ level }) => level.plan.totals.ksiAvoided), 1);
  const yTicks = niceTicks(0, maxKsi, 5);
  const yTop = Math.max(maxKsi, yTicks[yTicks.length - 1]!);
  const xTicks = niceTicks(0, maxBudget, 6);
  const plotWidth = WIDTH - MARGIN.left - MARGIN.right;
  const plotHeight = HEIGHT - MARGIN.top - MARGIN.bottom;
  const x = (budget: number) => round(MARGIN.left + (plotWidth * budget) / maxBudget);
  const y = (ksi: number) => round(MARGIN.top + plotHeight - (plotHeight * ksi) / yTop);
  const bottom = MARGIN.top + plotHeight;

  const grid = yTicks
    .map((tick) => `<line class="grid" x1="${MARGIN.left}" x2="${WIDTH - MARGIN.right}" y1="${y(tick)}" y2="${y(tick)}"/><text class="tick" x="${MARGIN.left - 6}" y="${y(tick) + 4}" text-anchor="end">${formatFixed(tick, 0)}</text>`)
    .join("");
  const xAxis = xTicks
    .map((tick) => `<line class="axis" x1="${x(tick)}" x2="${x(tick)}" y1="${bottom}" y2="${bottom + 5}"/><text class="tick" x="${x(tick)}" y="${bottom + 18}" text-anchor="middle">${compactAmount(tick)}</text>`)
    .join("");
  const path = solved.map(({ level }, index) => `${index === 0 ? "M" : "L"}${x(level.budget)},${y(level.plan.totals.ksiAvoided)}`).join("");
  const points = solved
    .map(({ level, index }) => {
      const cx = x(level.budget);
      const cy = y(level.plan.totals.ksiAvoided);
      return `<circle class="level" data-level="${index}" data-x="${cx}" data-y="${cy}" cx="${cx}" cy="${cy}" r="3.5" fill="${OKABE_ITO.blue}"><title>Budget ${formatMoney(level.budget)}: ${formatFixed(level.plan.totals.ksiAvoided, 1)} K+A crashes avoided, ${level.plan.totals.projects} projects</title></circle>`;
    })
    .join("");
  const chosen = frontier.find((level) => level.budget === chosenBudget);
  const chosenMark =
    chosen !== undefined && hasList(chosen.plan)
      ? `<line class="chosen" x1="${x(chosenBudget)}" x2="${x(chosenBudget)}" y1="${MARGIN.top}" y2="${bottom}" stroke="${OKABE_ITO.vermillion}"/><path class="chosen-marker" d="M${x(chosenBudget)},${y(chosen.plan.totals.ksiAvoided) - 8}l8,8l-8,8l-8,-8z" fill="${OKABE_ITO.vermillion}" stroke="#fff"/><text class="chosen-label" x="${x(chosenBudget) + (x(chosenBudget) > WIDTH * 0.7 ? -10 : 10)}" y="${bottom - 10}" text-anchor="${x(chosenBudget) > WIDTH * 0.7 ? "end" : "start"}">Chosen budget ${formatMoney(chosenBudget)}: ${formatFixed(chosen.plan.totals.ksiAvoided, 1)} K+A crashes avoided</text>`
      : "";
  const unsolved = frontier.length - solved.length;
  const note = unsolved > 0 ? `<text class="tick" x="${MARGIN.left}" y="${HEIGHT - 4}">${unsolved} level${unsolved === 1 ? "" : "s"} with no possible list (the rules cost more) not plotted</text>` : "";
  return `<svg class="chart" id="frontier-chart" viewBox="0 0 ${WIDTH} ${HEIGHT}" role="img" aria-labelledby="frontier-title">
<title id="frontier-title">K+A crashes avoided by the optimal list at each budget</title>
${grid}
<line class="axis" x1="${MARGIN.left}" x2="${WIDTH - MARGIN.right}" y1="${bottom}" y2="${bottom}"/>${xAxis}
<text class="axis-label" x="${MARGIN.left + plotWidth / 2}" y="${bottom + 38}" text-anchor="middle">Budget (${escapeHtml(currency)})</text>
<text class="axis-label" transform="translate(16 ${MARGIN.top + plotHeight / 2}) rotate(-90)" text-anchor="middle">K+A crashes avoided</text>
<path class="frontier" d="${path}" fill="none" stroke="${OKABE_ITO.blue}" stroke-width="2"/>
${points}
${chosenMark}
<circle id="frontier-current" r="8" fill="none" stroke="${OKABE_ITO.black}" stroke-width="2" cx="-20" cy="-20" visibility="hidden"/>
${note}
</svg>`;
}

function round(value: number): number {
  return Math.round(value * 10) / 10;
}
