import type { SafetyPerformanceFunction, SiteKind } from "./types.js";

/**
 * The negative binomial overdispersion k that applies to one site. When the SPF states k per km
 * (`overdispersionPerKm`), the site's k is k / L: the Highway Safety Manual's Part C segment
 * SPFs write k = k₀ / L (e.g. rural two-lane roads, HSM chapter 10: k = 0.236 / L, L in miles; from memory),
 * so a longer segment is less overdispersed. A k₀ stated per mile becomes 1.609344 × k₀ per km.
 */
export function siteOverdispersion(spf: SafetyPerformanceFunction, kind: SiteKind, lengthKm: number | undefined): number {
  if (!spf.overdispersionPerKm || kind === "intersection") return spf.overdispersion;
  if (!(lengthKm !== undefined && lengthKm > 0)) throw new RangeError(`SPF ${spf.id} states k per km, so the site needs a positive length in km`);
  return spf.overdispersion / lengthKm;
}
