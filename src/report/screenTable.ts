import Table from "cli-table3";
import type { NetworkScreening } from "../model/screenSites.js";
import { sitesWithoutCandidates } from "../model/sitesWithoutCandidates.js";
import { CAUTIONS } from "./cautions.js";
import { formatFixed } from "./formatNumber.js";
import { noCandidatesText } from "./noCandidatesText.js";

/** The screening ranking as a terminal table (the first `rows` sites), with the proposal and cautions. */
export function screenTable(screening: NetworkScreening, title: string, rows: number): string {
  const table = new Table({
    head: ["Rank", "Site", "Name", "District", "K+A crashes/yr observed", "K+A crashes/yr predicted", "K+A crashes/yr EB expected", "Excess K+A crashes/yr", "Rank by observed"],
    colAligns: ["right", "left", "left", "left", "right", "right", "right", "right", "right"],
    style: { head: [], border: [] },
    wordWrap: true,
    colWidths: [null, null, 30],
  } as ConstructorParameters<typeof Table>[0]);
  const value = (x: number | undefined) => (x === undefined ? "-" : formatFixed(x, 3));
  for (const entry of screening.sites.slice(0, rows)) {
    table.push([entry.excessRank, entry.site.id, entry.site.name, entry.site.district, value(entry.observedKsiPerYear), value(entry.predictedKsiPerYear), value(entry.expectedKsiPerYear), value(entry.excessKsiPerYear), entry.observedRank]);
  }
  const withoutEb = screening.sites.filter((entry) => entry.note !== undefined);
  const noCandidates = noCandidatesText(sitesWithoutCandidates(screening.sites.map((entry) => entry.site)));
  return [
    `Network screening: ${title}`,
    "Ranked by excess expected K+A crashes a year (KSI crashes: Empirical Bayes expected minus SPF predicted; crashes, not people).",
    table.toString(),
    `Proposed for the programme (top ${screening.proposed.length} by excess): ${screening.proposed.join(", ") || "none"}`,
    ...(noCandidates !== undefined ? [`${noCandidates} (they are ranked here like the others).`] : []),
    ...(withoutEb.length > 0 ? [`${withoutEb.length} site(s) have no EB estimate and rank last, by observed K+A crashes: ${withoutEb.slice(0, 5).map((e) => `${e.site.id} (${e.note})`).join("; ")}${withoutEb.length > 5 ? "; …" : ""}`] : []),
    "",
    ...CAUTIONS,
    "",
  ].join("\n");
}
