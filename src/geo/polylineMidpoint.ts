import type { GeoPoint } from "../model/types.js";
import { edgeLengthM } from "./polylineLengthKm.js";
import { subdivideEdge } from "./subdivideEdge.js";
import { wrapLongitude } from "./wrapLongitude.js";

/**
 * The point halfway along a polyline's length (polylineLengthKm; over all its paths' edges in
 * order, for several paths), interpolated linearly in degrees within the step that holds it,
 * which is accurate to centimetres for street-length edges. Longitude comes back in [-180, 180),
 * also for an edge that crosses the antimeridian.
 */
export function polylineMidpoint(paths: readonly (readonly GeoPoint[])[]): GeoPoint {
  const first = paths.find((path) => path.length > 0)?.[0];
  if (first === undefined) throw new RangeError("a polyline needs at least one point");
  const edges = paths.flatMap((path) => path.slice(1).map((to, i) => [path[i]!, to] as const));
  let remaining = edges.reduce((sum, [from, to]) => sum + edgeLengthM(from, to), 0) / 2;
  for (const [from, to] of edges) {
    const points = subdivideEdge(from, to);
    for (let i = 1; i < points.length; i++) {
      const p = points[i - 1]!;
      const q = points[i]!;
      const step = edgeLengthM(p, q);
      if (remaining <= step && step > 0) {
        const t = remaining / step;
        return { lon: wrapLongitude(p.lon + t * (q.lon - p.lon)), lat: p.lat + t * (q.lat - p.lat) };
      }
      remaining -= step;
    }
  }
  const last = paths.filter((path) => path.length > 0).at(-1)!;
  return last[last.length - 1]!;
}
