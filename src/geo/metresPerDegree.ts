import { WGS84_A_M, WGS84_F } from "./geodesicDistanceM.js";

/**
 * Metres per degree of longitude and of latitude at a latitude, from the WGS84 ellipsoid's radii
 * of curvature there (prime vertical N and meridian M): N·cos φ·π/180 and M·π/180.
 * @example metresPerDegree(0).lat → 110574.3 (the meridian arc's degree at the equator)
 */
export function metresPerDegree(lat: number): { readonly lon: number; readonly lat: number } {
  const e2 = WGS84_F * (2 - WGS84_F);
  const phi = (lat * Math.PI) / 180;
  const w = 1 - e2 * Math.sin(phi) ** 2;
  const meridianM = (WGS84_A_M * (1 - e2)) / w ** 1.5;
  const primeVerticalM = WGS84_A_M / Math.sqrt(w);
  const perRadian = Math.PI / 180;
  return { lon: primeVerticalM * Math.cos(phi) * perRadian, lat: meridianM * perRadian };
}
