import type { GeoPoint } from "../model/types.js";
import { buildSiteIndex, DEFAULT_GRID_LIMITS, type GridLimits, type SiteIndex } from "./buildSiteIndex.js";
import { metresPerDegree } from "./metresPerDegree.js";
import { distanceToEdgeM } from "./distanceToEdgeM.js";
import type { NetworkSite } from "./NetworkSite.js";
import { positiveModulo } from "./positiveModulo.js";

/** How far from a site a crash may lie and still belong to it. */
export interface AssignOptions {
  /** Influence radius of an intersection, metres. */
  readonly intersectionRadiusM: number;
  /** Buffer either side of a segment or corridor, metres. */
  readonly segmentBufferM: number;
  /** Bounds on the grid index's memory (buildSiteIndex); the defaults suit any network. */
  readonly gridLimits?: GridLimits;
}

/** 50 m about an intersection and 15 m either side of a segment (common practice). */
export const DEFAULT_ASSIGN_OPTIONS: Required<AssignOptions> = { intersectionRadiusM: 50, segmentBufferM: 15, gridLimits: DEFAULT_GRID_LIMITS };

/**
 * A crash exactly on a radius belongs inside it. This absorbs rounding and the local plane's
 * error (under a millimetre at 50 m): 1 mm, far below the 1e-7° (about 1 cm) to which crash
 * coordinates are usually given.
 */
const ON_RADIUS_TOLERANCE_M = 1e-3;

/** Where each crash went. */
export interface CrashAssignments {
  /** Per crash: index of its site in the input list, or -1 when unassigned. */
  readonly site: Int32Array;
  /** Per crash: distance to its site in metres (NaN when unassigned). */
  readonly distanceM: Float64Array;
  /** Per unassigned crash: index of the nearest site at any distance (-1 for assigned crashes). */
  readonly nearestSite: Int32Array;
  /** Per crash: 1 when it lies outside the sites' extent grown by the larger reach. */
  readonly outsideExtent: Uint8Array;
}

/**
 * Assigns each crash to at most one site: the nearest intersection within its influence radius,
 * else the nearest segment or corridor within its buffer, else none. Distances are measured in a
 * local plane about each crash, scaled by the WGS84 radii of curvature at its latitude
 * (distanceToEdgeM), from the crash to the intersection's point or to the nearest point of the
 * polyline, whose edges are straight lines in degrees taken the short way round (so a network
 * may cross the antimeridian, and span the globe). Equal distances go to the site whose id sorts
 * first. A grid index (buildSiteIndex) keeps the cost near O(crashes + sites), with memory
 * bounded whatever the sites' extent.
 */
