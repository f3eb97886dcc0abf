import type { GeoPoint } from "../model/types.js";
import { buildSiteIndex, type SiteIndex } from "./buildSiteIndex.js";
import { planeX, planeY } from "./localPlane.js";
import type { NetworkSite } from "./NetworkSite.js";
import { pointSegmentDistance } from "./pointSegmentDistance.js";

/** How far from a site a crash may lie and still belong to it. */
export interface AssignOptions {
  /** Influence radius of an intersection, metres. */
  readonly intersectionRadiusM: number;
  /** Buffer either side of a segment or corridor, metres. */
  readonly segmentBufferM: number;
}

/** 50 m about an intersection and 15 m either side of a segment (common practice). */
export const DEFAULT_ASSIGN_OPTIONS: Required<AssignOptions> = { intersectionRadiusM: 50, segmentBufferM: 15 };

/** A crash exactly on a radius belongs inside it; this absorbs floating-point rounding (1 µm). */
const ON_RADIUS_TOLERANCE_M = 1e-6;

/** Where each crash went. */
export interface CrashAssignments {
  /** Per crash: index of its site in the input list, or -1 when unassigned. */
  readonly site: Int32Array;
  /** Per crash: distance to its site in metres (NaN when unassigned). */
  readonly distanceM: Float64Array;
  /** Per unassigned crash: index of the nearest site at any distance (-1 for assigned crashes). */
  readonly nearestSite: Int32Array;
  /** Per crash: 1 when it lies outside the sites' bounding box grown by the larger reach. */
  readonly outsideExtent: Uint8Array;
}

/**
 * Assigns each crash to at most one site: the nearest intersection within its influence radius,
 * else the nearest segment or corridor within its buffer, else none. Distances are measured in a
 * local plane about the network's centre (see localPlane for the error bound) from the crash to
 * the intersection's point or to the nearest point of the polyline. Equal distances go to the
 * site whose id sorts first. A grid index (buildSiteIndex) keeps the cost near
 * O(crashes + sites) rather than O(crashes × sites).
 */
export function assignCrashes(
  sites: readonly NetworkSite[],
  crashes: readonly GeoPoint[],
  options: Partial<AssignOptions> = {},
): CrashAssignments {
  const { intersectionRadiusM, segmentBufferM } = { ...DEFAULT_ASSIGN_OPTIONS, ...options };
  if (!(intersectionRadiusM >= 0) || !(segmentBufferM >= 0)) throw new RangeError("radius and buffer must be zero or more metres");
  const index = buildSiteIndex(sites, Math.max(intersectionRadiusM, segmentBufferM, 1));
  const isIntersection = Uint8Array.from(sites, (site) => (site.kind === "intersection" ? 1 : 0));
  const before = (a: number, b: number) => sites[a]!.id < sites[b]!.id;

  const site = new Int32Array(crashes.length).fill(-1);
  const distanceM = new Float64Array(crashes.length).fill(NaN);
  const nearestSite = new Int32Array(crashes.length).fill(-1);
  const outsideExtent = new Uint8Array(crashes.length);
  const { elementSite, elementXY, cellStart, cellElements, columns, rows, cellM, originX, originY, reachM, extent } = index;

  crashes.forEach((crash, crashIndex) => {
    const x = planeX(index.plane, crash.lon);
    const y = planeY(index.plane, crash.lat);
    if (x < extent[0] - reachM || x > extent[2] + reachM || y < extent[1] - reachM || y > extent[3] + reachM) outsideExtent[crashIndex] = 1;
    let bestNode = -1;
    let bestNodeD = Infinity;
    let bestLine = -1;
    let bestLineD = Infinity;
    const column = Math.floor((x - originX) / cellM);
    const row = Math.floor((y - originY) / cellM);
    if (column >= 0 && column < columns && row >= 0 && row < rows) {
      const cell = row * columns + column;
      for (let k = cellStart[cell]!; k < cellStart[cell + 1]!; k++) {
        const element = cellElements[k]!;
        const s = elementSite[element]!;
        const d = pointSegmentDistance(x, y, elementXY[4 * element]!, elementXY[4 * element + 1]!, elementXY[4 * element + 2]!, elementXY[4 * element + 3]!);
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
      nearestSite[crashIndex] = nearestAtAnyDistance(index, x, y, before);
    }
  });
  return { site, distanceM, nearestSite, outsideExtent };
}

/**
 * The nearest site to (x, y) however far, by searching rings of grid cells outwards: an element
 * not listed in the cells searched so far lies more than (rings searched) × cell size away.
 */
function nearestAtAnyDistance(index: SiteIndex, x: number, y: number, before: (a: number, b: number) => boolean): number {
  const { elementSite, elementXY, cellStart, cellElements, columns, rows, cellM, originX, originY } = index;
  const column = Math.floor((x - originX) / cellM);
  const row = Math.floor((y - originY) / cellM);
  let best = -1;
  let bestD = Infinity;
  const visit = (c: number, r: number) => {
    if (c < 0 || c >= columns || r < 0 || r >= rows) return;
    const cell = r * columns + c;
    for (let k = cellStart[cell]!; k < cellStart[cell + 1]!; k++) {
      const element = cellElements[k]!;
      const s = elementSite[element]!;
      const d = pointSegmentDistance(x, y, elementXY[4 * element]!, elementXY[4 * element + 1]!, elementXY[4 * element + 2]!, elementXY[4 * element + 3]!);
      if (d < bestD || (d === bestD && s !== best && before(s, best))) {
        best = s;
        bestD = d;
      }
    }
  };
  const firstRing = Math.max(0, column - (columns - 1), -column, row - (rows - 1), -row);
  const lastRing = Math.max(column, columns - 1 - column, row, rows - 1 - row);
  for (let ring = firstRing; ring <= lastRing; ring++) {
    if (best >= 0 && bestD <= (ring - 1) * cellM) break;
    // Walk only the part of each ring that lies on the grid: a crash far off the network (e.g. with
    // swapped coordinates) would otherwise scan rings tens of thousands of cells wide, nearly all empty.
    const c0 = Math.max(0, column - ring);
    const c1 = Math.min(columns - 1, column + ring);
    for (let c = c0; c <= c1; c++) {
      visit(c, row - ring);
      if (ring > 0) visit(c, row + ring);
    }
    const r0 = Math.max(0, row - ring + 1);
    const r1 = Math.min(rows - 1, row + ring - 1);
    for (let r = r0; r <= r1; r++) {
      visit(column - ring, r);
      visit(column + ring, r);
    }
  }
  return best;
}
