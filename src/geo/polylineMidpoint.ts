import type { GeoPoint } from "../model/types.js";
import { geodesicDistanceM } from "./geodesicDistanceM.js";

/**
 * The point halfway along a polyline's geodesic length (the first path's, for several paths
 * chained in order), interpolated linearly in degrees within the vertex pair that holds it,
 * which is accurate to centimetres for street-length edges.
 */
export function polylineMidpoint(paths: readonly (readonly GeoPoint[])[]): GeoPoint {
  const points = paths.flat();
  if (points.length === 0) throw new RangeError("a polyline needs at least one point");
  const lengths: number[] = [];
  for (let i = 1; i < points.length; i++) lengths.push(geodesicDistanceM(points[i - 1]!, points[i]!));
  let remaining = lengths.reduce((sum, value) => sum + value, 0) / 2;
  for (let i = 0; i < lengths.length; i++) {
    const edge = lengths[i]!;
    if (remaining <= edge && edge > 0) {
      const t = remaining / edge;
      const p = points[i]!;
      const q = points[i + 1]!;
      return { lon: p.lon + t * (q.lon - p.lon), lat: p.lat + t * (q.lat - p.lat) };
    }
    remaining -= edge;
  }
  return points[points.length - 1]!;
}
