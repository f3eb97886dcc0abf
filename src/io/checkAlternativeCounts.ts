import { countAlternatives, MAX_ALTERNATIVES_PER_SITE, MAX_ALTERNATIVES_TOTAL } from "../model/countAlternatives.js";
import type { Scenario } from "../model/types.js";
import { formatFieldPath } from "./fieldPath.js";
import type { InputProblem } from "./InputError.js";
import type { RawScenario } from "./loadScenario.js";
import { candidatesPath } from "./loadScenarioSites.js";
import type { PathSegment, YamlSource } from "./readYamlFile.js";

/**
 * Refuses a scenario whose sites would have more alternatives than averta builds
 * (MAX_ALTERNATIVES_PER_SITE at one site, MAX_ALTERNATIVES_TOTAL in all), each problem at the
 * site's candidate list. The alternatives are counted arithmetically (countAlternatives), so the
 * check costs nothing however many candidates a site lists.
 */
export function checkAlternativeCounts(scenario: Scenario, raw: RawScenario, source: YamlSource, sitesSource: YamlSource): InputProblem[] {
  const counts = countAlternatives(scenario);
  const at = (path: PathSegment[]) => {
    const file = path[0] === "sites" ? sitesSource : source;
    return { file: file.file, ...file.positionOf(path), path: formatFieldPath(path) };
  };
  const limit = scenario.maxTreatmentsPerSite;
  const problems: InputProblem[] = [];
  counts.forEach((count, index) => {
    if (count <= MAX_ALTERNATIVES_PER_SITE) return;
    const site = scenario.sites[index]!;
    problems.push({
      code: "too-many-alternatives",
      ...at(candidatesPath(raw, index)),
      message: `site '${site.id}' would have ${grouped(count)} alternatives (combinations of its ${site.candidates.length} candidates with up to ${limit} treatments each${scenario.programme === undefined ? "" : ", in each of its build years"}), more than the limit of ${grouped(MAX_ALTERNATIVES_PER_SITE)}`,
      hint: "list fewer candidates at this site, lower maxTreatmentsPerSite, or give treatments that are never combined one exclusiveGroup",
    });
  });
  const total = counts.reduce((sum, count) => sum + count, 0);
  if (problems.length === 0 && total > MAX_ALTERNATIVES_TOTAL) {
    problems.push({
      code: "too-many-alternatives",
      file: source.file,
      ...source.positionOf(["sites"], true),
      path: "sites",
      message: `the ${grouped(scenario.sites.length)} sites would have ${grouped(total)} alternatives in all, more than the limit of ${grouped(MAX_ALTERNATIVES_TOTAL)}`,
      hint: "lower maxTreatmentsPerSite, list fewer candidates per site, or split the programme into smaller scenarios",
    });
  }
  return problems;
}

// Thousands separated by commas, the same on every machine.
function grouped(n: number): string {
  return String(n).replace(/\B(?=(\d{3})+(?!\d))/g, ",");
}
