import { mkdirSync, readFileSync, writeFileSync } from "node:fs";
import { join, resolve } from "node:path";
import { loadScenario } from "../src/io/loadScenario.js";
import { sitesJsonForm } from "../src/report/sitesJsonForm.js";
import { sitesYaml } from "../src/report/sitesYaml.js";
import { generatedCityScenario } from "./generatedCityScenario.js";

/**
 * Writes a large invented scenario as files, as a user would have it: `scenario.yaml` (the demo's
 * header, economics and settings, no policy rules, the budget scaled) and `sites.yaml` with
 * `siteCount` generated sites (each with its own AADT unless `varyTraffic` is false), in block YAML or in YAML's JSON form (as `tally --json-form`
 * writes it), in `folder`. Returns the scenario's path. Deterministic.
 */
export function writeLargeScenario(folder: string, siteCount: number, form: "yaml" | "json" = "yaml", seed = 1, varyTraffic = true): string {
  mkdirSync(folder, { recursive: true });
  const demoFile = "scenarios/demo.yaml";
  const { scenario } = loadScenario(demoFile);
  const generated = generatedCityScenario(scenario, siteCount, seed, varyTraffic);
  writeFileSync(join(folder, "sites.yaml"), (form === "json" ? sitesJsonForm : sitesYaml)(generated.sites, scenario.crashWindow, `${siteCount} generated sites for the benchmark`));
  const header = readFileSync(demoFile, "utf8").split("\nrules:")[0]!;
  const text = header
    .replace(/^catalogues: .*$/m, `catalogues: [${JSON.stringify(resolve("catalogs/demo-catalogue.yaml"))}]`)
    .replace(/^budget: .*$/m, `budget: ${Math.round(generated.budget)}`)
    .replace(/^name: .*$/m, `name: ${JSON.stringify(generated.name)}`);
  const file = join(folder, "scenario.yaml");
  writeFileSync(file, `${text}\nsites: sites.yaml\n`);
  return file;
}
