import type { PlanResult } from "../../analysis/planProgramme.js";
import type { GeoPoint } from "../../model/types.js";
import { formatFixed } from "../formatNumber.js";
import { equirectangularKm, type PlanePoint } from "./equirectangularKm.js";
import { escapeHtml } from "./escapeHtml.js";
import { niceTicks } from "../niceTicks.js";
import { OKABE_ITO } from "./okabeIto.js";
import { scaleBarKm } from "./scaleBarKm.js";

const WIDTH = 720;
const MAP_HEIGHT = 440;
const LEGEND_HEIGHT = 86;
const PAD = 36;
const MAX_RADIUS = 13;
const MIN_RADIUS = 2.5;

interface MappedSite {
  readonly id: string;
  readonly name: string;
  readonly district: string;
  readonly funded: boolean;
  /** K+A crashes avoided by the funded alternative, or by the site's best option when not funded. */
  readonly ksi: number;
  readonly point: PlanePoint;
}

/**
 * A plain SVG map of the sites: equirectangular projection about the centre of the sites'
 * bounding box, funded sites as filled circles and the rest as hollow diamonds (shape and fill
 * differ, not only colour; Okabe–Ito colours), marker area proportional to K+A crashes avoided,
 * district names at their sites' centroids, a legend and a scale bar. Sites without a location
 * are counted in a note.
 */
