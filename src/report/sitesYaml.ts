import type { CrashWindow } from "../geo/tallyNetwork.js";
import { CRASH_TYPES, SEVERITIES, type Site } from "../model/types.js";

/**
 * The `crashWindow:` and `sites:` blocks of a scenario, as YAML to paste into (or merge with) a
 * scenario file. Text values are written as JSON strings (valid YAML) so no name can break the
 * file; crash cells that are zero are left out. A site with no candidates gets `candidates: []`
 * and a comment: it is screened and counted but cannot be funded until an engineer lists some
 * (here, or under the scenario's siteCandidates, which `averta init` fills with suggestions).
 */
export function sitesYaml(sites: readonly Site[], window: CrashWindow, provenance: string): string {
  const q = (text: string) => JSON.stringify(text);
  const lines = [
    `# ${provenance}`,
    "# Crash counts are observed crashes over the window, by crash type and KABCO severity.",
    `crashWindow: { firstYear: ${window.firstYear}, lastYear: ${window.lastYear} }`,
    "sites:",
  ];
  for (const site of sites) {
    lines.push(`  - id: ${q(site.id)}`, `    name: ${q(site.name)}`, `    kind: ${site.kind}`, `    district: ${q(site.district)}`);
    if (site.tags.length > 0) lines.push(`    tags: [${site.tags.map(q).join(", ")}]`);
    if (site.area !== undefined) lines.push(`    area: ${site.area}`);
    if (site.location) lines.push(`    location: { lon: ${round(site.location.lon, 6)}, lat: ${round(site.location.lat, 6)} }`);
    if (site.lengthKm !== undefined) lines.push(`    lengthKm: ${round(site.lengthKm, 3)}`);
    if (site.aadt !== undefined) lines.push(`    aadt: ${site.aadt}`);
    if (site.performanceFunction !== undefined) lines.push(`    performanceFunction: ${q(site.performanceFunction)}`);
    const rows = CRASH_TYPES.map((type) => {
      const cells = SEVERITIES.filter((severity) => site.crashes[type][severity] > 0).map((severity) => `${severity}: ${site.crashes[type][severity]}`);
      return cells.length > 0 ? `      ${type}: { ${cells.join(", ")} }` : undefined;
    }).filter((row): row is string => row !== undefined);
    lines.push(rows.length > 0 ? "    crashes:" : "    crashes: {}", ...rows);
    lines.push(site.candidates.length > 0 ? `    candidates: [${site.candidates.map(q).join(", ")}]` : "    candidates: []  # none yet: screened, not fundable; list treatment ids here or under siteCandidates in the scenario");
  }
  return lines.join("\n") + "\n";
}

function round(value: number, decimals: number): number {
  return Number(value.toFixed(decimals));
}
