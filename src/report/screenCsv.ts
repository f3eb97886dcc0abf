import type { NetworkScreening } from "../model/screenSites.js";
import { csvPreamble } from "./csvPreamble.js";
import { toCsv } from "./toCsv.js";

/** Every screened site as CSV rows (RFC 4180), in excess-rank order, after the preamble (scenario; units). */
export function screenCsv(screening: NetworkScreening, scenarioName: string): string {
  const proposed = new Set(screening.proposed);
  const preamble = csvPreamble(
    [`screening of scenario ${scenarioName}`, `${screening.sites.length} sites`, `${screening.proposed.length} proposed`],
    ["ksi_per_year_*: K+A crashes a year (crashes, not people); blank where a site lacks what the estimate needs", "excess_ksi_per_year: Empirical Bayes expected minus SPF predicted"],
  );
  return preamble + toCsv(
    ["excess_rank", "site", "name", "kind", "district", "ksi_per_year_observed", "ksi_per_year_predicted", "ksi_per_year_eb_expected", "excess_ksi_per_year", "observed_rank", "proposed", "note"],
    screening.sites.map((e) => [e.excessRank, e.site.id, e.site.name, e.site.kind, e.site.district, e.observedKsiPerYear, e.predictedKsiPerYear, e.expectedKsiPerYear, e.excessKsiPerYear, e.observedRank, proposed.has(e.site.id) ? "yes" : "no", e.note]),
  );
}
