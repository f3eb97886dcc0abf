import { describe, expect, it } from "vitest";
import geographiclib from "geographiclib";
import { assignCrashes } from "../../src/geo/assignCrashes.js";
import { fromPlane, localPlane, type LocalPlane } from "../../src/geo/localPlane.js";
import type { NetworkSite } from "../../src/geo/NetworkSite.js";
import type { SiteKind } from "../../src/model/types.js";
import { checkAgainstBruteForce } from "./checkAgainstBruteForce.js";

// A hand-drawn network in metres about a centre; it is symmetric about (0, 0) so the plane that
// assignCrashes centres on the sites' extent is this same plane, and distances below are exact.
const plane: LocalPlane = localPlane({ lon: 10.4, lat: 55.4 });
const at = (x: number, y: number) => fromPlane(plane, x, y);
const site = (id: string, kind: SiteKind, ...paths: [number, number][][]): NetworkSite => ({
  id,
  name: id,
  kind,
  district: `district of ${id}`,
  tags: [],
  candidates: [],
  paths: paths.map((path) => path.map(([x, y]) => at(x, y))),
});
const network: NetworkSite[] = [
  site("I-B", "intersection", [[0, 0]]),
  site("I-A", "intersection", [[0, 0]]), // same point as I-B: a tie, which I-A wins by id
  site("I-C", "intersection", [[200, 0]]),
  site("S-3", "segment", [[-300, 20], [300, 20]]),
  site("S-9", "corridor", [[-300, 150], [300, 150]]),
  site("S-2", "segment", [[-300, 150], [300, 150]]), // same line as S-9
  site("S-1", "segment", [[-300, -150], [300, -150]], [[-300, -100], [-200, -100]]),
];
const ids = (points: [number, number][]) => {
  const result = assignCrashes(network, points.map(([x, y]) => at(x, y)));
  return [...result.site].map((index) => (index < 0 ? null : network[index]!.id));
};

describe("assignCrashes on a hand-drawn network", () => {
  it("prefers an intersection within its radius over a nearer segment", () => {
    expect(ids([[0, 30], [200, 49]])).toEqual(["I-A", "I-C"]);
  });
  it("breaks exact ties by site id, for intersections and for segments", () => {
    expect(ids([[5, 5], [100, 160]])).toEqual(["I-A", "S-2"]);
  });
  it("counts a crash exactly on the radius or buffer as inside, and just beyond as outside", () => {
    expect(ids([[0, 50], [0, 50.5], [100, -135], [100, -134]])).toEqual(["I-A", null, "S-1", null]);
  });
  it("measures to the nearest point of a polyline, its ends and every path of a MultiLineString", () => {
    expect(ids([[-310, -150], [-250, -110], [-250, -125]])).toEqual(["S-1", "S-1", null]);
  });
  it("names the nearest site at any distance for crashes outside every site, and flags those off the map", () => {
    const result = assignCrashes(network, [at(0, 50.5), at(50_000, 0), at(100, -134)]);
    expect([...result.site]).toEqual([-1, -1, -1]);
    expect([...result.nearestSite].map((index) => network[index]!.id)).toEqual(["S-3", "S-3", "S-1"]);
    expect([...result.outsideExtent]).toEqual([0, 1, 0]);
    expect(result.distanceM[0]).toBeNaN();
  });
  it("reports the distance to the chosen site (GeographicLib's geodesic, to 0.1 mm)", () => {
    const crash = at(0, 30);
    const result = assignCrashes(network, [crash]);
    const site = network.find((s) => s.id === "I-A")!.paths[0]![0]!;
    expect(result.distanceM[0]).toBeCloseTo(geographiclib.Geodesic.WGS84.Inverse(site.lat, site.lon, crash.lat, crash.lon).s12!, 4);
  });
  it("honours other radii", () => {
    const result = assignCrashes(network, [at(0, 60), at(0, 40)], { intersectionRadiusM: 30, segmentBufferM: 25 });
    expect([...result.site].map((index) => (index < 0 ? null : network[index]!.id))).toEqual([null, "S-3"]);
  });
});

describe("assignCrashes agrees with a brute-force search", () => {
  it("on 2,200 seeded crashes over a 60-site grid network, 200 of them far off it", () => {
    let state = 12345;
    const next = () => ((state = (Math.imul(state, 1103515245) + 12345) >>> 0) / 4294967296);
    const sites: NetworkSite[] = [];
    for (let i = 0; i < 6; i++)
      for (let j = 0; j < 5; j++) {
        sites.push(site(`I-${i}-${j}`, "intersection", [[i * 300 - 750, j * 300 - 600]]));
        sites.push(site(`S-${i}-${j}`, "segment", [[i * 300 - 750, j * 300 - 600], [i * 300 - 450 - 60 * next(), j * 300 - 600 + 40 * next()]]));
      }
    const near: [number, number][] = Array.from({ length: 2000 }, () => [-900 + 1800 * next(), -750 + 1500 * next()]);
    // Far off the network too (up to 20 km out), where the nearest-site search starts outside the grid.
    const far: [number, number][] = Array.from({ length: 200 }, () => [-20_000 + 40_000 * next(), -20_000 + 40_000 * next()]);
    const crashes = [...near, ...far];
    const result = assignCrashes(sites, crashes.map(([x, y]) => at(x, y)));
    const { assigned } = checkAgainstBruteForce(sites, crashes.map(([x, y]) => at(x, y)), result);
    expect(assigned).toBeGreaterThan(200); // both outcomes were exercised
    expect(assigned).toBeLessThan(1800);
  });
});
