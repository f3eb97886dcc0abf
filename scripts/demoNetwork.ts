import { assignCrashes } from "../src/geo/assignCrashes.js";
import { fromPlane, localPlane, planeX, planeY } from "../src/geo/localPlane.js";
import type { NetworkSite } from "../src/geo/NetworkSite.js";
import { CRASH_TYPES, SEVERITIES, type CrashType, type GeoPoint, type Scenario, type Severity } from "../src/model/types.js";
import { seededRandom } from "./seededRandom.js";

/** The demo city's crash file and site map, as file contents. */
export interface DemoNetwork {
  readonly crashesCsv: string;
  readonly sitesGeojson: string;
}

/** Seed of the committed demo files; change it only together with the files. */
export const DEMO_NETWORK_SEED = 20_270_101;

/** Decimal places of generated coordinates: 1e-7 degrees is about 1 cm. */
const DECIMALS = 7;
const round = (value: number) => Number(value.toFixed(DECIMALS));

/**
 * Builds crash points and site geometry consistent with a scenario's sites: intersections at
 * their location, segments and corridors as straight lines of their length centred on their
 * location at a seeded bearing, and each site's crashes scattered within its radius (50 m) or
 * buffer (15 m), kept only where the assignment rules really give them to that site. Dates are
 * spread over the crash window. A few deliberately bad rows follow the good ones: missing
 * coordinates, text in a coordinate, an unknown severity, a crash outside the window, a repeated
 * id, and one crash far from every site. Same scenario and seed → same files.
 */