export function siteMapSvg(plan: PlanResult): string {
  const fundedKsi = new Map(plan.funded.map(({ entry, alternative }) => [entry.site.id, alternative.ksiAvoided]));
  const located = plan.prepared.sites.filter((entry) => entry.site.location !== undefined);
  const unlocated = plan.prepared.sites.length - located.length;
  if (located.length === 0) return `<p class="note">No site has coordinates, so there is no map.</p>`;
  const locations = located.map((entry) => entry.site.location!);
  const centre: GeoPoint = {
    lon: (Math.min(...locations.map((p) => p.lon)) + Math.max(...locations.map((p) => p.lon))) / 2,
    lat: (Math.min(...locations.map((p) => p.lat)) + Math.max(...locations.map((p) => p.lat))) / 2,
  };
  const sites: MappedSite[] = located.map((entry) => {
    const funded = fundedKsi.get(entry.site.id);
    const best = Math.max(0, ...entry.alternatives.map((alternative) => alternative.ksiAvoided));
    return { id: entry.site.id, name: entry.site.name, district: entry.site.district, funded: funded !== undefined, ksi: funded ?? best, point: equirectangularKm(entry.site.location!, centre) };
  });

  const spanXKm = Math.max(...sites.map((s) => Math.abs(s.point.xKm))) * 2 || 1;
  const spanYKm = Math.max(...sites.map((s) => Math.abs(s.point.yKm))) * 2 || 1;
  const pixelsPerKm = Math.min((WIDTH - 2 * PAD) / spanXKm, (MAP_HEIGHT - 2 * PAD) / spanYKm);
  const px = (point: PlanePoint) => ({ x: round(WIDTH / 2 + point.xKm * pixelsPerKm), y: round(MAP_HEIGHT / 2 - point.yKm * pixelsPerKm) });
  const maxKsi = Math.max(...sites.map((s) => s.ksi), 1e-9);
  const radius = (ksi: number) => round(Math.max(MIN_RADIUS, MAX_RADIUS * Math.sqrt(Math.max(0, ksi) / maxKsi)));

  const districts = [...new Set(sites.map((s) => s.district))].sort();
  const labels = districts
    .map((district) => {
      const members = sites.filter((s) => s.district === district).map((s) => px(s.point));
      const x = round(members.reduce((sum, p) => sum + p.x, 0) / members.length);
      const y = round(members.reduce((sum, p) => sum + p.y, 0) / members.length);
      return `<text class="district" x="${x}" y="${y}" text-anchor="middle">${escapeHtml(district)}</text>`;
    })
    .join("");

  // Hollow markers first and larger before smaller, so no marker hides a smaller one.
  const order = [...sites].sort((a, b) => Number(a.funded) - Number(b.funded) || b.ksi - a.ksi || a.id.localeCompare(b.id));
  const markers = order
    .map((site) => {
      const { x, y } = px(site.point);
      const r = radius(site.ksi);
      const title = `<title>${escapeHtml(`${site.id} ${site.name} (${site.district}): ${site.funded ? "funded" : "not funded"}, ${formatFixed(site.ksi, 1)} K+A crashes ${site.funded ? "avoided" : "avoidable by its best option"}`)}</title>`;
      return site.funded
        ? `<circle class="site funded" data-site="${escapeHtml(site.id)}" cx="${x}" cy="${y}" r="${r}" fill="${OKABE_ITO.blue}" fill-opacity="0.85" stroke="#fff" stroke-width="1">${title}</circle>`
        : `<path class="site not-funded" data-site="${escapeHtml(site.id)}" d="${diamond(x, y, r)}" fill="none" pointer-events="visible" stroke="${OKABE_ITO.vermillion}" stroke-width="1.8">${title}</path>`;
    })
    .join("\n");

  const legendTop = MAP_HEIGHT + 10;
  const sizeValues = niceTicks(0, maxKsi, 4).filter((value) => value > 0).slice(-3);
  let sizeX = 330;
  const sizeKeys = sizeValues
    .map((value) => {
      const r = radius(value);
      const key = `<circle cx="${round(sizeX + r)}" cy="${legendTop + 40}" r="${r}" fill="none" stroke="#444"/><text class="legend" x="${round(sizeX + r)}" y="${legendTop + 70}" text-anchor="middle">${formatFixed(value, 0)}</text>`;
      sizeX += 2 * r + 22;
      return key;
    })
    .join("");

  const mapWidthKm = (WIDTH - 2 * PAD) / pixelsPerKm;
  const barKm = scaleBarKm(mapWidthKm / 4);
  const barPixels = round(barKm * pixelsPerKm);
  const barX = WIDTH - PAD - barPixels;
  const barY = legendTop + 44;

  return `<svg class="map" id="site-map" viewBox="0 0 ${WIDTH} ${MAP_HEIGHT + LEGEND_HEIGHT}" role="img" aria-labelledby="map-title">
<title id="map-title">Map of candidate sites: funded and not funded</title>
<rect x="0.5" y="0.5" width="${WIDTH - 1}" height="${MAP_HEIGHT - 1}" fill="#f6f6f2" stroke="#bbb"/>
<text class="legend" x="${WIDTH - 14}" y="22" text-anchor="end">N ↑</text>
${labels}
${markers}
<g class="map-legend">
<circle cx="${PAD}" cy="${legendTop + 16}" r="7" fill="${OKABE_ITO.blue}" fill-opacity="0.85"/><text class="legend" x="${PAD + 14}" y="${legendTop + 20}">Funded (filled circle)</text>
<path d="${diamond(PAD, legendTop + 44, 7)}" fill="none" stroke="${OKABE_ITO.vermillion}" stroke-width="1.8"/><text class="legend" x="${PAD + 14}" y="${legendTop + 48}">Not funded (hollow diamond)</text>
<text class="legend" x="330" y="${legendTop + 14}">Size: K+A crashes avoided</text>
${sizeKeys}
<line x1="${barX}" x2="${barX + barPixels}" y1="${barY}" y2="${barY}" stroke="#222" stroke-width="2"/><line x1="${barX}" x2="${barX}" y1="${barY - 5}" y2="${barY + 5}" stroke="#222"/><line x1="${barX + barPixels}" x2="${barX + barPixels}" y1="${barY - 5}" y2="${barY + 5}" stroke="#222"/>
<text class="legend" id="scale-bar-label" x="${round(barX + barPixels / 2)}" y="${barY - 9}" text-anchor="middle" data-km="${barKm}" data-pixels="${barPixels}">${formatScale(barKm)}</text>
</g>
</svg>
<p class="note">Not funded sites are sized by what their best option would avoid. Colours from the Okabe–Ito colour-blind-safe palette; shape and fill also tell funded from not funded. Equirectangular projection about the sites' centre (${formatFixed(centre.lat, 4)}°, ${formatFixed(centre.lon, 4)}°); no base map.${unlocated > 0 ? ` ${unlocated} site${unlocated === 1 ? " has" : "s have"} no coordinates and ${unlocated === 1 ? "is" : "are"} not shown.` : ""} Scale bar ${formatScale(barKm)}; ${plan.funded.length} of ${plan.prepared.sites.length} sites funded.</p>`;
}

function diamond(x: number, y: number, r: number): string {
  // Half-diagonal r·√(π/2) gives the diamond the area of a circle of radius r.
  const d = round(r * Math.sqrt(Math.PI / 2));
  return `M${round(x)},${round(y - d)}L${round(x + d)},${round(y)}L${round(x)},${round(y + d)}L${round(x - d)},${round(y)}Z`;
}

function formatScale(km: number): string {
  return km < 1 ? `${Math.round(km * 1000)} m` : `${km} km`;
}

function round(value: number): number {
  return Math.round(value * 10) / 10;
}
