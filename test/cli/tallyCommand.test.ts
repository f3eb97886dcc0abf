import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join } from "node:path";
import { describe, expect, it } from "vitest";
import { parse } from "yaml";
import { DEMO_NETWORK_SEED, demoNetwork } from "../../scripts/demoNetwork.js";
import type { CliIo } from "../../src/cli/CliIo.js";
import { runCli } from "../../src/cli/runCli.js";
import { loadScenario } from "../../src/io/loadScenario.js";
import { CRASH_TYPES, SEVERITIES } from "../../src/model/types.js";

function capture(): CliIo & { out: string[]; err: string[] } {
  const out: string[] = [];
  const err: string[] = [];
  return { out, err, stdout: (t) => out.push(t), stderr: (t) => err.push(t), stderrIsTty: false };
}
const crashes = "scenarios/vellmar-crashes.csv";
const sites = "scenarios/vellmar-sites.geojson";

describe("averta tally on the demo network", () => {
  const folder = mkdtempSync(join(tmpdir(), "averta-tally-"));
  const out = join(folder, "sites.yaml");
  it("rebuilds every demo site's crash counts from the crash file and site map", async () => {
    const io = capture();
    expect(await runCli(["tally", "--crashes", crashes, "--sites", sites, "--window", "2021-2025", "--out", out], io)).toBe(0);
    const written = parse(readFileSync(out, "utf8")) as { crashWindow: unknown; sites: { id: string; crashes: Record<string, Record<string, number>>; lengthKm?: number }[] };
    const { scenario } = loadScenario("scenarios/demo.yaml");
    expect(written.crashWindow).toEqual({ firstYear: 2021, lastYear: 2025 });
    expect(written.sites.map((s) => s.id)).toEqual(scenario.sites.map((s) => s.id));
    let cells = 0;
    scenario.sites.forEach((site, index) => {
      for (const type of CRASH_TYPES)
        for (const severity of SEVERITIES) {
          expect(written.sites[index]!.crashes[type]?.[severity] ?? 0).toBe(site.crashes[type][severity]);
          cells++;
        }
      // The generated line has the scenario's length (geodesic, to the metre).
      if (site.lengthKm !== undefined) expect(written.sites[index]!.lengthKm).toBeCloseTo(site.lengthKm, 2);
    });
    expect(cells).toBe(51 * 40);
    const report = readFileSync(`${out}.quality.txt`, "utf8");
    expect(report).toMatch(/1505 assigned \+ 1 unassigned \+ 5 rejected = 1511 of 1511 rows read/);
    expect(io.err.join("")).toMatch(/line 1507: missing-coordinates/);
  });
  it("writes a sites block that makes a valid scenario with the demo's settings", () => {
    const demo = readFileSync("scenarios/demo.yaml", "utf8");
    const settings = demo
      .slice(0, demo.indexOf("\nsites:\n") + 1)
      .replace(/^crashWindow:.*\n/m, "")
      .replace("../catalogs/demo-catalogue.yaml", join(process.cwd(), "catalogs/demo-catalogue.yaml"));
    const file = join(folder, "rebuilt.yaml");
    writeFileSync(file, settings + readFileSync(out, "utf8"));
    const { scenario } = loadScenario(file);
    expect(scenario.sites).toHaveLength(51);
    expect(scenario.crashWindow).toEqual({ firstYear: 2021, lastYear: 2025 });
  });
  it("refuses to overwrite either output without --force, and replaces both with it", async () => {
    const io = capture();
    expect(await runCli(["tally", "--crashes", crashes, "--sites", sites, "--out", out], io)).toBe(2);
    expect(io.err.join("")).toMatch(/already exists/);
    const forced = capture();
    expect(await runCli(["tally", "--crashes", crashes, "--sites", sites, "--out", out, "--force"], forced)).toBe(0);
    // Without --window the years come from the data (a stray old row widens them): the user is told.
    expect(forced.err.join("")).toMatch(/note: the window \d{4}-\d{4} \(\d+ years\) was taken from the data; pass --window/);
  });
  it("warns when the window is under three years (common practice: 3 to 5)", async () => {
    const io = capture();
    expect(await runCli(["tally", "--crashes", crashes, "--sites", sites, "--window", "2024-2025", "--out", join(folder, "short.yaml")], io)).toBe(0);
    expect(io.err.join("")).toMatch(/warning: the window covers 2 year/);
    expect(io.err.join("")).not.toMatch(/was taken from the data/);
  });
  it("gives exit code 2 and a located message for a bad site map, writing nothing", async () => {
    const bad = join(folder, "bad.geojson");
    writeFileSync(bad, '{\n  "type": "FeatureCollection",\n  "features": [\n    { "type": "Feature", "properties": { "id": "X-1" }, "geometry": { "type": "Point", "coordinates": [10.4, 55.4] } }\n  ]\n}\n');
    const io = capture();
    expect(await runCli(["tally", "--crashes", crashes, "--sites", bad, "--out", join(folder, "never.yaml")], io)).toBe(2);
    expect(io.err.join("")).toMatch(/bad\.geojson:4:\d+: features\[0\]\.properties.*district/);
    expect(existsSync(join(folder, "never.yaml"))).toBe(false);
  });
  it("refuses, writing nothing, when swapped coordinate columns leave every crash off the network", async () => {
    const mapping = join(folder, "swapped.yaml");
    writeFileSync(mapping, "columns: { latitude: longitude, longitude: latitude }\n");
    const target = join(folder, "swapped-sites.yaml");
    const io = capture();
    expect(await runCli(["tally", "--crashes", crashes, "--sites", sites, "--window", "2021-2025", "--mapping", mapping, "--out", target], io)).toBe(2);
    expect(io.err.join("")).toMatch(/error: scenarios\/vellmar-crashes\.csv: none of the 1511 crash rows was assigned to a site/);
    expect(existsSync(target)).toBe(false);
    expect(existsSync(`${target}.quality.txt`)).toBe(false);
  });
  it("refuses, writing nothing, when --window misses every crash", async () => {
    const target = join(folder, "empty-window.yaml");
    const io = capture();
    expect(await runCli(["tally", "--crashes", crashes, "--sites", sites, "--window", "2030-2031", "--out", target], io)).toBe(2);
    expect(io.err.join("")).toMatch(/outside-window/);
    expect(existsSync(target)).toBe(false);
  });
  it("rejects a malformed --window", async () => {
    const io = capture();
    expect(await runCli(["tally", "--crashes", crashes, "--sites", sites, "--window", "2025-2021"], io)).toBe(2);
  });
});

describe("the committed demo network files", () => {
  it("are exactly what the seeded generator writes", () => {
    const { scenario } = loadScenario("scenarios/demo.yaml");
    const network = demoNetwork(scenario, DEMO_NETWORK_SEED);
    expect(readFileSync(crashes, "utf8")).toBe(network.crashesCsv);
    expect(readFileSync(sites, "utf8")).toBe(network.sitesGeojson);
  });
});
