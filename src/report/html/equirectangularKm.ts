import type { GeoPoint } from "../../model/types.js";

/** Mean Earth radius in km (IUGG mean radius R1 = 6371.0088 km, Moritz 2000, "Geodetic Reference System 1980"). */
export const EARTH_RADIUS_KM = 6371.0088;

/** A point on a flat map, in km east and north of the projection centre. */
export interface PlanePoint {
  readonly xKm: number;
  readonly yKm: number;
}

/**
 * Equirectangular projection about `centre`: x = R·Δλ·cos φ0, y = R·Δφ (angles in radians).
 * Distances are close to true over a city (error grows with distance from the centre latitude).
 */
export function equirectangularKm(point: GeoPoint, centre: GeoPoint): PlanePoint {
  const radians = Math.PI / 180;
  return {
    xKm: EARTH_RADIUS_KM * (point.lon - centre.lon) * radians * Math.cos(centre.lat * radians),
    yKm: EARTH_RADIUS_KM * (point.lat - centre.lat) * radians,
  };
}
