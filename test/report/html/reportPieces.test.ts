import { describe, expect, it } from "vitest";
import { compactAmount } from "../../../src/report/html/compactAmount.js";
import { EARTH_RADIUS_KM, equirectangularKm } from "../../../src/report/html/equirectangularKm.js";
import { escapeHtml } from "../../../src/report/html/escapeHtml.js";
import { niceTicks } from "../../../src/report/niceTicks.js";
import { scaleBarKm } from "../../../src/report/html/scaleBarKm.js";
import { scriptJson } from "../../../src/report/html/scriptJson.js";

/** Great-circle distance by the haversine formula (Sinnott 1984, "Virtues of the Haversine", Sky & Telescope 68:159). */
function haversineKm(a: { lon: number; lat: number }, b: { lon: number; lat: number }): number {
  const r = Math.PI / 180;
  const h = Math.sin(((b.lat - a.lat) * r) / 2) ** 2 + Math.cos(a.lat * r) * Math.cos(b.lat * r) * Math.sin(((b.lon - a.lon) * r) / 2) ** 2;
  return 2 * EARTH_RADIUS_KM * Math.asin(Math.sqrt(h));
}

describe("escapeHtml", () => {
  it("encodes the five characters OWASP's XSS prevention rule 1 names", () => {
    expect(escapeHtml(`<script>alert("x") & 'y'</script>`)).toBe("&lt;script&gt;alert(&quot;x&quot;) &amp; &#39;y&#39;&lt;/script&gt;");
  });
});

describe("scriptJson", () => {
  it("cannot close a script element and parses back to the same value", () => {
    const value = { name: "</script><script>alert(1)</script><!--", separators: "\u2028\u2029", amp: "a&b" };
    const text = scriptJson(value);
    expect(text).not.toMatch(/[<>&\u2028\u2029]/);
    expect(JSON.parse(text)).toEqual(value);
  });
});

describe("equirectangularKm", () => {
  // Over a city the projection should match great-circle distance closely (common practice: under 1% within tens of km).
  it("agrees with the haversine distance within 0.1% across a city at 55°N", () => {
    const centre = { lon: 10.41, lat: 55.405 };
    const points = [
      { lon: 10.38, lat: 55.38 },
      { lon: 10.44, lat: 55.43 },
      { lon: 10.41, lat: 55.37 },
      { lon: 10.45, lat: 55.405 },
    ];
    let checked = 0;
    for (const a of points) {
      for (const b of points) {
        if (a === b) continue;
        const pa = equirectangularKm(a, centre);
        const pb = equirectangularKm(b, centre);
        const flat = Math.hypot(pa.xKm - pb.xKm, pa.yKm - pb.yKm);
        expect(Math.abs(flat - haversineKm(a, b)) / haversineKm(a, b)).toBeLessThan(1e-3);
        checked += 1;
      }
    }
    expect(checked).toBe(12);
  });

  it("puts one degree of latitude at 111.195 km (2π × 6371.0088 / 360, IUGG mean radius)", () => {
    expect(equirectangularKm({ lon: 0, lat: 1 }, { lon: 0, lat: 0 }).yKm).toBeCloseTo(111.1951, 3);
  });
});

describe("niceTicks", () => {
  // Heckbert (Graphics Gems, 1990): steps of 1, 2 or 5 × 10^n.
  it("chooses 1-2-5 steps", () => {
    expect(niceTicks(0, 29_898_400, 6)).toEqual([0, 5e6, 10e6, 15e6, 20e6, 25e6]);
    expect(niceTicks(0, 190.4, 5)).toEqual([0, 50, 100, 150]);
    expect(niceTicks(0, 16.8, 4)).toEqual([0, 5, 10, 15]);
    expect(niceTicks(0, 1, 5)).toEqual([0, 0.2, 0.4, 0.6, 0.8, 1]);
  });
});

describe("scaleBarKm", () => {
  it("takes the longest 1-2-5 length that fits", () => {
    expect(scaleBarKm(2.4)).toBe(2);
    expect(scaleBarKm(0.7)).toBe(0.5);
    expect(scaleBarKm(10)).toBe(10);
    expect(scaleBarKm(19.9)).toBe(10);
  });
});

describe("compactAmount", () => {
  it("shortens axis amounts", () => {
    expect(compactAmount(2_500_000)).toBe("2.5M");
    expect(compactAmount(750_000)).toBe("750k");
    expect(compactAmount(0)).toBe("0");
    expect(compactAmount(1_200_000_000)).toBe("1.2bn");
  });
});
