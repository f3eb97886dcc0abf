import type { GeoPoint } from "../model/types.js";
import { geodesicDistanceM } from "./geodesicDistanceM.js";
import { subdivideEdge } from "./subdivideEdge.js";

/**
 * Length in km of one or more polylines: the sum of each edge's geodesic length, an edge longer
 * than 1° measured along its line in steps of at most 1° (subdivideEdge), so a long or
 * antimeridian-crossing edge has the length of the line drawn (and no step is near-antipodal).
 */
export function polylineLengthKm(paths: readonly (readonly GeoPoint[])[]): number {
  let metres = 0;
  for (const path of paths) for (let i = 1; i < path.length; i++) metres += edgeLengthM(path[i - 1]!, path[i]!);
  return metres / 1000;
}

/** Geodesic length in metres of one edge along its line (see polylineLengthKm). */
export function edgeLengthM(from: GeoPoint, to: GeoPoint): number {
  const points = subdivideEdge(from, to);
  let metres = 0;
  for (let i = 1; i < points.length; i++) metres += geodesicDistanceM(points[i - 1]!, points[i]!);
  return metres;
}
