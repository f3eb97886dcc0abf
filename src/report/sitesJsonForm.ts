import type { CrashWindow } from "../geo/tallyNetwork.js";
import { CRASH_TYPES, SEVERITIES, type Site } from "../model/types.js";

/**
 * A sites file in YAML's JSON form: the same `crashWindow` and `sites` as sitesYaml, written as
 * one JSON object with one site per line after `#` comment lines. It is still a YAML file (a
 * scenario names it with `sites:` alike), and averta reads this form a hundred times faster
 * than block YAML, which matters from a few thousand sites. Zero crash cells are left out.
 */
export function sitesJsonForm(sites: readonly Site[], window: CrashWindow, provenance: string): string {
  const site = (entry: Site) => {
    const crashes: Record<string, Record<string, number>> = {};
    for (const type of CRASH_TYPES) {
      const cells = SEVERITIES.filter((severity) => entry.crashes[type][severity] > 0);
      if (cells.length > 0) crashes[type] = Object.fromEntries(cells.map((severity) => [severity, entry.crashes[type][severity]]));
    }
    return JSON.stringify({
      id: entry.id,
      name: entry.name,
      kind: entry.kind,
      district: entry.district,
      ...(entry.tags.length > 0 && { tags: entry.tags }),
      ...(entry.area !== undefined && { area: entry.area }),
      ...(entry.location && { location: { lon: round(entry.location.lon, 6), lat: round(entry.location.lat, 6) } }),
      ...(entry.lengthKm !== undefined && { lengthKm: round(entry.lengthKm, 3) }),
      ...(entry.aadt !== undefined && { aadt: entry.aadt }),
      ...(entry.performanceFunction !== undefined && { performanceFunction: entry.performanceFunction }),
      crashes,
      candidates: entry.candidates,
    });
  };
  return [
    `# ${provenance}`,
    "# Crash counts are observed crashes over the window, by crash type and KABCO severity.",
    "# YAML in its JSON form, one site per line; a site with candidates [] is screened, not fundable.",
    `{"crashWindow": {"firstYear": ${window.firstYear}, "lastYear": ${window.lastYear}}, "sites": [`,
    sites.map(site).join(",\n"),
    "]}",
    "",
  ].join("\n");
}

function round(value: number, decimals: number): number {
  return Number(value.toFixed(decimals));
}
