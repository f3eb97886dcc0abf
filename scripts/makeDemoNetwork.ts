import { writeFileSync } from "node:fs";
import { join } from "node:path";
import { loadScenario } from "../src/io/loadScenario.js";
import { DEMO_NETWORK_SEED, demoNetwork } from "./demoNetwork.js";

// Regenerates scenarios/vellmar-crashes.csv and scenarios/vellmar-sites.geojson from the demo
// scenario: `npm run build && node dist/scripts/makeDemoNetwork.js` from the project folder.
const folder = "scenarios";
const { scenario } = loadScenario(join(folder, "demo.yaml"));
const network = demoNetwork(scenario, DEMO_NETWORK_SEED);
writeFileSync(join(folder, "vellmar-crashes.csv"), network.crashesCsv);
writeFileSync(join(folder, "vellmar-sites.geojson"), network.sitesGeojson);
process.stdout.write(`wrote ${folder}/vellmar-crashes.csv and ${folder}/vellmar-sites.geojson\n`);
