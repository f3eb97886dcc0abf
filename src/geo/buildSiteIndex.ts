import { WGS84_A_M, WGS84_F } from "./geodesicDistanceM.js";
import { metresPerDegree } from "./metresPerDegree.js";
import type { NetworkSite } from "./NetworkSite.js";
import { wrapLongitude } from "./wrapLongitude.js";
import { positiveModulo } from "./positiveModulo.js";
import { longitudeArc } from "./longitudeArc.js";

/**
 * A uniform grid in degrees of longitude and latitude over the sites. Each element (an
 * intersection's point or one edge of a polyline) is listed in every cell within `reachM`
 * metres of it, so the elements within reach of a point are all listed in that point's own cell.
 * A long edge is listed cell by cell along its line, never over its whole bounding box. The grid
 * covers the smallest arc of longitude holding the sites (so a network across the antimeridian
 * is one compact grid); when that arc is wider than 180°, columns wrap around the globe.
 * Memory is bounded whatever the extent: at most MAX_GRID_CELLS cells and MAX_GRID_ENTRIES
 * listings (or the GridLimits given), cells growing coarser until both hold; past that only a
 * single cell remains, listing each element once. Building costs O(elements + cells + listings).
 */
export interface SiteIndex {
  readonly reachM: number;
  /** Cell size in degrees of longitude and of latitude. */
  readonly cellLonDeg: number;
  readonly cellLatDeg: number;
  /** West and south edges of cell 0, degrees. */
  readonly originLon: number;
  readonly originLat: number;
  readonly columns: number;
  readonly rows: number;
  /** Whether columns wrap around the globe (the grid then spans all 360° of longitude). */
  readonly wrapsAround: boolean;
  /** Degrees of longitude east of originLon that hold sites and their reach (360 when wrapping). */
  readonly spanLonDeg: number;
  /** Per element: its site's index. */
  readonly elementSite: Int32Array;
  /** Per element: lonA, latA, lonB, latB in degrees as the sites give them (the edge runs the short way). */
  readonly elementLonLat: Float64Array;
  /** Elements of cell c (= row × columns + column) are cellElements[cellStart[c] .. cellStart[c + 1]). */
  readonly cellStart: Int32Array;
  readonly cellElements: Int32Array;
  /** Sites' extent in degrees, longitudes continuous from originLon: minLon, minLat, maxLon, maxLat. */
  readonly extent: readonly [number, number, number, number];
}

/** Most cells a grid may have (16 MiB of offsets). */
export const MAX_GRID_CELLS = 4_000_000;
/** Most element listings a grid may hold over all its cells (32 MiB). */
export const MAX_GRID_ENTRIES = 8_000_000;

/** Bounds on a grid's size: cells, and element listings over all cells. */
export interface GridLimits {
  readonly maxCells: number;
  readonly maxEntries: number;
}
export const DEFAULT_GRID_LIMITS: GridLimits = { maxCells: MAX_GRID_CELLS, maxEntries: MAX_GRID_ENTRIES };

const E2 = WGS84_F * (2 - WGS84_F);
const RADIANS = Math.PI / 180;
/** Metres per degree of latitude at the equator, the fewest anywhere on the WGS84 ellipsoid: a(1 − e²)·π/180. */
const MIN_METRES_PER_DEGREE_LAT = WGS84_A_M * (1 - E2) * RADIANS;

