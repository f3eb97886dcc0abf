import geographiclib from "geographiclib";
import { describe, expect, it } from "vitest";
import { seededRandom } from "../../scripts/seededRandom.js";
import { assignCrashes } from "../../src/geo/assignCrashes.js";
import { buildSiteIndex, DEFAULT_GRID_LIMITS, MAX_GRID_CELLS, MAX_GRID_ENTRIES, type GridLimits, type SiteIndex } from "../../src/geo/buildSiteIndex.js";
import { metresPerDegree } from "../../src/geo/metresPerDegree.js";
import { distanceToEdgeM } from "../../src/geo/distanceToEdgeM.js";
import type { NetworkSite } from "../../src/geo/NetworkSite.js";
import { polylineLengthKm } from "../../src/geo/polylineLengthKm.js";
import { polylineMidpoint } from "../../src/geo/polylineMidpoint.js";
import type { GeoPoint, SiteKind } from "../../src/model/types.js";
import { checkAgainstBruteForce } from "./checkAgainstBruteForce.js";

// Reference: GeographicLib (C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87, 2013).
const wgs84 = geographiclib.Geodesic.WGS84;
/** The point `metres` from `from` along the geodesic at `azimuth` degrees. */
const towards = (from: GeoPoint, azimuth: number, metres: number): GeoPoint => {
  // The typings leave out lat2 and lon2, which Direct returns by default.
  const r = wgs84.Direct(from.lat, from.lon, azimuth, metres) as unknown as { lat2: number; lon2: number };
  return { lon: r.lon2, lat: r.lat2 };
};
const site = (id: string, kind: SiteKind, ...paths: GeoPoint[][]): NetworkSite => ({ id, name: id, kind, district: `d-${id}`, tags: [], candidates: [], paths });

/** Cells and listings of an index, what its memory is made of, within the limits. */
function expectBounded(index: SiteIndex, limits: GridLimits = DEFAULT_GRID_LIMITS) {
  expect(index.columns * index.rows).toBeLessThanOrEqual(limits.maxCells);
  expect(index.cellElements.length).toBeLessThanOrEqual(limits.maxEntries);
  expect(index.cellStart.length).toBe(index.columns * index.rows + 1);
  expect(index.elementLonLat.length).toBe(4 * index.elementSite.length);
}

/** A small city network about `centre`: intersections on a 300 m grid and a segment from each. */
function city(centre: GeoPoint, prefix: string, next: () => number): NetworkSite[] {
  const sites: NetworkSite[] = [];
  for (let i = 0; i < 5; i++)
    for (let j = 0; j < 4; j++) {
      const corner = towards(towards(centre, 90, i * 300), 0, j * 300);
      sites.push(site(`${prefix}I-${i}-${j}`, "intersection", [corner]));
      sites.push(site(`${prefix}S-${i}-${j}`, "segment", [corner, towards(corner, 360 * next(), 250)]));
    }
  return sites;
}

/** Crashes near each site (within 60 m of a vertex or of a point along an edge). */
function crashesNear(sites: readonly NetworkSite[], next: () => number, perSite: number): GeoPoint[] {
  const crashes: GeoPoint[] = [];
  for (const s of sites)
    for (let k = 0; k < perSite; k++) {
      const path = s.paths[Math.floor(next() * s.paths.length)]!;
      const i = Math.floor(next() * Math.max(1, path.length - 1));
      const a = path[i]!;
      const b = path[Math.min(path.length - 1, i + 1)]!;
      const t = next();
      const dLon = ((((b.lon - a.lon + 180) % 360) + 360) % 360) - 180;
      const on = { lon: ((a.lon + t * dLon + 540) % 360) - 180, lat: a.lat + t * (b.lat - a.lat) };
      crashes.push(towards(on, 360 * next(), 60 * next()));
    }
  return crashes;
}

