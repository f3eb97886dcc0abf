import type { GeoPoint } from "../model/types.js";
import { metresPerDegree } from "./metresPerDegree.js";

/** A local flat plane in metres about a centre point: east is x, north is y. */
export interface LocalPlane {
  readonly centre: GeoPoint;
  /** Metres per degree of longitude and of latitude at the centre. */
  readonly metresPerDegreeLon: number;
  readonly metresPerDegreeLat: number;
}

/**
 * An equirectangular plane about `centre` scaled by the WGS84 ellipsoid's radii of curvature at
 * the centre's latitude φ0 (meridian M and prime vertical N: y = M·Δφ, x = N·cos φ0·Δλ).
 * Error bound: north-south distances are exact to O(Δφ²); east-west scale drifts by a relative
 * ≈ |Δφ|·tan φ0 away from the centre (Δφ in radians). For a city within ±10 km of its centre at
 * 55° N that is ≤ 0.23 %, i.e. ≤ 12 cm on a 50 m influence radius; the tests check this against
 * GeographicLib. Not for networks spanning more than a few tens of km.
 */
export function localPlane(centre: GeoPoint): LocalPlane {
  const scale = metresPerDegree(centre.lat);
  return { centre, metresPerDegreeLon: scale.lon, metresPerDegreeLat: scale.lat };
}

/** Plane x (east) in metres of a longitude. */
export function planeX(plane: LocalPlane, lon: number): number {
  return (lon - plane.centre.lon) * plane.metresPerDegreeLon;
}

/** Plane y (north) in metres of a latitude. */
export function planeY(plane: LocalPlane, lat: number): number {
  return (lat - plane.centre.lat) * plane.metresPerDegreeLat;
}

/** The geographic point at plane coordinates (x, y) metres. */
export function fromPlane(plane: LocalPlane, x: number, y: number): GeoPoint {
  return { lon: plane.centre.lon + x / plane.metresPerDegreeLon, lat: plane.centre.lat + y / plane.metresPerDegreeLat };
}
