import type { GeoPoint } from "../model/types.js";
import { wrapLongitude } from "./wrapLongitude.js";

/** Longest step, in degrees of longitude or latitude, of a subdivided edge. */
const MAX_STEP_DEG = 1;

/**
 * The points of an edge from `from` to `to` in steps of at most 1°, both ends included. An edge
 * is the straight line between its ends in longitude and latitude (RFC 7946, section 3.1.1), the
 * short way round in longitude (so it may cross the antimeridian; ends exactly 180° apart go
 * west). Longitudes of the points run on continuously from `from.lon` and may pass ±180.
 * A street-length edge is one step: [from, to].
 */
export function subdivideEdge(from: GeoPoint, to: GeoPoint): GeoPoint[] {
  const dLon = wrapLongitude(to.lon - from.lon);
  const dLat = to.lat - from.lat;
  const steps = Math.max(1, Math.ceil(Math.max(Math.abs(dLon), Math.abs(dLat)) / MAX_STEP_DEG));
  const points: GeoPoint[] = [];
  for (let i = 0; i < steps; i++) points.push({ lon: from.lon + (dLon * i) / steps, lat: from.lat + (dLat * i) / steps });
  // The far end exactly as given when no wrap was needed, so a street edge is [from, to] bit for bit.
  points.push({ lon: Math.abs(to.lon - from.lon) < 180 ? to.lon : from.lon + dLon, lat: to.lat });
  return points;
}
