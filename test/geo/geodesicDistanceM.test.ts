import geographiclib from "geographiclib";
import { describe, expect, it } from "vitest";
import { geodesicDistanceM } from "../../src/geo/geodesicDistanceM.js";
import { fromPlane, localPlane, planeX, planeY } from "../../src/geo/localPlane.js";
import { polylineLengthKm } from "../../src/geo/polylineLengthKm.js";
import { polylineMidpoint } from "../../src/geo/polylineMidpoint.js";
import { seededRandom as random } from "../../scripts/seededRandom.js";

// Reference: GeographicLib (C. F. F. Karney, "Algorithms for geodesics", J. Geodesy 87, 2013),
// its JavaScript port installed as a devDependency for tests only.
const wgs84 = geographiclib.Geodesic.WGS84;
const reference = (lat1: number, lon1: number, lat2: number, lon2: number) => wgs84.Inverse(lat1, lon1, lat2, lon2).s12!;


describe("geodesicDistanceM (Vincenty inverse) against GeographicLib", () => {
  it("agrees to 0.1 mm on 200 seeded pairs from 1 m to 5000 km", () => {
    const next = random(20_240_601);
    let checked = 0;
    for (let i = 0; i < 200; i++) {
      const lat1 = -70 + 140 * next();
      const lon1 = -180 + 360 * next();
      const scale = 10 ** (-5 + 6 * next()); // degrees: from ~1 m to ~50 degrees apart
      const lat2 = Math.max(-80, Math.min(80, lat1 + scale * (next() - 0.5)));
      const lon2 = lon1 + scale * (next() - 0.5);
      expect(geodesicDistanceM({ lon: lon1, lat: lat1 }, { lon: lon2, lat: lat2 })).toBeCloseTo(reference(lat1, lon1, lat2, lon2), 4);
      checked++;
    }
    expect(checked).toBe(200);
  });
  it("is zero for a point and itself", () => {
    expect(geodesicDistanceM({ lon: 10.4, lat: 55.4 }, { lon: 10.4, lat: 55.4 })).toBe(0);
  });
  it("one degree of latitude at the equator is 110 574.389 m (GeographicLib; also the WGS84 meridian arc tables)", () => {
    expect(geodesicDistanceM({ lon: 0, lat: 0 }, { lon: 0, lat: 1 })).toBeCloseTo(110574.389, 2);
    expect(reference(0, 0, 1, 0)).toBeCloseTo(110574.389, 2);
  });
});

describe("localPlane error bound at city scale", () => {
  it("keeps distances within 0.25 % of GeographicLib's up to 10 km from a centre at 55° N", () => {
    const centre = { lon: 10.4, lat: 55.4 };
    const plane = localPlane(centre);
    const next = random(7);
    let worst = 0;
    for (let i = 0; i < 300; i++) {
      const a = fromPlane(plane, (next() - 0.5) * 20_000, (next() - 0.5) * 20_000);
      const angle = next() * 2 * Math.PI;
      const b = fromPlane(plane, planeX(plane, a.lon) + 50 * Math.cos(angle), planeY(plane, a.lat) + 50 * Math.sin(angle));
      const planar = Math.hypot(planeX(plane, b.lon) - planeX(plane, a.lon), planeY(plane, b.lat) - planeY(plane, a.lat));
      worst = Math.max(worst, Math.abs(planar - reference(a.lat, a.lon, b.lat, b.lon)) / reference(a.lat, a.lon, b.lat, b.lon));
    }
    // Documented bound |Δφ|·tan φ0 with |Δφ| ≤ 10 km / 6371 km at 55.4°: 0.23 %.
    expect(worst).toBeLessThan(0.0025);
    expect(worst).toBeGreaterThan(0); // the plane is an approximation, so some error must show
  });
});

describe("polyline length and midpoint", () => {
  it("sums vertex-to-vertex geodesics", () => {
    const path = [{ lon: 10.39, lat: 55.39 }, { lon: 10.40, lat: 55.39 }, { lon: 10.40, lat: 55.40 }];
    const expected = (reference(55.39, 10.39, 55.39, 10.4) + reference(55.39, 10.4, 55.4, 10.4)) / 1000;
    expect(polylineLengthKm([path])).toBeCloseTo(expected, 7);
  });
  it("puts the midpoint halfway along the length", () => {
    const path = [{ lon: 10.39, lat: 55.39 }, { lon: 10.40, lat: 55.39 }, { lon: 10.40, lat: 55.40 }];
    const middle = polylineMidpoint([path]);
    const toStart = reference(55.39, 10.39, 55.39, middle.lon) + reference(55.39, middle.lon, middle.lat, middle.lon);
    expect(toStart).toBeCloseTo((polylineLengthKm([path]) * 1000) / 2, 1);
  });
});
