import type { GeoPoint } from "../model/types.js";
import { geodesicDistanceM } from "./geodesicDistanceM.js";

/** Geodesic length in km of one or more polylines (the sum of their vertex-to-vertex geodesics). */
export function polylineLengthKm(paths: readonly (readonly GeoPoint[])[]): number {
  let metres = 0;
  for (const path of paths) for (let i = 1; i < path.length; i++) metres += geodesicDistanceM(path[i - 1]!, path[i]!);
  return metres / 1000;
}
