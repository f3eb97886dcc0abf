import { writeFileSync } from "node:fs";
import { loadCatalogue } from "../src/io/loadCatalogue.js";
import { evaluationDemoYaml } from "./evaluationDemo.js";

// Regenerates scenarios/vellmar-built-projects.yaml: `npm run build && node dist/scripts/makeEvaluationDemo.js` from the project folder.
const file = "scenarios/vellmar-built-projects.yaml";
writeFileSync(file, evaluationDemoYaml(loadCatalogue("catalogs/demo-catalogue.yaml").catalogue));
process.stdout.write(`wrote ${file}\n`);
