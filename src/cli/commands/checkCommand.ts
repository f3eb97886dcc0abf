import type { Command } from "commander";
import { preparePlan } from "../../analysis/preparePlan.js";
import { formatProblem } from "../../io/InputError.js";
import { loadScenario } from "../../io/loadScenario.js";
import { sumCrashMatrix } from "../../model/crashMatrix.js";
import { effectEvidenceLines } from "../../model/effectEvidenceLines.js";
import { windowYears } from "../../model/siteBaselines.js";
import { sitesWithoutCandidates } from "../../model/sitesWithoutCandidates.js";
import { KSI_SEVERITIES } from "../../model/types.js";
import { describeAssumptions } from "../../report/describeAssumptions.js";
import { formatFixed, formatMoney } from "../../report/formatNumber.js";
import type { Scenario } from "../../model/types.js";
import type { CliIo } from "../CliIo.js";

/** `averta check <scenario>`: validate the files and summarise what the optimiser will see. */
export function registerCheckCommand(program: Command, io: CliIo): void {
  program
    .command("check")
    .description("validate a scenario and its catalogues, and summarise sites, alternatives and crashes")
    .argument("<scenario>", "scenario YAML file")
    .action((file: string) => {
      const loaded = loadScenario(file);
      const { scenario } = loaded;
      const prepared = preparePlan(scenario);
      const alternatives = prepared.sites.reduce((total, entry) => total + entry.alternatives.length, 0);
      const crashes = scenario.sites.reduce((total, site) => total + sumCrashMatrix(site.crashes), 0);
      const ksi = scenario.sites.reduce((total, site) => total + sumCrashMatrix(site.crashes, KSI_SEVERITIES), 0);
      const byKind = (kind: string) => scenario.sites.filter((site) => site.kind === kind).length;
      const withoutCandidates = sitesWithoutCandidates(scenario.sites);
      const lines = [
        `${file}: valid`,
        `  scenario       ${scenario.name}`,
        ...(loaded.sitesSource !== loaded.source ? [`  sites file     ${loaded.sitesSource.file}`] : []),
        `  sites          ${scenario.sites.length} (${byKind("intersection")} intersections, ${byKind("segment")} segments, ${byKind("corridor")} corridors) in ${new Set(scenario.sites.map((s) => s.district)).size} district(s)`,
        `  treatments     ${scenario.catalogue.treatments.length} in ${loaded.catalogues.length} catalogue(s)`,
        ...localEvidenceLines(scenario),
        `  alternatives   ${alternatives} (up to ${scenario.maxTreatmentsPerSite} treatments per site${scenario.programme === undefined ? "" : ", each in every build year it can have"})`,
        ...(withoutCandidates.length > 0 ? [`  no candidates  ${withoutCandidates.length} site(s): screened and counted, but they cannot be funded until treatments are listed`] : []),
        `  crashes        ${crashes} in ${scenario.crashWindow.firstYear}-${scenario.crashWindow.lastYear}, of which KSI crashes (K+A) ${ksi} (${formatFixed(ksi / windowYears(scenario), 1)} a year)`,
        `  budget         ${formatMoney(scenario.budget)} ${scenario.currency}`,
        ...programmeLines(scenario),
        `  baselines      ${scenario.baseline}: Empirical Bayes at ${prepared.baselines.filter((b) => b.method === "empirical-bayes").length} site(s), observed counts at ${prepared.baselines.filter((b) => b.method === "observed").length}`,
        `  K+A costing    ${describeAssumptions(scenario).ksiCosting}`,
        `  rules          ${scenario.rules.length}`,
        `  warnings       ${loaded.warnings.length}`,
      ];
      io.stdout(lines.join("\n") + "\n");
      // Notes first: they need no fixing, so the warnings stay the last thing on screen.
      if (loaded.notes.length > 0) io.stderr(summariseProblems("note", loaded.notes.map((n) => ({ code: n.code, text: formatProblem(n) })), NOTES_LISTED));
      if (loaded.warnings.length > 0) io.stderr(summariseProblems("warning", loaded.warnings.map((w) => ({ code: w.code, text: formatProblem(w) })), WARNINGS_LISTED));
    });
}

/** Warnings and notes listed of each kind before the rest are counted. */
const WARNINGS_LISTED = 5;
const NOTES_LISTED = 10;

/** Prints every warning (or note), except that long runs of one kind are cut to `listed` examples. */
function summariseProblems(label: string, warnings: readonly { code: string; text: string }[], listed: number): string {
  const byCode = new Map<string, string[]>();
  for (const warning of warnings) byCode.set(warning.code, [...(byCode.get(warning.code) ?? []), warning.text]);
  const lines: string[] = [];
  for (const [, texts] of byCode) {
    for (const text of texts.slice(0, listed)) lines.push(`${label}: ${text}`);
    if (texts.length > listed) lines.push(`${label}: … and ${texts.length - listed} more like these`);
  }
  return lines.join("\n") + "\n";
}

/** Each effect whose CMF rests on local evidence, with the result, both inputs and the rule. */
function localEvidenceLines(scenario: Scenario): string[] {
  const lines = effectEvidenceLines(scenario.catalogue.treatments);
  if (lines.length === 0) return [];
  return [`  local evidence ${lines.length} effect(s) with a local CMF:`, ...lines.map((line) => `    - ${line}`)];
}

/** What `check` says of a multi-year programme: years, budgets, carry-over, escalation, phasing and commitments. */
function programmeLines(scenario: Scenario): string[] {
  const programme = scenario.programme;
  if (programme === undefined) return [];
  const phased = scenario.catalogue.treatments.filter((t) => t.phasing !== undefined).map((t) => t.id);
  const windows = scenario.sites.filter((site) => site.earliestYear !== undefined || site.latestYear !== undefined).length;
  return [
    `  programme      ${programme.firstYear}-${programme.firstYear + programme.years - 1}: budgets ${programme.budgets.map((b) => formatMoney(b)).join(", ")}; carry-over ${programme.carryOver}; cost escalation ${formatFixed(programme.costEscalationRate * 100, 1)}% a year`,
    `  committed      ${programme.committed.length === 0 ? "none" : programme.committed.map((p) => `${p.site} (${p.treatments.join(" + ")}, ${p.year})`).join("; ")}`,
    `  phasing        ${phased.length === 0 ? "none: all capital in the build year" : `${phased.length} treatment(s) spend capital before the build year (${phased.join(", ")})`}`,
    ...(windows > 0 ? [`  build windows  ${windows} site(s) have an earliest or latest build year`] : []),
  ];
}
