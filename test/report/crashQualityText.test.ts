import { describe, expect, it } from "vitest";
import { REJECT_REASONS, type RejectReason } from "../../src/geo/CrashRecord.js";
import type { CrashDataQuality } from "../../src/geo/tallyNetwork.js";
import { crashQualityText } from "../../src/report/crashQualityText.js";

const rejected = Array.from({ length: 30 }, (_, index) => ({ line: index + 2, reason: "invalid-date" as RejectReason, message: "bad date" }));
const byReason = Object.fromEntries(REJECT_REASONS.map((reason) => [reason, reason === "invalid-date" ? 30 : 0])) as Record<RejectReason, number>;
const quality: CrashDataQuality = {
  window: { firstYear: 2020, lastYear: 2024 },
  rowsRead: 40,
  assigned: 10,
  unassigned: 0,
  rejected,
  rejectedByReason: byReason,
  outsideExtent: 0,
  unassignedLines: [],
  districts: [],
  yearsBySite: [],
};
const inputs = { crashes: "crashes.csv", sites: "sites.geojson" };

describe("crashQualityText's capped lists point only at a report that exists", () => {
  it("names the saved report when one was written", () => {
    const text = crashQualityText(quality, inputs, 20, "out.yaml.quality.txt");
    expect(text).toContain("… and 10 more (all are listed in out.yaml.quality.txt)");
  });
  it("says nothing was saved when nothing was written", () => {
    const text = crashQualityText(quality, inputs, 20);
    expect(text).toContain("… and 10 more (nothing was saved");
    expect(text).not.toContain("listed in");
  });
  it("lists every rejected row, uncapped, in the saved report itself", () => {
    expect(crashQualityText(quality, inputs).match(/line \d+: invalid-date/g)).toHaveLength(30);
  });
});
