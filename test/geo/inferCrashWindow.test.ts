import { describe, expect, it } from "vitest";
import { FULL_YEAR_SHARE, inferCrashWindow, MIN_WINDOW_ROW_SHARE } from "../../src/geo/inferCrashWindow.js";
import type { NetworkSite } from "../../src/geo/NetworkSite.js";
import { tallyNetwork } from "../../src/geo/tallyNetwork.js";
import { DEFAULT_CRASH_MAPPING } from "../../src/io/CrashMapping.js";
import { parseCrashCsv } from "../../src/io/parseCrashCsv.js";

/** Records with `rows[year]` crashes in each year. */
const years = (rows: Record<number, number>) => Object.entries(rows).flatMap(([year, count]) => Array.from({ length: count }, () => ({ year: Number(year) })));

describe("the crash window taken from the data", () => {
  it("is the latest run of full years: a stray old row does not widen it", () => {
    const inference = inferCrashWindow(years({ 2019: 1, 2021: 60, 2022: 55, 2023: 70, 2024: 58, 2025: 62 }))!;
    expect(inference.window).toEqual({ firstYear: 2021, lastYear: 2025 });
    expect(inference.leftOut).toEqual([{ year: 2019, rows: 1 }]);
    expect(inference.leftOutRows).toBe(1);
    expect(inference.medianYearRows).toBe(59); // median of 1, 55, 58, 60, 62, 70
    expect(inference.clear).toBe(true);
  });
  it("leaves out a year just begun and keeps a quiet year over half the median", () => {
    expect(FULL_YEAR_SHARE).toBe(0.5);
    const inference = inferCrashWindow(years({ 2021: 100, 2022: 52, 2023: 100, 2024: 100, 2025: 100, 2026: 12 }))!;
    expect(inference.window).toEqual({ firstYear: 2021, lastYear: 2025 });
    expect(inference.leftOut).toEqual([{ year: 2026, rows: 12 }]);
  });
  it("ends the run at a gap: an empty year is not full", () => {
    expect(inferCrashWindow(years({ 2016: 50, 2017: 50, 2019: 50, 2020: 50, 2021: 50 }))!.window).toEqual({ firstYear: 2019, lastYear: 2021 });
  });
  it("is not clear when the latest run holds under 90 % of the rows", () => {
    expect(MIN_WINDOW_ROW_SHARE).toBe(0.9);
    const inference = inferCrashWindow(years({ 2015: 50, 2016: 50, 2017: 50, 2024: 50, 2025: 50 }))!;
    expect(inference.window).toEqual({ firstYear: 2024, lastYear: 2025 });
    expect(inference.windowShare).toBeCloseTo(0.4, 12);
    expect(inference.clear).toBe(false);
  });
  it("is undefined without records", () => {
    expect(inferCrashWindow([])).toBeUndefined();
  });
  it("reaches tally: rows left out are rejected as outside the window, with their lines", () => {
    const site: NetworkSite = { id: "I-1", name: "I-1", kind: "intersection", district: "North", tags: [], candidates: [], paths: [[{ lon: 10.4, lat: 55.4 }]] };
    const lines = ["id,date,latitude,longitude,severity,type", "old,2014-06-01,55.4,10.4,K,angle"];
    for (let year = 2021; year <= 2025; year++) for (let k = 0; k < 4; k++) lines.push(`c${year}-${k},${year}-0${k + 1}-15,55.4,10.4,B,angle`);
    const rows = parseCrashCsv(lines.join("\r\n"), DEFAULT_CRASH_MAPPING, "c.csv");
    const { quality } = tallyNetwork([site], rows, undefined);
    expect(quality.window).toEqual({ firstYear: 2021, lastYear: 2025 });
    expect(quality.windowInference?.leftOut).toEqual([{ year: 2014, rows: 1 }]);
    expect(quality.rejected).toMatchObject([{ line: 2, reason: "outside-window" }]);
    expect(quality.assigned).toBe(20);
    // A given window is used as given.
    expect(tallyNetwork([site], rows, { firstYear: 2014, lastYear: 2025 }).quality).toMatchObject({ window: { firstYear: 2014, lastYear: 2025 }, assigned: 21 });
  });
});