/** Builds the grid index of `sites` for look-ups within `reachM` metres. */
export function buildSiteIndex(sites: readonly NetworkSite[], reachM: number, limits: GridLimits = DEFAULT_GRID_LIMITS): SiteIndex {
  if (sites.length === 0) throw new RangeError("there are no sites to index");
  if (!(reachM > 0) || !Number.isFinite(reachM)) throw new RangeError(`reach must be positive, got ${reachM}`);
  const siteOf: number[] = [];
  const raw: number[] = []; // lonA, latA, lonB, latB
  sites.forEach((site, index) => {
    for (const path of site.paths) {
      if (path.length === 1) {
        siteOf.push(index);
        raw.push(path[0]!.lon, path[0]!.lat, path[0]!.lon, path[0]!.lat);
      }
      for (let i = 1; i < path.length; i++) {
        siteOf.push(index);
        raw.push(path[i - 1]!.lon, path[i - 1]!.lat, path[i]!.lon, path[i]!.lat);
      }
    }
  });
  const elementCount = siteOf.length;
  if (elementCount === 0) throw new RangeError("the sites have no points to index");

  // For listing, each element's longitudes continue from the west end of the smallest arc holding them all.
  const arc = longitudeArc(raw);
  const elementLonLat = Float64Array.from(raw);
  const unwrapped = new Float64Array(4 * elementCount);
  let minLon = Infinity;
  let maxLon = -Infinity;
  let minLat = Infinity;
  let maxLat = -Infinity;
  for (let e = 0; e < elementCount; e++) {
    const [lonA, latA, latB] = [raw[4 * e]!, raw[4 * e + 1]!, raw[4 * e + 3]!];
    const dLon = wrapLongitude(raw[4 * e + 2]! - lonA);
    const offset = positiveModulo(Math.min(lonA, lonA + dLon) - arc.west, 360);
    // Rounding may put a span that starts at the arc's west end a hair below it, i.e. near 360.
    const west = arc.west + (offset > arc.width + 1e-9 ? offset - 360 : offset);
    const a = dLon >= 0 ? west : west - dLon;
    unwrapped.set([a, latA, a + dLon, latB], 4 * e);
    minLon = Math.min(minLon, west);
    maxLon = Math.max(maxLon, west + Math.abs(dLon));
    minLat = Math.min(minLat, latA, latB);
    maxLat = Math.max(maxLat, latA, latB);
  }

  const latReach = reachM / MIN_METRES_PER_DEGREE_LAT;
  const lonReachAt = (absLat: number) => longitudeReach(reachM, absLat + latReach);
  const widestLonReach = lonReachAt(Math.max(Math.abs(minLat), Math.abs(maxLat)));
  // Past 180° a grid gains nothing over the whole circle, and the nearest-site search stays simple.
  const wrapsAround = !(maxLon - minLon + 2 * widestLonReach <= 180);
  const originLon = wrapsAround ? minLon : minLon - widestLonReach;
  const spanLonDeg = wrapsAround ? 360 : maxLon - minLon + 2 * widestLonReach;
  const originLat = Math.max(-90, minLat - latReach);
  const spanLatDeg = Math.min(90, maxLat + latReach) - originLat;

  // Cells of about twice the reach, square in metres at the middle latitude; coarser until bounded.
  const middleLat = Math.max(-80, Math.min(80, (minLat + maxLat) / 2));
  const scale = metresPerDegree(middleLat);
  let cellLonDeg = Math.min(360, (2 * reachM) / scale.lon);
  let cellLatDeg = Math.min(180, (2 * reachM) / scale.lat);
  for (;;) {
    const shape = gridShape(cellLonDeg, cellLatDeg, spanLonDeg, spanLatDeg, wrapsAround);
    if (shape.columns * shape.rows > limits.maxCells && !(shape.columns === 1 && shape.rows === 1)) {
      const grow = Math.sqrt((shape.columns * shape.rows) / limits.maxCells) * 1.001;
      cellLonDeg *= grow;
      cellLatDeg *= grow;
      continue;
    }
    const grid = { ...shape, originLon, originLat, wrapsAround, latReach, lonReachAt };
    const entries = listElements(grid, unwrapped, elementCount, limits.maxEntries);
    if (entries === undefined && !(shape.columns === 1 && shape.rows === 1)) {
      cellLonDeg *= 2;
      cellLatDeg *= 2;
      continue;
    }
    const { cellStart, cellElements } = entries ?? listElements(grid, unwrapped, elementCount, Infinity)!;
    return {
      reachM,
      cellLonDeg: shape.cellLonDeg,
      cellLatDeg: shape.cellLatDeg,
      originLon,
      originLat,
      columns: shape.columns,
      rows: shape.rows,
      wrapsAround,
      spanLonDeg,
      elementSite: Int32Array.from(siteOf),
      elementLonLat,
      cellStart,
      cellElements,
      extent: [minLon, minLat, maxLon, maxLat],
    };
  }
}

/**
 * Degrees of longitude that `reachM` metres can span at latitudes up to `absLat` (using the
 * equatorial radius, which no radius of curvature undercuts); Infinity near a pole.
 */
function longitudeReach(reachM: number, absLat: number): number {
  const metres = WGS84_A_M * Math.cos(Math.min(90, absLat) * RADIANS) * RADIANS;
  return absLat >= 89.999 || metres <= 0 ? Infinity : reachM / metres;
}

interface GridShape {
  readonly cellLonDeg: number;
  readonly cellLatDeg: number;
  readonly columns: number;
  readonly rows: number;
}

