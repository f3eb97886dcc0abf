import { describe, expect, it } from "vitest";
import { parseCsv } from "../report/parseCsv.js";
import { CSV_PREAMBLE_LINES, csvPreamble } from "../../src/report/csvPreamble.js";
import { runCaptured } from "./captureIo.js";

const DEMO = "scenarios/demo.yaml";

/** Splits an averta CSV into its preamble lines, column header and data rows, parsed as RFC 4180. */
function readAvertaCsv(text: string): { preamble: string[]; header: string[]; rows: string[][] } {
  const records = parseCsv(text);
  return { preamble: records.slice(0, CSV_PREAMBLE_LINES).map((record) => record.join(",")), header: records[CSV_PREAMBLE_LINES]!, rows: records.slice(CSV_PREAMBLE_LINES + 1) };
}

describe("every averta CSV opens with two preamble lines a reader can skip", () => {
  it("keeps each preamble line one CSV field on one physical line, whatever the scenario name holds", () => {
    const text = csvPreamble(['plan of scenario A, "B"\r\nC\u001b[31m'], ["money in USD"]);
    const lines = text.split("\r\n");
    expect(lines).toHaveLength(3); // two lines and the final line end
    const records = parseCsv(text);
    expect(records.map((record) => record.length)).toEqual([1, 1]);
    expect(records[0]![0]).toBe('# averta | plan of scenario A, "B" C [31m');
    expect(records[1]![0]).toBe("# units | money in USD");
  });

  it("compare --format csv lists each site that enters, leaves or changes, with both sides in the preamble", async () => {
    const [csv, json] = await Promise.all([
      runCaptured(["compare", DEMO, "--budget", "5M", "--budget", "9.7M", "--format", "csv"]),
      runCaptured(["compare", DEMO, "--budget", "5M", "--budget", "9.7M", "--format", "json"]),
    ]);
    expect(csv.code).toBe(0);
    const comparison = JSON.parse(json.stdout) as { entering: { site: string; cost: number }[]; leaving: { site: string }[]; changedTreatment: { site: string }[]; totalsA: { projects: number } };
    const { preamble, header, rows } = readAvertaCsv(csv.stdout);
    expect(preamble[0]).toContain(`A: budget 5,000,000, optimal, ${comparison.totalsA.projects} projects`);
    expect(header).toEqual(["site_id", "site_name", "change", "treatments_a", "treatments_b", "cost_a_USD", "cost_b_USD", "ksi_avoided_a", "ksi_avoided_b"]);
    expect(rows).toHaveLength(comparison.entering.length + comparison.leaving.length + comparison.changedTreatment.length);
    const entering = rows.filter((row) => row[2] === "enters");
    expect(entering.map((row) => row[0])).toEqual(comparison.entering.map((project) => project.site));
    expect(entering.map((row) => Number(row[6]))).toEqual(comparison.entering.map((project) => project.cost));
    expect(entering.every((row) => row[5] === "" && row[3] === "")).toBe(true);
  });

  it("uncertainty --format csv gives the selection probabilities of the JSON, same seed, same numbers", async () => {
    const args = ["uncertainty", DEMO, "--draws", "20", "--threads", "1", "--seed", "7"];
    const [csv, json] = await Promise.all([runCaptured([...args, "--format", "csv"]), runCaptured([...args, "--format", "json"])]);
    expect(csv.code).toBe(0);
    const parsed = JSON.parse(json.stdout) as { selections: { site: string; treatments: string[]; probability: number; inPlan: boolean; class: string }[]; shakyProjects: { site: string }[]; method: { effectsUncertain: string } };
    const { preamble, header, rows } = readAvertaCsv(csv.stdout);
    expect(preamble[0]).toContain("20 draws");
    expect(preamble[0]).toContain(parsed.method.effectsUncertain);
    expect(header).toEqual(["site_id", "treatments", "probability", "class", "in_plan", "shaky"]);
    expect(rows.map((row) => [row[0], row[1], Number(row[2]), row[3], row[4]])).toEqual(parsed.selections.map((s) => [s.site, s.treatments.join(" + "), s.probability, s.class, s.inPlan ? "yes" : "no"]));
    const shaky = new Set(parsed.shakyProjects.map((project) => project.site));
    expect(rows.filter((row) => row[5] === "yes").every((row) => shaky.has(row[0]!))).toBe(true);
  });

  it("frontier and screen CSVs carry the same preamble", async () => {
    for (const argv of [["frontier", DEMO, "--steps", "3", "--format", "csv"], ["screen", DEMO, "--format", "csv"]]) {
      const { code, stdout } = await runCaptured(argv);
      expect(code).toBe(0);
      const { preamble, header } = readAvertaCsv(stdout);
      expect(preamble[0]).toMatch(/^# averta \| (budget frontier|screening) of scenario Vellmar/);
      expect(preamble[1]).toMatch(/^# units \| /);
      expect(header[0]).toMatch(/^(budget_USD|excess_rank)$/);
    }
  });
});
