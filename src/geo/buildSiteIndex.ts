import type { GeoPoint } from "../model/types.js";
import { localPlane, planeX, planeY, type LocalPlane } from "./localPlane.js";
import type { NetworkSite } from "./NetworkSite.js";

/**
 * A uniform grid over the sites in a local plane. Each element (an intersection's point or one
 * edge of a polyline) is listed in every cell its bounding box, grown by `reachM`, touches, so
 * the elements within `reachM` of a point are all listed in that point's own cell.
 * Cells are stored compactly (offsets into one array), so building costs O(elements + cells).
 */
export interface SiteIndex {
  readonly plane: LocalPlane;
  readonly reachM: number;
  readonly cellM: number;
  readonly originX: number;
  readonly originY: number;
  readonly columns: number;
  readonly rows: number;
  /** Per element: site index, and the edge's end points in plane metres (equal for a point). */
  readonly elementSite: Int32Array;
  readonly elementXY: Float64Array;
  /** Elements of cell c are cellElements[cellStart[c] .. cellStart[c + 1]). */
  readonly cellStart: Int32Array;
  readonly cellElements: Int32Array;
  /** Sites' bounding box in plane metres: minX, minY, maxX, maxY. */
  readonly extent: readonly [number, number, number, number];
}

/** Most cells a grid may have; beyond this cells grow so memory stays bounded. */
const MAX_CELLS = 4_000_000;

/** Builds the grid index of `sites` for look-ups within `reachM` metres. */
export function buildSiteIndex(sites: readonly NetworkSite[], reachM: number): SiteIndex {
  if (sites.length === 0) throw new RangeError("there are no sites to index");
  if (!(reachM > 0)) throw new RangeError(`reach must be positive, got ${reachM}`);
  const points = sites.flatMap((site) => site.paths.flat());
  const plane = localPlane(centreOf(points));

  const siteOf: number[] = [];
  const xy: number[] = [];
  sites.forEach((site, index) => {
    for (const path of site.paths) {
      if (path.length === 1) {
        const x = planeX(plane, path[0]!.lon);
        const y = planeY(plane, path[0]!.lat);
        siteOf.push(index);
        xy.push(x, y, x, y);
      }
      for (let i = 1; i < path.length; i++) {
        siteOf.push(index);
        xy.push(planeX(plane, path[i - 1]!.lon), planeY(plane, path[i - 1]!.lat), planeX(plane, path[i]!.lon), planeY(plane, path[i]!.lat));
      }
    }
  });
  const elementCount = siteOf.length;
  let minX = Infinity;
  let minY = Infinity;
  let maxX = -Infinity;
  let maxY = -Infinity;
  for (let i = 0; i < xy.length; i += 2) {
    minX = Math.min(minX, xy[i]!);
    maxX = Math.max(maxX, xy[i]!);
    minY = Math.min(minY, xy[i + 1]!);
    maxY = Math.max(maxY, xy[i + 1]!);
  }
  const originX = minX - reachM;
  const originY = minY - reachM;
  const width = maxX - minX + 2 * reachM;
  const height = maxY - minY + 2 * reachM;
  // Cells of about twice the reach keep each element in few cells; grow them for sparse, wide networks.
  const cellM = Math.max(2 * reachM, Math.sqrt((width * height) / MAX_CELLS));
  const columns = Math.max(1, Math.ceil(width / cellM));
  const rows = Math.max(1, Math.ceil(height / cellM));

  const cellRange = (element: number): [number, number, number, number] => {
    const x1 = xy[4 * element]!;
    const y1 = xy[4 * element + 1]!;
    const x2 = xy[4 * element + 2]!;
    const y2 = xy[4 * element + 3]!;
    const clampColumn = (x: number) => Math.min(columns - 1, Math.max(0, Math.floor((x - originX) / cellM)));
    const clampRow = (y: number) => Math.min(rows - 1, Math.max(0, Math.floor((y - originY) / cellM)));
    return [clampColumn(Math.min(x1, x2) - reachM), clampRow(Math.min(y1, y2) - reachM), clampColumn(Math.max(x1, x2) + reachM), clampRow(Math.max(y1, y2) + reachM)];
  };
  const counts = new Int32Array(columns * rows + 1);
  for (let element = 0; element < elementCount; element++) {
    const [c0, r0, c1, r1] = cellRange(element);
    for (let r = r0; r <= r1; r++) for (let c = c0; c <= c1; c++) counts[r * columns + c + 1]!++;
  }
  for (let cell = 1; cell < counts.length; cell++) counts[cell]! += counts[cell - 1]!;
  const cellStart = counts;
  const fill = cellStart.slice(0, columns * rows);
  const cellElements = new Int32Array(cellStart[columns * rows]!);
  for (let element = 0; element < elementCount; element++) {
    const [c0, r0, c1, r1] = cellRange(element);
    for (let r = r0; r <= r1; r++) for (let c = c0; c <= c1; c++) cellElements[fill[r * columns + c]!++] = element;
  }
  return {
    plane,
    reachM,
    cellM,
    originX,
    originY,
    columns,
    rows,
    elementSite: Int32Array.from(siteOf),
    elementXY: Float64Array.from(xy),
    cellStart,
    cellElements,
    extent: [minX, minY, maxX, maxY],
  };
}

/** Centre of the points' bounding box in degrees (networks never straddle the antimeridian here). */
function centreOf(points: readonly GeoPoint[]): GeoPoint {
  let minLon = Infinity;
  let maxLon = -Infinity;
  let minLat = Infinity;
  let maxLat = -Infinity;
  for (const point of points) {
    minLon = Math.min(minLon, point.lon);
    maxLon = Math.max(maxLon, point.lon);
    minLat = Math.min(minLat, point.lat);
    maxLat = Math.max(maxLat, point.lat);
  }
  return { lon: (minLon + maxLon) / 2, lat: (minLat + maxLat) / 2 };
}
