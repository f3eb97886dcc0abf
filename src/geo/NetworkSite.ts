import type { AreaType, GeoPoint, SiteKind } from "../model/types.js";

/**
 * A site on the road network as drawn on a map: an intersection is one path of one point; a
 * segment or corridor is one or more polylines (GeoJSON LineString or MultiLineString).
 */
export interface NetworkSite {
  readonly id: string;
  readonly name: string;
  readonly kind: SiteKind;
  readonly district: string;
  readonly tags: readonly string[];
  readonly area?: AreaType;
  readonly aadt?: number;
  readonly performanceFunction?: string;
  /** Candidate treatment ids, from the feature's `candidates` property (may be empty). */
  readonly candidates: readonly string[];
  readonly paths: readonly (readonly GeoPoint[])[];
}