export function assignCrashes(
  sites: readonly NetworkSite[],
  crashes: readonly GeoPoint[],
  options: Partial<AssignOptions> = {},
): CrashAssignments {
  const { intersectionRadiusM, segmentBufferM, gridLimits } = { ...DEFAULT_ASSIGN_OPTIONS, ...options };
  if (!(intersectionRadiusM >= 0) || !(segmentBufferM >= 0)) throw new RangeError("radius and buffer must be zero or more metres");
  const reachM = Math.max(intersectionRadiusM, segmentBufferM, 1);
  const index = buildSiteIndex(sites, reachM, gridLimits);
  const isIntersection = Uint8Array.from(sites, (site) => (site.kind === "intersection" ? 1 : 0));
  const before = (a: number, b: number) => sites[a]!.id < sites[b]!.id;

  const site = new Int32Array(crashes.length).fill(-1);
  const distanceM = new Float64Array(crashes.length).fill(NaN);
  const nearestSite = new Int32Array(crashes.length).fill(-1);
  const outsideExtent = new Uint8Array(crashes.length);
  // Built on the first unassigned crash: most tallies of a clean file never need it.
  let occupied: Int32Array | undefined;
  let seen: Int32Array | undefined;
  const { elementSite, elementLonLat: geo, cellStart, cellElements, columns, rows, cellLonDeg, cellLatDeg, originLon, originLat, wrapsAround, spanLonDeg, extent } = index;

  crashes.forEach((crash, crashIndex) => {
    const scale = metresPerDegree(crash.lat);
    // The crash's longitude east of the grid's west edge, in [0, 360).
    const east = positiveModulo(crash.lon - originLon, 360);
    const lon = originLon + east;
    const latReach = reachM / scale.lat;
    const lonReach = reachM / scale.lon;
    const inLatitude = crash.lat >= extent[1] - latReach && crash.lat <= extent[3] + latReach;
    if (!inLatitude || (!wrapsAround && !(lon >= extent[0] - lonReach && lon <= extent[2] + lonReach))) outsideExtent[crashIndex] = 1;
    let bestNode = -1;
    let bestNodeD = Infinity;
    let bestLine = -1;
    let bestLineD = Infinity;
    const column = Math.min(columns - 1, Math.floor(east / cellLonDeg));
    const row = Math.floor((crash.lat - originLat) / cellLatDeg);
    if ((wrapsAround || east <= spanLonDeg) && row >= 0 && row < rows) {
      const cell = row * columns + column;
      for (let k = cellStart[cell]!; k < cellStart[cell + 1]!; k++) {
        const element = cellElements[k]!;
        const s = elementSite[element]!;
        const d = distanceToEdgeM(crash.lon, crash.lat, scale.lon, scale.lat, geo[4 * element]!, geo[4 * element + 1]!, geo[4 * element + 2]!, geo[4 * element + 3]!);
        if (isIntersection[s]) {
          if (d <= intersectionRadiusM + ON_RADIUS_TOLERANCE_M && (d < bestNodeD || (d === bestNodeD && before(s, bestNode)))) {
            bestNode = s;
            bestNodeD = d;
          }
        } else if (d <= segmentBufferM + ON_RADIUS_TOLERANCE_M && (d < bestLineD || (d === bestLineD && before(s, bestLine)))) {
          bestLine = s;
          bestLineD = d;
        }
      }
    }
    if (bestNode >= 0) {
      site[crashIndex] = bestNode;
      distanceM[crashIndex] = bestNodeD;
    } else if (bestLine >= 0) {
      site[crashIndex] = bestLine;
      distanceM[crashIndex] = bestLineD;
    } else {
      occupied ??= occupiedCells(index);
      seen ??= new Int32Array(elementSite.length);
      nearestSite[crashIndex] = nearestAtAnyDistance(index, { occupied, seen, mark: crashIndex + 1 }, crash, scale, before);
    }
  });
  return { site, distanceM, nearestSite, outsideExtent };
}

/**
 * The nearest site to `crash` however far, by searching rings of grid cells outwards: an element
 * not listed in the cells searched so far lies more than (rings searched − 1) cell widths away.
 * Empty stretches of a ring are skipped in O(1) each with a count of occupied cells (`occupied`,
 * a summed-area table), so a crash far from every site costs about one step per ring, not one
 * per cell. On a grid that does not wrap, a crash east of it is searched from both sides (its
 * longitude and that less 360°), so the nearest site the short way round is found either way.
 */
