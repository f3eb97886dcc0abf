import { sumCrashMatrix } from "../model/crashMatrix.js";
import type { SourcedEconomics } from "../model/defaultEconomics.js";
import type { CandidateSuggestion } from "../model/suggestCandidates.js";
import { KSI_SEVERITIES, SEVERITIES, type BaselineMethod, type Site } from "../model/types.js";
import { formatFixed } from "./formatNumber.js";

/** A site of the new scenario and what `init` does with its candidates. */
export interface SiteCandidateChoice {
  readonly site: Site;
  /** The treatments suggested for it; undefined (or none) when it keeps the candidates its sites file lists, if any. */
  readonly suggestions?: readonly CandidateSuggestion[];
}

/** Everything `averta init` writes into a new scenario. Paths are as they are to be written. */
export interface ScenarioDraft {
  readonly name: string;
  /** Path of scenario.schema.json from the scenario's folder, for editors' YAML language servers. */
  readonly schemaPath?: string;
  /** One line on what the scenario was made from. */
  readonly provenance: string;
  readonly catalogues: readonly string[];
  readonly sitesFile: string;
  readonly currency: string;
  readonly budget: number;
  readonly economics: SourcedEconomics;
  readonly baseline: BaselineMethod;
  readonly maxTreatmentsPerSite: number;
  readonly maxSuggestions: number;
  /** The sites file's crash window, for the comments; unknown before the sites are read. */
  readonly crashWindow?: { readonly firstYear: number; readonly lastYear: number };
  readonly sites: readonly SiteCandidateChoice[];
}

/** The mark on every suggested list. */
export const SUGGESTION_MARK = "suggested by averta init — for an engineer to review";

const WIDTH = 88;

/**
 * A complete scenario as YAML text, commented for the engineer who takes it over: where each
 * default comes from, and which candidate lists are suggestions to review. The sites stay in
 * their own file (`sites: <file>`); suggested candidates go under `siteCandidates`, so `averta
 * tally` can rewrite the sites file without losing them. Text values are written as JSON strings
 * (valid YAML) and comments are kept to one line each, so no name can break the file.
 */
export function initScenarioYaml(draft: ScenarioDraft): string {
  const q = (text: string) => JSON.stringify(text);
  const { economics } = draft;
  const costs = economics.crashCosts;
  const window = draft.crashWindow === undefined ? "" : ` (${draft.crashWindow.firstYear}-${draft.crashWindow.lastYear})`;
  const programmeYear = draft.crashWindow === undefined ? undefined : draft.crashWindow.lastYear + 1;
  const lines = [
    ...(draft.schemaPath === undefined ? [] : [`# yaml-language-server: $schema=${draft.schemaPath}`, "#"]),
    ...comment(
      `${draft.provenance} Every value is a starting point to check: the economics are defaults with their sources, and the candidate treatments are suggestions for an engineer to review. ` +
        "Results support and never replace engineering judgement, local standards and licensed practice.",
    ),
    `name: ${q(draft.name)}`,
    `catalogues: [${draft.catalogues.map(q).join(", ")}]`,
    `currency: ${draft.currency}`,
    `budget: ${draft.budget}`,
    ...comment(
      "The sites and their crash counts are in the sites file, which averta tally can rewrite (--out naming it, with --force) without touching this file. " +
        `Its crash window${window} is used; add crashWindow here only to pin it.`,
    ),
    `sites: ${q(draft.sitesFile)}`,
    "economics:",
    ...comment(`${economics.discountRateSource}.`, "  "),
    `  discountRate: ${economics.discountRate}`,
    ...comment(`${economics.horizonSource}.`, "  "),
    `  horizonYears: ${economics.horizonYears}`,
    ...(programmeYear === undefined
      ? []
      : [...comment("The year capital costs and the budget are priced in: taken as the year after the crash window; correct it if your costs are in another year's money.", "  "), `  priceYear: ${programmeYear}`]),
    ...comment(
      draft.currency === economics.crashCostsCurrency
        ? "Unit cost of one crash by its most severe injury (KABCO)."
        : `Unit cost of one crash by its most severe injury (KABCO), in ${economics.crashCostsCurrency}: replace them with unit costs in ${draft.currency} before planning.`,
      "  ",
    ),
    "  crashCosts:",
    ...SEVERITIES.map((severity) => `    ${severity}: ${costs.perCrash[severity]}`),
    `    source: ${q(costs.source)}`,
    ...(costs.priceYear === undefined ? [] : [`    priceYear: ${costs.priceYear}`]),
    ...(programmeYear === undefined || costs.priceYear === undefined
      ? []
      : [
          ...comment(
            "Brings the unit costs to the programme's price year. 3% a year is an illustrative placeholder: replace it with { baseIndex, targetIndex, source } from the price index your crash-cost guidance names.",
            "    ",
          ),
          `    escalation: { annualRate: 0.03, source: "illustrative demo rate" }`,
        ]),
    ...comment(
      "combined: K and A crashes are both valued at one K+A unit cost, weighted by this network's own K:A mix, so a chance fatal crash does not steer the list (common practice); by-severity values each at its own cost.",
      "  ",
    ),
    "  ksiCosting: { method: combined }",
    "# ksi: maximise K+A crashes avoided; benefit: maximise the monetised benefit PV.",
    "objective: ksi",
    ...comment(
      draft.baseline === "observed"
        ? "observed: expected crashes are the window's counts a year, not corrected for regression to the mean; auto uses Empirical Bayes where a site has an SPF and AADT."
        : "auto: Empirical Bayes (the window's counts blended with each site's SPF prediction) where a site has an SPF and AADT, its observed counts elsewhere; sites flagged for high counts overstate what comes next (regression to the mean), so give every site aadt and a performanceFunction.",
    ),
    `baseline: ${draft.baseline}`,
    `maxTreatmentsPerSite: ${draft.maxTreatmentsPerSite}`,
    ...candidateLines(draft),
  ];
  return lines.join("\n") + "\n";
}