describe("the site index stays bounded and the assignment right whatever the extent", () => {
  it("handles world-spanning sites beside a city: bounded cells, and every crash as a full search would place it", () => {
    const next = seededRandom(11);
    const world: NetworkSite[] = [
      // Around the equator, along a meridian from pole to pole, and zig-zags over the globe.
      site("W-EQUATOR", "corridor", [{ lon: -180, lat: 0 }, { lon: -90, lat: 0 }, { lon: 0, lat: 0 }, { lon: 90, lat: 0 }, { lon: 179.999, lat: 0 }]),
      site("W-MERIDIAN", "segment", [{ lon: 30, lat: -89.9 }, { lon: 30, lat: 0 }, { lon: 30, lat: 89.9 }]),
      site("W-POLE", "intersection", [{ lon: 0, lat: 89.99 }]),
      ...Array.from({ length: 30 }, (_, k) =>
        site(
          `W-${k}`,
          "segment",
          Array.from({ length: 6 }, () => ({ lon: -180 + 360 * next(), lat: -85 + 170 * next() })),
        ),
      ),
    ];
    const sites = [...city({ lon: 10.4, lat: 55.4 }, "V", next), ...world];
    const index = buildSiteIndex(sites, 50);
    expectBounded(index);
    expect(index.wrapsAround).toBe(true);
    const crashes = [...crashesNear(sites, next, 6), ...Array.from({ length: 300 }, () => ({ lon: -180 + 360 * next(), lat: -90 + 180 * next() }))];
    const result = assignCrashes(sites, crashes);
    const { assigned } = checkAgainstBruteForce(sites, crashes, result);
    expect(assigned).toBeGreaterThan(200);
    expect(assigned).toBeLessThan(crashes.length);
    // A crash on the equator's corridor, half way round the world from the city, belongs to it.
    const onEquator = assignCrashes(sites, [towards({ lon: -135, lat: 0 }, 0, 10)]);
    expect(sites[onEquator.site[0]!]!.id).toBe("W-EQUATOR");
    expect(onEquator.distanceM[0]).toBeCloseTo(10, 3);
  });

  it("keeps memory bounded for many edges each spanning most of the globe, coarsening the grid as needed", () => {
    expect(DEFAULT_GRID_LIMITS).toEqual({ maxCells: MAX_GRID_CELLS, maxEntries: MAX_GRID_ENTRIES });
    const next = seededRandom(12);
    const sites = Array.from({ length: 400 }, (_, k) =>
      site(`L-${k}`, "segment", [
        { lon: -85 + next(), lat: -80 + next() },
        { lon: 85 - next(), lat: 80 - next() },
      ]),
    );
    const index = buildSiteIndex(sites, 50);
    expectBounded(index);
    // Every edge is listed along its line, in far fewer cells than its bounding box holds.
    expect(index.cellElements.length).toBeLessThan((sites.length * index.columns * index.rows) / 100);
    const crashes = [...crashesNear(sites.slice(0, 30), next, 3), { lon: 100, lat: -10 }, { lon: -170, lat: 60 }, { lon: 0.3, lat: 0.3 }];
    checkAgainstBruteForce(sites, crashes, assignCrashes(sites, crashes));
    // Tight limits force coarser cells (the listings alone would pass 30,000 at the first size);
    // the answers stay the same.
    const tight: GridLimits = { maxCells: 20_000, maxEntries: 30_000 };
    const coarse = buildSiteIndex(sites, 50, tight);
    expectBounded(coarse, tight);
    expect(coarse.cellLatDeg).toBeGreaterThan(2 * Math.sqrt((160 * 170) / tight.maxCells));
    checkAgainstBruteForce(sites, crashes, assignCrashes(sites, crashes, { gridLimits: tight }));
    // Limits no grid can meet leave one cell listing each element once.
    const single = buildSiteIndex(sites, 50, { maxCells: 1, maxEntries: 1 });
    expect([single.columns, single.rows, single.cellElements.length]).toEqual([1, 1, sites.length]);
    checkAgainstBruteForce(sites, crashes, assignCrashes(sites, crashes, { gridLimits: { maxCells: 1, maxEntries: 1 } }));
  });

  it("measures across the antimeridian, where a site's edge crosses it the short way", () => {
    const next = seededRandom(13);
    const east = { lon: 179.9998, lat: -16.5 };
    const west = { lon: -179.999, lat: -16.5 };
    const crossing = site("F-S1", "segment", [{ lon: 179.999, lat: -16.5005 }, { lon: -179.999, lat: -16.5005 }]);
    const sites = [site("F-I1", "intersection", [east]), site("F-I2", "intersection", [west]), crossing, ...city({ lon: 179.995, lat: -16.52 }, "F", next)];
    const index = buildSiteIndex(sites, 50);
    expectBounded(index);
    // One compact grid across 180°, not one that spans the globe.
    expect(index.wrapsAround).toBe(false);
    expect(index.spanLonDeg).toBeLessThan(0.1);
    // 30 m west of F-I1, across the antimeridian: F-I1 at GeographicLib's distance.
    const near = towards(east, 90, 30);
    expect(near.lon).toBeLessThan(-179.9);
    const result = assignCrashes(sites, [near, { lon: 180, lat: -16.5006 }, { lon: 0, lat: -16.5005 }, { lon: 179.999, lat: 60 }]);
    expect(sites[result.site[0]!]!.id).toBe("F-I1");
    expect(result.distanceM[0]).toBeCloseTo(30, 3);
    // On the crossing edge's line at 180°, 11 m south of it.
    expect(sites[result.site[1]!]!.id).toBe("F-S1");
    expect(result.distanceM[1]).toBeCloseTo(wgs84.Inverse(-16.5006, 180, -16.5005, 180).s12!, 3);
    // Half a world away on the same latitude: not on the edge, and off the sites' extent.
    expect([result.site[2], result.outsideExtent[2], result.outsideExtent[3]]).toEqual([-1, 1, 1]);
    expect(result.nearestSite[2]).toBeGreaterThanOrEqual(0);
    const crashes = [...crashesNear(sites, next, 8), ...Array.from({ length: 100 }, () => ({ lon: -180 + 360 * next(), lat: -90 + 180 * next() }))];
    checkAgainstBruteForce(sites, crashes, assignCrashes(sites, crashes));
    // The crossing edge is 0.002° of longitude long, its middle on the antimeridian.
    expect(polylineLengthKm(crossing.paths) * 1000).toBeCloseTo(wgs84.Inverse(-16.5005, 179.999, -16.5005, -179.999).s12!, 3);
    const middle = polylineMidpoint(crossing.paths);
    expect(Math.abs(middle.lon)).toBeCloseTo(180, 9);
    expect(middle.lat).toBeCloseTo(-16.5005, 9);
  });

  it("measures a world-spanning edge's length along its line without failing near antipodes", () => {
    // Two ends 180° apart on the equator: a geodesic method alone may not converge there.
    const length = polylineLengthKm([[{ lon: -90, lat: 0 }, { lon: 90, lat: 0 }]]);
    // Along the equator, half its length: π × 6378.137 km = 20,037.508 km (the WGS84 equatorial
    // radius); the geodesic between those ends runs over a pole instead (GeographicLib: 20,003.931 km).
    expect(length).toBeCloseTo(Math.PI * 6378.137, 3);
    expect(wgs84.Inverse(0, -90, 0, 90).s12! / 1000).toBeCloseTo(20003.931, 3);
  });
});

describe("the crash's local plane against GeographicLib", () => {
  it("measures 50 m and 1 km within the documented error at latitudes up to 80°", () => {
    const next = seededRandom(14);
    let checked = 0;
    for (const [maxLat, metres, bound] of [[60, 50, 3e-6], [60, 1000, 6e-5], [80, 50, 1e-5]] as const) {
      let worst = 0;
      for (let k = 0; k < 300; k++) {
        const from = { lon: -180 + 360 * next(), lat: -maxLat + 2 * maxLat * next() };
        const crash = towards(from, 360 * next(), metres);
        const scale = metresPerDegree(crash.lat);
        const measured = distanceToEdgeM(crash.lon, crash.lat, scale.lon, scale.lat, from.lon, from.lat, from.lon, from.lat);
        worst = Math.max(worst, Math.abs(measured - metres) / metres);
        checked++;
      }
      expect(worst, `${metres} m up to ${maxLat}°`).toBeLessThan(bound);
    }
    expect(checked).toBe(900);
  });
});
