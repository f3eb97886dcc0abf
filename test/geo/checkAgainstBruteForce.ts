import { expect } from "vitest";
import type { CrashAssignments } from "../../src/geo/assignCrashes.js";
import { metresPerDegree } from "../../src/geo/metresPerDegree.js";
import { distanceToEdgeM } from "../../src/geo/distanceToEdgeM.js";
import type { NetworkSite } from "../../src/geo/NetworkSite.js";
import type { GeoPoint } from "../../src/model/types.js";

/**
 * Checks assignCrashes's result against a search of every site, measuring with the same
 * distance (distanceToEdgeM in each crash's plane) so that it checks the search, not the
 * projection. Returns how many crashes were assigned.
 */
export function checkAgainstBruteForce(sites: readonly NetworkSite[], crashes: readonly GeoPoint[], result: CrashAssignments, radiusM = 50, bufferM = 15): { assigned: number } {
  let assigned = 0;
  crashes.forEach((crash, index) => {
    const scale = metresPerDegree(crash.lat);
    const edge = (a: GeoPoint, b: GeoPoint) => distanceToEdgeM(crash.lon, crash.lat, scale.lon, scale.lat, a.lon, a.lat, b.lon, b.lat);
    const distance = (s: NetworkSite) => Math.min(...s.paths.flatMap((path) => (path.length === 1 ? [edge(path[0]!, path[0]!)] : path.slice(1).map((p, k) => edge(path[k]!, p)))));
    const best = (kind: (s: NetworkSite) => boolean, reach: number) =>
      sites.map((s, i) => ({ i, d: distance(s), s })).filter((e) => kind(e.s) && e.d <= reach).sort((a, b) => a.d - b.d || (a.s.id < b.s.id ? -1 : 1))[0];
    const expected = best((s) => s.kind === "intersection", radiusM + 1e-3) ?? best((s) => s.kind !== "intersection", bufferM + 1e-3);
    expect(result.site[index], `crash ${index}`).toBe(expected?.i ?? -1);
    if (expected) assigned++;
    else {
      const nearest = sites.map((s, i) => ({ i, d: distance(s), id: s.id })).sort((a, b) => a.d - b.d || (a.id < b.id ? -1 : 1))[0]!;
      expect(result.nearestSite[index], `nearest site of crash ${index}`).toBe(nearest.i);
    }
  });
  return { assigned };
}
