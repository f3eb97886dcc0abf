import { performance } from "node:perf_hooks";
import { seededRandom } from "../scripts/seededRandom.js";
import { fromPlane, localPlane } from "../src/geo/localPlane.js";
import type { NetworkSite } from "../src/geo/NetworkSite.js";
import { tallyNetwork } from "../src/geo/tallyNetwork.js";
import { DEFAULT_CRASH_MAPPING } from "../src/io/CrashMapping.js";
import { parseCrashCsv } from "../src/io/parseCrashCsv.js";
import { CRASH_TYPES, SEVERITIES } from "../src/model/types.js";

/** Figures of one tally benchmark run. */
export interface TallyBenchResult {
  readonly crashes: number;
  readonly sites: number;
  readonly assigned: number;
  readonly unassigned: number;
  readonly rejected: number;
  /** Seconds to parse the CSV text into records, and to assign and tally them. */
  readonly parseSeconds: number;
  readonly tallySeconds: number;
  /** Peak resident memory of the process so far, MiB (includes the generated input). */
  readonly peakRssMiB: number;
  readonly summary: string;
}

/**
 * Tallies 500,000 generated crash records (as CSV text, so parsing is timed too) against 20,000
 * generated sites: a 100 × 100 grid of intersections 150 m apart and 10,000 segments between
 * them, in a city of 15 km × 15 km. Most crashes fall near a site, some anywhere, and 0.2 %
 * are bad rows. Seeded, so every run does the same work.
 */
export function tallyBench(crashCount = 500_000, gridSide = 100): TallyBenchResult {
  const random = seededRandom(42);
  const plane = localPlane({ lon: 10.4, lat: 55.4 });
  const spacingM = 150;
  const origin = (-spacingM * (gridSide - 1)) / 2;
  const sites: NetworkSite[] = [];
  for (let i = 0; i < gridSide; i++)
    for (let j = 0; j < gridSide; j++) {
      const x = origin + i * spacingM;
      const y = origin + j * spacingM;
      const base = { district: `D${Math.floor(i / 25)}-${Math.floor(j / 25)}`, tags: [], candidates: ["t"] };
      sites.push({ ...base, id: `I-${i}-${j}`, name: `I-${i}-${j}`, kind: "intersection", paths: [[fromPlane(plane, x, y)]] });
      // One segment per grid node, alternately eastward and northward, stopping short of the next node.
      const east = (i + j) % 2 === 0 && i < gridSide - 1;
      const end = east ? [x + spacingM, y] : [x, y + spacingM];
      sites.push({ ...base, id: `S-${i}-${j}`, name: `S-${i}-${j}`, kind: "segment", paths: [[fromPlane(plane, x, y), fromPlane(plane, end[0]!, end[1]!)]] });
    }

  const lines = ["id,date,latitude,longitude,severity,type"];
  for (let k = 0; k < crashCount; k++) {
    const x = origin - 200 + random() * (spacingM * (gridSide - 1) + 400);
    const y = origin - 200 + random() * (spacingM * (gridSide - 1) + 400);
    const p = fromPlane(plane, x, y);
    const year = 2021 + Math.floor(random() * 5);
    const severity = k % 500 === 7 ? "Q" : SEVERITIES[Math.floor(random() * 5)]!;
    const type = CRASH_TYPES[Math.floor(random() * CRASH_TYPES.length)]!;
    lines.push(`C${k},${year}-06-15,${p.lat.toFixed(7)},${p.lon.toFixed(7)},${severity},${type}`);
  }
  const text = lines.join("\r\n");

  const t0 = performance.now();
  const rows = parseCrashCsv(text, DEFAULT_CRASH_MAPPING, "generated.csv");
  const t1 = performance.now();
  const { quality } = tallyNetwork(sites, rows, { firstYear: 2021, lastYear: 2025 });
  const t2 = performance.now();
  const peakRssMiB = process.resourceUsage().maxRSS / 1024;
  const result = {
    crashes: quality.rowsRead,
    sites: sites.length,
    assigned: quality.assigned,
    unassigned: quality.unassigned,
    rejected: quality.rejected.length,
    parseSeconds: (t1 - t0) / 1000,
    tallySeconds: (t2 - t1) / 1000,
    peakRssMiB,
  };
  return {
    ...result,
    summary:
      `tally: ${result.crashes} crashes × ${result.sites} sites: parse ${result.parseSeconds.toFixed(2)} s, assign + tally ${result.tallySeconds.toFixed(2)} s; ` +
      `${result.assigned} assigned, ${result.unassigned} unassigned, ${result.rejected} rejected; peak RSS ${peakRssMiB.toFixed(0)} MiB`,
  };
}