function gridShape(cellLonDeg: number, cellLatDeg: number, spanLonDeg: number, spanLatDeg: number, wrapsAround: boolean): GridShape {
  const columns = Math.max(1, Math.ceil(spanLonDeg / cellLonDeg - 1e-9));
  const rows = Math.max(1, Math.ceil(spanLatDeg / cellLatDeg - 1e-9));
  // A wrapping grid's columns tile the circle exactly.
  return { cellLonDeg: wrapsAround ? 360 / columns : Math.max(cellLonDeg, spanLonDeg / columns), cellLatDeg: Math.max(cellLatDeg, spanLatDeg / rows), columns, rows };
}

interface Grid extends GridShape {
  readonly originLon: number;
  readonly originLat: number;
  readonly wrapsAround: boolean;
  readonly latReach: number;
  readonly lonReachAt: (absLat: number) => number;
}

/**
 * Lists every element in the cells within reach of it, walking each edge in steps of at most
 * one cell; undefined as soon as the listings would pass `maxEntries`.
 */
function listElements(grid: Grid, lonLat: Float64Array, elementCount: number, maxEntries: number): { cellStart: Int32Array; cellElements: Int32Array } | undefined {
  const cells = grid.columns * grid.rows;
  const counts = new Int32Array(cells + 1);
  let total = 0;
  const overflow = forEachListing(grid, lonLat, elementCount, (_, cell) => {
    counts[cell + 1]!++;
    return ++total > maxEntries;
  });
  if (overflow) return undefined;
  for (let cell = 1; cell <= cells; cell++) counts[cell]! += counts[cell - 1]!;
  const fill = counts.slice(0, cells);
  const cellElements = new Int32Array(total);
  forEachListing(grid, lonLat, elementCount, (element, cell) => {
    cellElements[fill[cell]!++] = element;
    return false;
  });
  return { cellStart: counts, cellElements };
}

/** Calls `visit` once per (element, cell within reach); stops early when `visit` returns true. */
function forEachListing(grid: Grid, lonLat: Float64Array, elementCount: number, visit: (element: number, cell: number) => boolean): boolean {
  const { columns, rows, cellLonDeg, cellLatDeg, originLon, originLat, wrapsAround, latReach } = grid;
  // Marks (element + 1) so that overlapping steps of one edge list it once per cell.
  const cellMark = new Int32Array(columns * rows);
  const rowMark = new Int32Array(rows);
  const clampRow = (lat: number) => Math.min(rows - 1, Math.max(0, Math.floor((lat - originLat) / cellLatDeg)));
  for (let element = 0; element < elementCount; element++) {
    const mark = element + 1;
    const [lonA, latA, lonB, latB] = [lonLat[4 * element]!, lonLat[4 * element + 1]!, lonLat[4 * element + 2]!, lonLat[4 * element + 3]!];
    const steps = Math.max(1, Math.ceil(Math.max(Math.abs(lonB - lonA) / cellLonDeg, Math.abs(latB - latA) / cellLatDeg)));
    for (let step = 0; step < steps; step++) {
      const lon0 = lonA + ((lonB - lonA) * step) / steps;
      const lon1 = lonA + ((lonB - lonA) * (step + 1)) / steps;
      const lat0 = latA + ((latB - latA) * step) / steps;
      const lat1 = latA + ((latB - latA) * (step + 1)) / steps;
      const lonReach = grid.lonReachAt(Math.max(Math.abs(lat0), Math.abs(lat1)));
      const r0 = clampRow(Math.min(lat0, lat1) - latReach);
      const r1 = clampRow(Math.max(lat0, lat1) + latReach);
      let c0 = Math.floor((Math.min(lon0, lon1) - lonReach - originLon) / cellLonDeg);
      let c1 = Math.floor((Math.max(lon0, lon1) + lonReach - originLon) / cellLonDeg);
      const wholeRows = !Number.isFinite(lonReach) || (wrapsAround && c1 - c0 + 1 >= columns);
      if (wholeRows || !wrapsAround) {
        c0 = wholeRows ? 0 : Math.max(0, c0);
        c1 = wholeRows ? columns - 1 : Math.min(columns - 1, c1);
      }
      for (let r = r0; r <= r1; r++) {
        if (rowMark[r] === mark) continue;
        if (wholeRows) rowMark[r] = mark;
        for (let c = c0; c <= c1; c++) {
          const cell = r * columns + (wrapsAround ? positiveModulo(c, columns) : c);
          if (cellMark[cell] === mark) continue;
          cellMark[cell] = mark;
          if (visit(element, cell)) return true;
        }
      }
    }
  }
  return false;
}
