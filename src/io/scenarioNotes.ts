import type { InputProblem } from "./InputError.js";
import type { RawScenario } from "./loadScenario.js";
import { candidatesPath } from "./loadScenarioSites.js";
import { formatFieldPath } from "./fieldPath.js";
import type { YamlSource } from "./readYamlFile.js";

/**
 * Facts about a valid scenario that need no fixing but should be told, each located in the file
 * that holds it: today, the sites with no candidate treatments (screened and counted, never
 * funded), pointing at their candidate list, or at the site when it has none written.
 */
export function scenarioNotes(raw: RawScenario, source: YamlSource, sitesSource: YamlSource): InputProblem[] {
  const notes: InputProblem[] = [];
  raw.sites.forEach((site, index) => {
    if (site.candidates.length > 0) return;
    const path = candidatesPath(raw, index);
    const at = path[0] === "sites" ? sitesSource : source;
    notes.push({
      code: "no-candidates",
      file: at.file,
      ...at.positionOf(path),
      path: formatFieldPath(path),
      message: `site '${site.id}' has no candidate treatments: it is screened and counted but cannot be funded`,
      hint: "list treatment ids in its candidates or under siteCandidates in the scenario; averta init suggests some",
    });
  });
  return notes;
}
