import type { Site } from "./types.js";

/**
 * Ids of the sites that list no candidate treatments, in scenario order. Such a site is screened
 * and counted like any other but has no alternative, so it can never be funded.
 */
export function sitesWithoutCandidates(sites: readonly Site[]): string[] {
  return sites.filter((site) => site.candidates.length === 0).map((site) => site.id);
}
