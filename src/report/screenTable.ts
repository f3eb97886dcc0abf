import type { NetworkScreening } from "../model/screenSites.js";
import { sitesWithoutCandidates } from "../model/sitesWithoutCandidates.js";
import { CAUTIONS } from "./cautions.js";
import { formatFixed } from "./formatNumber.js";
import { noCandidatesText } from "./noCandidatesText.js";
import { textTable } from "./textTable.js";

/** The screening ranking as a terminal table (the first `rows` sites), with the proposal and cautions. */
export function screenTable(screening: NetworkScreening, title: string, rows: number): string {
  const right = (heading: string) => ({ heading, align: "right" as const });
  const value = (x: number | undefined) => (x === undefined ? "-" : formatFixed(x, 3));
  const table = textTable(
    [right("Rank"), { heading: "Site" }, { heading: "Name", maxWidth: 28 }, { heading: "District" }, right("K+A crashes/yr observed"), right("K+A crashes/yr predicted"), right("K+A crashes/yr EB expected"), right("Excess K+A crashes/yr"), right("Rank by observed")],
    screening.sites
      .slice(0, rows)
      .map((entry) => [String(entry.excessRank), entry.site.id, entry.site.name, entry.site.district, value(entry.observedKsiPerYear), value(entry.predictedKsiPerYear), value(entry.expectedKsiPerYear), value(entry.excessKsiPerYear), String(entry.observedRank)]),
  );
  const withoutEb = screening.sites.filter((entry) => entry.note !== undefined);
  const noCandidates = noCandidatesText(sitesWithoutCandidates(screening.sites.map((entry) => entry.site)));
  return [
    `Network screening: ${title}`,
    "Ranked by excess expected K+A crashes a year (KSI crashes: Empirical Bayes expected minus SPF predicted; crashes, not people).",
    table,
    `Proposed for the programme (top ${screening.proposed.length} by excess): ${screening.proposed.join(", ") || "none"}`,
    ...(noCandidates !== undefined ? [`${noCandidates} (they are ranked here like the others).`] : []),
    ...(withoutEb.length > 0 ? [`${withoutEb.length} site(s) have no EB estimate and rank last, by observed K+A crashes: ${withoutEb.slice(0, 5).map((e) => `${e.site.id} (${e.note})`).join("; ")}${withoutEb.length > 5 ? "; …" : ""}`] : []),
    "",
    ...CAUTIONS,
    "",
  ].join("\n");
}
