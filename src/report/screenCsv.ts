import type { NetworkScreening } from "../model/screenSites.js";
import { toCsv } from "./toCsv.js";

/** Every screened site as CSV rows (RFC 4180), in excess-rank order. */
export function screenCsv(screening: NetworkScreening): string {
  const proposed = new Set(screening.proposed);
  return toCsv(
    ["excess_rank", "site", "name", "kind", "district", "ksi_per_year_observed", "ksi_per_year_predicted", "ksi_per_year_eb_expected", "excess_ksi_per_year", "observed_rank", "proposed", "note"],
    screening.sites.map((e) => [e.excessRank, e.site.id, e.site.name, e.site.kind, e.site.district, e.observedKsiPerYear, e.predictedKsiPerYear, e.expectedKsiPerYear, e.excessKsiPerYear, e.observedRank, proposed.has(e.site.id) ? "yes" : "no", e.note]),
  );
}
