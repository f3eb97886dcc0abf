import { existsSync, mkdtempSync, readFileSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import { join, resolve } from "node:path";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { parse } from "yaml";
import { loadScenario } from "../../src/io/loadScenario.js";
import { suggestCandidates } from "../../src/model/suggestCandidates.js";
import { SUGGESTION_MARK } from "../../src/report/initScenarioYaml.js";
import { runCaptured } from "./captureIo.js";

const scratch = mkdtempSync(join(tmpdir(), "averta-init-"));
afterAll(() => rmSync(scratch, { recursive: true, force: true }));

const CATALOGUE = resolve("catalogs/demo-catalogue.yaml");
const sitesFile = join(scratch, "vellmar-sites.yaml");
const at = (name: string) => join(scratch, name);
const init = (...extra: string[]) => runCaptured(["init", "--sites", sitesFile, "--catalogue", CATALOGUE, "--budget", "9.7M", ...extra]);

beforeAll(async () => {
  const tally = await runCaptured(["tally", "--crashes", "scenarios/vellmar-crashes.csv", "--sites", "scenarios/vellmar-sites.geojson", "--window", "2021-2025", "--out", sitesFile]);
  expect(tally.code).toBe(0);
});

describe("averta init", () => {
  it("writes a scenario that check accepts, referring to the sites file, with the demo's economics and their sources", async () => {
    const out = at("plain.yaml");
    const run = await init("--out", out, "--name", "Vellmar 2027");
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toMatch(/wrote .*plain\.yaml: 51 sites/);
    expect(run.stderr).toMatch(/51 site\(s\) keep the candidates their sites file lists/);
    const check = await runCaptured(["check", out]);
    expect(check.code, check.stderr).toBe(0);
    expect(check.stdout).toMatch(/sites file {5}.*vellmar-sites\.yaml/);

    const text = readFileSync(out, "utf8");
    const written = parse(text) as Record<string, unknown>;
    expect(written.sites).toBe("vellmar-sites.yaml");
    expect(written.name).toBe("Vellmar 2027");
    expect(written.budget).toBe(9_700_000);
    expect(written.crashWindow).toBeUndefined(); // taken from the sites file, so a tally rewrite cannot contradict it
    expect(written.siteCandidates).toBeUndefined(); // every demo site lists candidates in the GeoJSON
    // The same discount rate, horizon, unit crash costs, source and price year as the bundled demo.
    const demo = parse(readFileSync("scenarios/demo.yaml", "utf8")) as { economics: unknown };
    expect(written.economics).toEqual(demo.economics);
    expect(text).toMatch(/# 4% a year real: .*\n#? ?.*common practice/);
    expect(written.baseline).toBe("auto");
    // The sites are the demo's: same ids, candidates and crash counts (tally rebuilds them exactly).
    const pick = (file: string) => loadScenario(file).scenario.sites.map((site) => ({ id: site.id, candidates: site.candidates, crashes: site.crashes }));
    expect(pick(out)).toEqual(pick("scenarios/demo.yaml"));
  });

  it("with --suggest-all writes each site's suggestions under siteCandidates, marked for review", async () => {
    const out = at("suggested.yaml");
    const run = await init("--out", out, "--suggest-all", "--max-suggestions", "2");
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toMatch(/suggested candidates for 51 site\(s\), up to 2 each/);
    const text = readFileSync(out, "utf8");
    const written = parse(text) as { siteCandidates: Record<string, string[]> };
    const entries = text.split("\n").filter((line) => /^ {2}"[^"]+": \[/.test(line));
    expect(entries).toHaveLength(Object.keys(written.siteCandidates).length);
    for (const line of entries) expect(line.endsWith(`# ${SUGGESTION_MARK}`)).toBe(true);
    // Each list is exactly the model's suggestion for the site, and the scenario plans with it.
    const plain = loadScenario(at("plain.yaml")).scenario;
    const loaded = loadScenario(out).scenario;
    plain.sites.forEach((site, index) => {
      expect(loaded.sites[index]!.candidates).toEqual(suggestCandidates(site, plain.catalogue.treatments, 2).map((s) => s.treatment));
    });
    expect((await runCaptured(["check", out])).code).toBe(0);
  });

  it("suggests for sites whose sites file lists none, and names those left without any", async () => {
    // An agency's own map: no candidates property, and one site with no crash near it.
    const map = JSON.parse(readFileSync("scenarios/vellmar-sites.geojson", "utf8")) as { features: { properties: Record<string, unknown>; geometry: { coordinates: unknown } }[] };
    for (const feature of map.features) delete feature.properties.candidates;
    map.features.push({ ...map.features[0]!, properties: { ...map.features[0]!.properties, id: "I-99", name: "Far Field Lane / Nowhere Road" }, geometry: { type: "Point", coordinates: [10.2, 55.2] } as never });
    writeFileSync(at("bare.geojson"), JSON.stringify(map));
    const bareSites = at("bare-sites.yaml");
    expect((await runCaptured(["tally", "--crashes", "scenarios/vellmar-crashes.csv", "--sites", at("bare.geojson"), "--window", "2021-2025", "--out", bareSites])).code).toBe(0);
    const out = at("bare.yaml");
    const run = await runCaptured(["init", "--sites", bareSites, "--catalogue", CATALOGUE, "--budget", "2M", "--out", out]);
    expect(run.code, run.stderr).toBe(0);
    expect(run.stderr).toMatch(/suggested candidates for 51 site\(s\)/);
    expect(run.stderr).toMatch(/1 site has no candidate treatments and cannot be funded: I-99\./);
    const comments = readFileSync(out, "utf8").replace(/\n# /g, " ");
    expect(comments).toMatch(/cannot be funded until an engineer lists some: I-99 \(no recorded crashes\)/);
    const check = await runCaptured(["check", out]);
    expect(check.code).toBe(0);
    expect(check.stderr).toMatch(/note: .*bare-sites\.yaml:\d+:\d+: sites\[51\]\.candidates: site 'I-99' has no candidate treatments/);
  });

  it("keeps one-line comments when a site's name holds a line break", async () => {
    const evil = readFileSync(sitesFile, "utf8").replace('name: "Market Street / Bridge Street"', 'name: "Market Street\\nsiteCandidates: { I-02: [road-diet] }"');
    expect(evil).not.toBe(readFileSync(sitesFile, "utf8"));
    const evilSites = at("evil-sites.yaml");
    writeFileSync(evilSites, evil);
    const out = at("evil.yaml");
    const run = await runCaptured(["init", "--sites", evilSites, "--catalogue", CATALOGUE, "--budget", "1M", "--suggest-all", "--out", out]);
    expect(run.code, run.stderr).toBe(0);
    expect(readFileSync(out, "utf8").split("\n").filter((line) => line.startsWith("siteCandidates"))).toEqual(["siteCandidates:"]);
  });

  it("says the crash costs are in dollars when another currency is asked for", async () => {
    const out = at("euro.yaml");
    const run = await init("--out", out, "--currency", "EUR");
    expect(run.code).toBe(0);
    expect(run.stderr).toMatch(/warning: the unit crash costs are in USD; replace them with unit costs in EUR/);
    expect(readFileSync(out, "utf8").replace(/\n {2}# /g, " ")).toMatch(/Unit cost of one crash by its most severe injury \(KABCO\), in USD: replace them with unit costs in EUR/);
  });

  it("never overwrites a file without --force, nor an input of the run even with it", async () => {
    const out = at("plain.yaml");
    const before = readFileSync(out, "utf8");
    const again = await init("--out", out);
    expect(again.code).toBe(2);
    expect(again.stderr).toMatch(/already exists and was left untouched/);
    expect(readFileSync(out, "utf8")).toBe(before);

    const sitesBefore = readFileSync(sitesFile, "utf8");
    const overSites = await init("--out", sitesFile, "--force");
    expect(overSites.code).toBe(2);
    expect(overSites.stderr).toMatch(/^error: --out: names the same file as --sites/m);
    expect(readFileSync(sitesFile, "utf8")).toBe(sitesBefore);
    const overCatalogue = await init("--out", CATALOGUE, "--force");
    expect(overCatalogue.code).toBe(2);
    expect(overCatalogue.stderr).toMatch(/names the same file as --catalogue/);
  });

  it("refuses bad inputs with exit 2, a located message and no output", async () => {
    const badSites = at("bad-sites.yaml");
    const text = readFileSync(sitesFile, "utf8").replace("kind: segment", "kind: segmnet");
    writeFileSync(badSites, text);
    const line = text.split("\n").findIndex((l) => l.includes("kind: segmnet")) + 1;
    const cases: [string[], RegExp][] = [
      [["--sites", badSites], new RegExp(`^error: .*bad-sites\\.yaml:${line}:11: sites\\[\\d+\\]\\.kind: 'segmnet' is not allowed`)],
      [["--sites", "scenarios/vellmar-sites.geojson"], /^error: scenarios\/vellmar-sites\.geojson: is a GeoJSON or JSON file, not a sites file \(run averta tally/],
      [["--sites", at("missing.yaml")], /^error: .*missing\.yaml: file not found/],
      [["--sites", sitesFile, "--currency", "usd"], /^error: --currency: 'usd' is not an ISO 4217 code/],
      [["--sites", sitesFile, "--budget", "4,5M"], /^error: --budget: '4,5M' is not an amount/],
      [["--sites", sitesFile, "--max-suggestions", "0"], /^error: --max-suggestions: '0' is not a whole number/],
      [["--sites", sitesFile, "--name", " "], /^error: --name: is empty/],
    ];
    for (const [options, message] of cases) {
      const out = at("never.yaml");
      const run = await runCaptured(["init", "--catalogue", CATALOGUE, "--budget", "1M", ...options, "--out", out]);
      expect(run.code, options.join(" ")).toBe(2);
      expect(run.stderr, options.join(" ")).toMatch(message);
      expect(run.stderr).not.toMatch(/^\s+at /m);
      expect(existsSync(out)).toBe(false);
    }
    // A scenario passed where the sites file belongs: the unknown fields are named, in that file.
    const asScenario = await runCaptured(["init", "--sites", "scenarios/demo.yaml", "--catalogue", CATALOGUE, "--budget", "1M", "--out", at("never.yaml")]);
    expect(asScenario.code).toBe(2);
    expect(asScenario.stderr).toMatch(/^error: scenarios\/demo\.yaml:\d+:\d+: name: unknown field 'name'/m);
  });
});