function nearestAtAnyDistance(
  index: SiteIndex,
  search: { readonly occupied: Int32Array; readonly seen: Int32Array; readonly mark: number },
  crash: GeoPoint,
  scale: { readonly lon: number; readonly lat: number },
  before: (a: number, b: number) => boolean,
): number {
  const { occupied, seen, mark } = search;
  const { elementSite, elementLonLat: geo, cellStart, cellElements, columns, rows, cellLonDeg, cellLatDeg, originLon, originLat, wrapsAround, spanLonDeg } = index;
  const east = positiveModulo(crash.lon - originLon, 360);
  const row = Math.floor((crash.lat - originLat) / cellLatDeg);
  // Metres a ring of cells is wide at least, in the crash's plane.
  const ringM = Math.min(cellLonDeg * scale.lon, cellLatDeg * scale.lat);
  let best = -1;
  let bestD = Infinity;
  const width = columns + 1;
  const occupiedIn = (r0: number, r1: number, c0: number, c1: number) =>
    occupied[(r1 + 1) * width + c1 + 1]! - occupied[r0 * width + c1 + 1]! - occupied[(r1 + 1) * width + c0]! + occupied[r0 * width + c0]!;
  // Least distance from the crash to any point of a block of cells (longitude the short way round):
  // nothing listed there for its geometry in the block can be nearer.
  const blockDistanceM = (r0: number, r1: number, c0: number, c1: number) => {
    const spanDeg = (c1 - c0 + 1) * cellLonDeg;
    const intoBlock = positiveModulo(crash.lon - (originLon + c0 * cellLonDeg), 360);
    const lonGap = spanDeg >= 360 || intoBlock <= spanDeg ? 0 : Math.min(intoBlock - spanDeg, 360 - intoBlock);
    const latGap = Math.max(0, originLat + r0 * cellLatDeg - crash.lat, crash.lat - (originLat + (r1 + 1) * cellLatDeg));
    return Math.hypot(lonGap * scale.lon, latGap * scale.lat);
  };
  // Visits the occupied cells of a block of rows r0..r1 and columns c0..c1 (within the grid).
  const visitBlock = (r0: number, r1: number, c0: number, c1: number): void => {
    if (occupiedIn(r0, r1, c0, c1) === 0 || (best >= 0 && blockDistanceM(r0, r1, c0, c1) > bestD)) return;
    if (r0 === r1 && c0 === c1) {
      const cell = r0 * columns + c0;
      for (let k = cellStart[cell]!; k < cellStart[cell + 1]!; k++) {
        const element = cellElements[k]!;
        // A long edge is listed in many cells: measure it once per crash.
        if (seen[element] === mark) continue;
        seen[element] = mark;
        const s = elementSite[element]!;
        const d = distanceToEdgeM(crash.lon, crash.lat, scale.lon, scale.lat, geo[4 * element]!, geo[4 * element + 1]!, geo[4 * element + 2]!, geo[4 * element + 3]!);
        if (d < bestD || (d === bestD && s !== best && before(s, best))) {
          best = s;
          bestD = d;
        }
      }
      return;
    }
    if (r1 - r0 >= c1 - c0) {
      const middle = (r0 + r1) >> 1;
      visitBlock(r0, middle, c0, c1);
      visitBlock(middle + 1, r1, c0, c1);
    } else {
      const middle = (c0 + c1) >> 1;
      visitBlock(r0, r1, c0, middle);
      visitBlock(r0, r1, middle + 1, c1);
    }
  };
  // Visits rows r0..r1 of columns c0..c1, which may run off a wrapping grid's edges.
  const visit = (r0: number, r1: number, c0: number, c1: number) => {
    const top = Math.max(0, r0);
    const bottom = Math.min(rows - 1, r1);
    if (top > bottom) return;
    if (!wrapsAround) {
      if (Math.max(0, c0) <= Math.min(columns - 1, c1)) visitBlock(top, bottom, Math.max(0, c0), Math.min(columns - 1, c1));
      return;
    }
    if (c1 - c0 + 1 >= columns) return visitBlock(top, bottom, 0, columns - 1);
    const from = positiveModulo(c0, columns);
    const to = positiveModulo(c1, columns);
    if (from <= to) visitBlock(top, bottom, from, to);
    else {
      visitBlock(top, bottom, from, columns - 1);
      visitBlock(top, bottom, 0, to);
    }
  };
  const frames = wrapsAround || east <= spanLonDeg ? [east] : [east, east - 360];
  for (const frameEast of frames) {
    const column = wrapsAround ? Math.min(columns - 1, Math.floor(frameEast / cellLonDeg)) : Math.floor(frameEast / cellLonDeg);
    const rowRange = [row, rows - 1 - row];
    const columnRings = wrapsAround ? [Math.floor(columns / 2)] : [column, columns - 1 - column];
    const firstRing = Math.max(0, -Math.min(...rowRange), ...(wrapsAround ? [] : [-Math.min(...columnRings)]));
    const lastRing = Math.max(...rowRange, ...columnRings);
    for (let ring = firstRing; ring <= lastRing; ring++) {
      // Strictly beyond the best: an unsearched element at exactly that distance could win a tie.
      if (best >= 0 && bestD < (ring - 1) * ringM) break;
      visit(row - ring, row - ring, column - ring, column + ring);
      if (ring === 0) continue;
      visit(row + ring, row + ring, column - ring, column + ring);
      // The side columns; on a wrapping grid no column lies more than columns / 2 away.
      if (wrapsAround && 2 * ring > columns) continue;
      visit(row - ring + 1, row + ring - 1, column - ring, column - ring);
      if (!(wrapsAround && 2 * ring === columns)) visit(row - ring + 1, row + ring - 1, column + ring, column + ring);
    }
  }
  return best;
}

/** Summed-area table of occupied cells: entry (r, c) counts the cells with elements in rows < r and columns < c. */
function occupiedCells(index: SiteIndex): Int32Array {
  const { columns, rows, cellStart } = index;
  const width = columns + 1;
  const table = new Int32Array((rows + 1) * width);
  for (let r = 0; r < rows; r++) {
    let inRow = 0;
    for (let c = 0; c < columns; c++) {
      const cell = r * columns + c;
      if (cellStart[cell + 1]! > cellStart[cell]!) inRow++;
      table[(r + 1) * width + c + 1] = table[r * width + c + 1]! + inRow;
    }
  }
  return table;
}