export function demoNetwork(scenario: Scenario, seed: number): DemoNetwork {
  const random = seededRandom(seed);
  const located = scenario.sites.filter((site) => site.location !== undefined);
  const centre = located[0]!.location!;
  const plane = localPlane(centre);

  const sites: NetworkSite[] = scenario.sites.map((site) => {
    if (!site.location) throw new RangeError(`demo site ${site.id} has no location`);
    const x = planeX(plane, site.location.lon);
    const y = planeY(plane, site.location.lat);
    const roundPoint = (p: GeoPoint): GeoPoint => ({ lon: round(p.lon), lat: round(p.lat) });
    let paths: GeoPoint[][];
    if (site.kind === "intersection") paths = [[roundPoint(site.location)]];
    else {
      const half = ((site.lengthKm ?? 0.5) * 1000) / 2;
      const bearing = random() * Math.PI;
      const dx = half * Math.cos(bearing);
      const dy = half * Math.sin(bearing);
      paths = [[fromPlane(plane, x - dx, y - dy), fromPlane(plane, x, y), fromPlane(plane, x + dx, y + dy)].map(roundPoint)];
    }
    return {
      id: site.id,
      name: site.name,
      kind: site.kind,
      district: site.district,
      ...(site.area !== undefined && { area: site.area }),
      tags: site.tags,
      ...(site.aadt !== undefined && { aadt: site.aadt }),
      ...(site.performanceFunction !== undefined && { performanceFunction: site.performanceFunction }),
      candidates: site.candidates,
      paths,
    };
  });

  // What each site must receive, one entry per crash.
  const wanted: { site: number; type: CrashType; severity: Severity }[][] = scenario.sites.map((site, index) =>
    CRASH_TYPES.flatMap((type) => SEVERITIES.flatMap((severity) => Array.from({ length: site.crashes[type][severity] }, () => ({ site: index, type, severity })))),
  );
  const placed: { site: number; type: CrashType; severity: Severity; location: GeoPoint }[] = [];
  for (let round_ = 0; round_ < 50 && wanted.some((list) => list.length > 0); round_++) {
    const tries = wanted.flatMap((list, index) => list.map((crash) => ({ crash, location: scatter(sites[index]!, random) })));
    const result = assignCrashes(sites, tries.map((t) => t.location));
    tries.forEach((attempt, k) => {
      if (result.site[k] !== attempt.crash.site) return;
      const list = wanted[attempt.crash.site]!;
      const at = list.indexOf(attempt.crash);
      list.splice(at, 1);
      placed.push({ ...attempt.crash, location: attempt.location });
    });
  }
  const left = wanted.flat().length;
  if (left > 0) throw new RangeError(`could not place ${left} demo crashes on their sites`);

  const { firstYear, lastYear } = scenario.crashWindow;
  const dated = placed.map((crash) => {
    const year = firstYear + Math.floor(random() * (lastYear - firstYear + 1));
    const day = 1 + Math.floor(random() * 365);
    const date = new Date(Date.UTC(year, 0, day)).toISOString().slice(0, 10);
    return { ...crash, date };
  });
  dated.sort((a, b) => (a.date < b.date ? -1 : a.date > b.date ? 1 : 0));

  const csvField = (text: string) => (/[",\r\n]/.test(text) ? `"${text.replace(/"/g, '""')}"` : text);
  const row = (id: string, date: string, lat: string, lon: string, severity: string, type: string, note: string) =>
    [id, date, lat, lon, severity, type, note].map(csvField).join(",");
  const lines = ["id,date,latitude,longitude,severity,type,note"];
  dated.forEach((crash, index) => {
    const site = scenario.sites[crash.site]!;
    lines.push(row(`VC-${String(index + 1).padStart(5, "0")}`, crash.date, crash.location.lat.toFixed(DECIMALS), crash.location.lon.toFixed(DECIMALS), crash.severity, crash.type, `near ${site.name}`));
  });
  const sample = dated[0]!;
  const far = fromPlane(plane, 40_000, 25_000);
  lines.push(
    row("VC-90001", "2023-04-11", "", "", "B", "rear-end", "bad row: no coordinates"),
    row("VC-90002", "2022-09-30", "north of the bridge", sample.location.lon.toFixed(DECIMALS), "C", "angle", "bad row: text in the latitude"),
    row("VC-90003", "2024-02-17", sample.location.lat.toFixed(DECIMALS), sample.location.lon.toFixed(DECIMALS), "U", "angle", "bad row: severity U is not KABCO"),
    row("VC-90004", `${firstYear - 2}-06-05`, sample.location.lat.toFixed(DECIMALS), sample.location.lon.toFixed(DECIMALS), "O", "rear-end", "bad row: before the window"),
    row("VC-00001", "2024-08-08", sample.location.lat.toFixed(DECIMALS), sample.location.lon.toFixed(DECIMALS), "O", "other", "bad row: repeats crash id VC-00001"),
    row("VC-90005", "2025-01-20", far.lat.toFixed(DECIMALS), far.lon.toFixed(DECIMALS), "C", "run-off-road", "far from every site: unassigned"),
  );

  // The GeoJSON properties are the network site itself, less its geometry.
  const features = sites.map(({ paths, ...properties }) => ({
    type: "Feature",
    properties,
    geometry:
      properties.kind === "intersection"
        ? { type: "Point", coordinates: [paths[0]![0]!.lon, paths[0]![0]!.lat] }
        : { type: "LineString", coordinates: paths[0]!.map((p) => [p.lon, p.lat]) },
  }));
  const geojson = { type: "FeatureCollection", name: "Vellmar candidate sites (invented demo city)", features };
  return {
    crashesCsv: lines.join("\r\n") + "\r\n",
    sitesGeojson: "{\n" + `  "type": "FeatureCollection",\n  "name": ${JSON.stringify(geojson.name)},\n  "features": [\n` + features.map((f) => `    ${JSON.stringify(f)}`).join(",\n") + "\n  ]\n}\n",
  };
}

/** A random point within reach of a site: inside 90% of the radius or buffer, rounded to 1 cm. */
function scatter(site: NetworkSite, random: () => number): GeoPoint {
  const plane = localPlane(site.paths[0]![0]!);
  const angle = random() * 2 * Math.PI;
  if (site.kind === "intersection") {
    const distance = 45 * Math.sqrt(random());
    const p = fromPlane(plane, distance * Math.cos(angle), distance * Math.sin(angle));
    return { lon: round(p.lon), lat: round(p.lat) };
  }
  // The plane is centred on the line's first point, so the line runs from (0, 0) to (bx, by).
  const path = site.paths[0]!;
  const end = path[path.length - 1]!;
  const bx = planeX(plane, end.lon);
  const by = planeY(plane, end.lat);
  const length = Math.hypot(bx, by);
  const t = random();
  const offset = (random() * 2 - 1) * 13.5;
  const p = fromPlane(plane, t * bx - (offset * by) / length, t * by + (offset * bx) / length);
  return { lon: round(p.lon), lat: round(p.lat) };
}
