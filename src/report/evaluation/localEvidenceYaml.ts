import type { LocalEvidenceEntry } from "../../analysis/localEvidenceEntries.js";
import { CRASH_TYPES, SEVERITIES } from "../../model/types.js";
import { EVALUATION_CAUTIONS } from "./evaluationCautions.js";

const round = (value: number) => Number(value.toFixed(4));

/**
 * The local CMFs as a catalogue file of `localEvidence:` entries, to list in a scenario's
 * `catalogues:` after the published catalogue (each entry pools with the treatment's effect on
 * the same crash cells, by inverse-variance weighting of ln CMF). Text is written as JSON strings
 * (valid YAML) so no name can break the file; left-out estimates are listed as comments.
 */
export function localEvidenceYaml(entries: readonly LocalEvidenceEntry[], title: string): string {
  const q = (text: string) => JSON.stringify(text);
  const lines = [
    "# yaml-language-server: $schema=../schema/catalogue.schema.json",
    "# Local evidence written by averta evaluate. List this file in a scenario's catalogues after the",
    "# published catalogue; each entry pools with the treatment's effect on the same crash cells.",
    ...EVALUATION_CAUTIONS.map((caution) => `# ${caution}`),
    `catalogue: ${q(`Local evidence: ${title}`)}`,
    "localEvidence:",
  ];
  const kept = entries.filter((entry) => entry.kind === "entry");
  if (kept.length === 0) lines[lines.length - 1] = "localEvidence: []";
  for (const entry of kept) {
    const allTypes = CRASH_TYPES.every((type) => entry.crashGroup.crashTypes.includes(type));
    const allSeverities = SEVERITIES.every((severity) => entry.crashGroup.severities.includes(severity));
    lines.push(`  - treatment: ${q(entry.treatment)}`, `    crashTypes: [${allTypes ? "all" : entry.crashGroup.crashTypes.join(", ")}]`);
    if (!allSeverities) lines.push(`    severities: [${entry.crashGroup.severities.join(", ")}]`);
    lines.push(`    cmf: ${round(entry.evidence.cmf)}`, `    standardError: ${round(entry.evidence.standardError)}`, `    source: ${q(entry.source)}`);
  }
  for (const entry of entries) if (entry.kind === "skipped") lines.push(`# left out: ${entry.group.replace(/[\r\n]+/g, " ")}, ${entry.crashGroup}: ${entry.why}`);
  return lines.join("\n") + "\n";
}
