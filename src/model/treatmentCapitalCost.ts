import type { Site, Treatment } from "./types.js";

/** Capital cost of one treatment at one site: the site's override, else per-site amount or per-km × length. */
export function treatmentCapitalCost(treatment: Treatment, site: Site): number {
  // Own keys only: an id such as "constructor" must not find Object.prototype's.
  if (Object.hasOwn(site.costOverrides, treatment.id)) return site.costOverrides[treatment.id]!;
  if (treatment.cost.basis === "per-site") return treatment.cost.amount;
  if (site.lengthKm === undefined) throw new RangeError(`site ${site.id} has no length for per-km treatment ${treatment.id}`);
  return treatment.cost.amount * site.lengthKm;
}
