import type { PlanResult } from "../../analysis/planProgramme.js";
import { formatMoney } from "../formatNumber.js";
import { niceTicks } from "../niceTicks.js";
import { compactAmount } from "./compactAmount.js";
import { escapeHtml } from "./escapeHtml.js";
import { OKABE_ITO } from "./okabeIto.js";

const WIDTH = 720;
const MARGIN = { left: 64, right: 24, top: 18, bottom: 24 };
const round = (value: number) => Math.round(value * 10) / 10;

/** Inline SVG of each year's spend (filled bar) against its budget plus what earlier years carried in (outlined bar). */
export function yearSpendChartSvg(plan: PlanResult, currency: string): string {
  const years = plan.years ?? [];
  const height = 260;
  const top = Math.max(1, ...years.map((year) => Math.max(year.spend, year.budget + year.carriedIn)));
  const ticks = niceTicks(0, top, 5);
  const yTop = Math.max(top, ticks[ticks.length - 1]!);
  const plotWidth = WIDTH - MARGIN.left - MARGIN.right;
  const plotHeight = height - MARGIN.top - MARGIN.bottom;
  const slot = plotWidth / Math.max(1, years.length);
  const y = (amount: number) => round(MARGIN.top + plotHeight - (plotHeight * amount) / yTop);
  const bottom = MARGIN.top + plotHeight;
  const bars = years.map((year, index) => {
    const left = round(MARGIN.left + index * slot + slot * 0.2);
    const width = round(slot * 0.6);
    const available = year.budget + year.carriedIn;
    return `<g data-year="${year.year}"><title>${year.year}: spent ${formatMoney(year.spend)} of ${formatMoney(year.budget)} budget${year.carriedIn > 0 ? ` + ${formatMoney(year.carriedIn)} carried in` : ""}</title>
<rect x="${left}" y="${y(available)}" width="${width}" height="${round(bottom - y(available))}" fill="none" stroke="${OKABE_ITO.black}" stroke-dasharray="4 3"/>
<rect x="${left + width * 0.15}" y="${y(year.spend)}" width="${round(width * 0.7)}" height="${round(bottom - y(year.spend))}" fill="${OKABE_ITO.blue}"/>
<text x="${round(left + width / 2)}" y="${bottom + 16}" text-anchor="middle">${year.year}</text></g>`;
  });
  const grid = ticks.map((tick) => `<line x1="${MARGIN.left}" x2="${WIDTH - MARGIN.right}" y1="${y(tick)}" y2="${y(tick)}" stroke="#ddd"/><text x="${MARGIN.left - 6}" y="${y(tick) + 4}" text-anchor="end">${escapeHtml(compactAmount(tick))}</text>`);
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${WIDTH} ${height}" role="img" aria-label="Capital spent each year against that year's budget (${escapeHtml(currency)})" class="chart" id="year-spend-chart">
${grid.join("\n")}
${bars.join("\n")}
</svg>`;
}

/** Inline SVG timeline: one row per funded project, its capital years (design lighter) and the years it then acts within the programme. */
export function programmeTimelineSvg(plan: PlanResult): string {
  const programme = plan.prepared.scenario.programme;
  if (programme === undefined) return "";
  const projects = [...plan.funded].sort((a, b) => (a.alternative.buildYear ?? 0) - (b.alternative.buildYear ?? 0) || (a.entry.site.id < b.entry.site.id ? -1 : 1));
  const row = 12;
  const height = MARGIN.top + projects.length * row + MARGIN.bottom;
  const left = MARGIN.left + 16;
  const slot = (WIDTH - left - MARGIN.right) / (programme.years + 1);
  const x = (offset: number) => round(left + offset * slot);
  const rows = projects.map(({ entry, alternative }, index) => {
    const top = MARGIN.top + index * row;
    const build = (alternative.buildYear ?? programme.firstYear) - programme.firstYear;
    const capital = (alternative.spendByYear ?? []).map((amount, y) => (amount > 0 ? `<rect x="${x(y)}" y="${top + 1}" width="${round(slot)}" height="${row - 2}" fill="${y === build ? OKABE_ITO.vermillion : OKABE_ITO.orange}"/>` : "")).join("");
    return `<g data-site="${escapeHtml(entry.site.id)}" data-build-year="${alternative.buildYear}"><title>${escapeHtml(entry.site.id)} ${escapeHtml(entry.site.name)}: built ${alternative.buildYear}</title>
<text x="${left - 4}" y="${top + row - 3}" text-anchor="end" font-size="9">${escapeHtml(entry.site.id)}</text>${capital}<rect x="${x(build + 1)}" y="${top + 3}" width="${round(x(programme.years + 1) - x(build + 1))}" height="${row - 6}" fill="${OKABE_ITO.bluishGreen}"/></g>`;
  });
  const labels = Array.from({ length: programme.years + 1 }, (_, y) => `<text x="${round(x(y) + slot / 2)}" y="${height - MARGIN.bottom + 14}" text-anchor="middle">${programme.firstYear + y}</text>`);
  return `<svg xmlns="http://www.w3.org/2000/svg" viewBox="0 0 ${WIDTH} ${height}" role="img" aria-label="Programme timeline: when each project is paid for and when it starts to act" class="chart" id="programme-timeline">
${rows.join("\n")}
${labels.join("\n")}
</svg>`;
}