function candidateLines(draft: ScenarioDraft): string[] {
  const q = (text: string) => JSON.stringify(text);
  const suggested = draft.sites.filter((choice) => choice.suggestions !== undefined && choice.suggestions.length > 0);
  // Without a suggestion written, a site keeps what its sites file lists, which may be nothing.
  const unsuggested = draft.sites.filter((choice) => choice.suggestions === undefined || choice.suggestions.length === 0);
  const empty = unsuggested.filter((choice) => choice.site.candidates.length === 0);
  const kept = unsuggested.filter((choice) => choice.site.candidates.length > 0);
  const lines = [""];
  if (suggested.length > 0) {
    lines.push(
      ...comment(
        `Candidate treatments by site, ${SUGGESTION_MARK}. Each list holds up to ${draft.maxSuggestions} catalogue treatments that apply to the site's kind and act (CMF below 1) on its crashes, ` +
          "ranked by the K+A crashes, then all crashes, in the cells they act on, and among equals by the K+A crashes they alone would have avoided in the window (crashes × (1 − CMF)). " +
          "The ranking ignores cost and site conditions: check each on site, then delete, add or keep. A list here replaces the candidates in the sites file.",
      ),
      "siteCandidates:",
    );
    for (const { site, suggestions } of suggested) {
      const window = draft.crashWindow === undefined ? "" : ` in ${draft.crashWindow.firstYear}-${draft.crashWindow.lastYear}`;
      lines.push(`  # ${oneLine(`${site.id} ${site.name} (${site.kind}): ${sumCrashMatrix(site.crashes, KSI_SEVERITIES)} K+A and ${sumCrashMatrix(site.crashes)} crashes${window}`)}`);
      for (const s of suggestions!) {
        lines.push(`  #   ${oneLine(`${s.treatment}: acts on ${s.ksiCovered} K+A and ${s.crashesCovered} crashes (${s.crashTypes.join(", ")}); alone it would have avoided ${formatFixed(s.ksiAvoided, 1)} K+A`)}`);
      }
      lines.push(`  ${q(site.id)}: [${suggestions!.map((s) => q(s.treatment)).join(", ")}]  # ${SUGGESTION_MARK}`);
    }
  } else {
    lines.push(...comment("siteCandidates: { <site id>: [<treatment ids>] } here would replace a site's candidates in the sites file, and would survive averta tally rewriting that file."));
  }
  if (empty.length > 0) {
    const reasons = empty.map(({ site }) => `${site.id} (${sumCrashMatrix(site.crashes) === 0 ? "no recorded crashes" : "no treatment applies and acts on its crashes"})`);
    lines.push(...comment(`No candidates, and nothing to suggest, so these sites cannot be funded until an engineer lists some: ${reasons.join(", ")}.`));
  }
  if (kept.length > 0) {
    lines.push(...comment(`These sites keep the candidates their sites file lists: ${kept.map(({ site }) => site.id).join(", ")}.`));
  }
  return lines;
}

/** Text as `# ` comment lines of at most about WIDTH characters. */
function comment(text: string, indent = ""): string[] {
  const lines: string[] = [];
  let line = "";
  for (const word of oneLine(text).split(" ")) {
    if (line !== "" && indent.length + 2 + line.length + 1 + word.length > WIDTH) {
      lines.push(`${indent}# ${line}`);
      line = word;
    } else line = line === "" ? word : `${line} ${word}`;
  }
  if (line !== "") lines.push(`${indent}# ${line}`);
  return lines;
}

// A line break or control character in a name would end the comment and start YAML.
function oneLine(text: string): string {
  return text.replace(/[\u0000-\u001f\u007f\u0085\u2028\u2029]+/g, " ");
}
