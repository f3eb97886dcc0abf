// Crashes counted into a site's before and after periods by day: the boundaries are inclusive,
// crashes off the site's reach or outside every period do not count, and a repeated id counts once.
import { describe, expect, it } from "vitest";
import type { CrashRecord } from "../../src/geo/CrashRecord.js";
import type { NetworkSite } from "../../src/geo/NetworkSite.js";
import { periodCrashCounts } from "../../src/geo/periodCrashCounts.js";
import { sumCrashMatrix } from "../../src/model/crashMatrix.js";

const junction: NetworkSite = { id: "J-1", name: "J", kind: "intersection", district: "d", tags: [], candidates: [], paths: [[{ lon: 10, lat: 55 }]] };
const far: NetworkSite = { ...junction, id: "J-2", paths: [[{ lon: 10.1, lat: 55 }]] };

function crash(id: string, date: string, lon = 10): CrashRecord {
  return { line: 2, id, year: Number(date.slice(0, 4)), date, severity: "A", type: "angle", location: { lon, lat: 55 } };
}

describe("periodCrashCounts", () => {
  it("counts each crash in the periods of its site that contain its day, boundaries included", () => {
    const records = [crash("a", "2016-01-01"), crash("b", "2019-12-31"), crash("c", "2020-05-01"), crash("d", "2021-01-01"), crash("e", "2023-12-31"), crash("f", "2024-01-01"), crash("b", "2022-06-01"), crash("g", "2022-06-01", 10.1)];
    const [before, after, other] = periodCrashCounts([junction, far], records, [
      { site: "J-1", from: "2016-01-01", to: "2019-12-31" },
      { site: "J-1", from: "2021-01-01", to: "2023-12-31" },
      { site: "J-2", from: "2021-01-01", to: "2023-12-31" },
    ]);
    expect(sumCrashMatrix(before!)).toBe(2); // a and b; c falls in the works year
    expect(sumCrashMatrix(after!)).toBe(2); // d and e; the second row of id b is a repeat, f is after the period
    expect(after!.angle.A).toBe(2);
    expect(sumCrashMatrix(other!)).toBe(1); // g, 6 km east, belongs to J-2 only
  });

  it("refuses a period at a site that is not on the map", () => {
    expect(() => periodCrashCounts([junction], [], [{ site: "X", from: "2016-01-01", to: "2016-12-31" }])).toThrow(RangeError);
  });
});
