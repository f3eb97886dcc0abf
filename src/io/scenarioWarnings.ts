import { sumCrashMatrix } from "../model/crashMatrix.js";
import { empiricalBayesGap, MIN_RECOMMENDED_WINDOW_YEARS, windowYears } from "../model/siteBaselines.js";
import { assumedCmfCv } from "../model/sampleTreatmentCmfs.js";
import type { Scenario } from "../model/types.js";
import type { InputProblem } from "./InputError.js";
import type { LoadedCatalogue } from "./loadCatalogue.js";
import type { RawScenario } from "./loadScenario.js";
import type { YamlSource } from "./readYamlFile.js";

/** Things that are allowed but deserve a second look before the list goes to finance. */
export function scenarioWarnings(
  scenario: Scenario,
  raw: RawScenario,
  source: YamlSource,
  catalogues: readonly LoadedCatalogue[],
): InputProblem[] {
  const warnings: InputProblem[] = [];
  const years = windowYears(scenario);
  if (years < MIN_RECOMMENDED_WINDOW_YEARS) {
    warnings.push({
      code: "short-window",
      file: source.file,
      ...source.positionOf(["crashWindow"]),
      path: "crashWindow",
      message: `the crash window covers ${years} year(s); common practice is 3 to 5 years`,
      hint: "short windows overstate sites with a chance bad year (regression to the mean)",
    });
  }
  const used = new Set(scenario.sites.flatMap((site) => site.candidates));
  for (const loaded of catalogues) {
    loaded.catalogue.treatments.forEach((treatment, index) => {
      if (!used.has(treatment.id)) return;
      treatment.effects.forEach((effect, effectIndex) => {
        const at = { file: loaded.source.file, ...loaded.source.positionOf(["treatments", index, "effects", effectIndex, "cmf"]), path: `treatments[${index}].effects[${effectIndex}].cmf` };
        if (effect.cmf > 1) {
          warnings.push({ code: "cmf-above-one", ...at, message: `'${treatment.id}' has CMF ${effect.cmf} > 1: it is expected to increase these crashes`, hint: "intended for a trade-off treatment; otherwise check the value" });
        }
        if (effect.standardError === undefined) {
          warnings.push({ code: "missing-standard-error", ...at, message: `'${treatment.id}' has no standard error for its CMF ${effect.cmf}`, hint: uncertaintyHint(scenario) });
        }
      });
    });
  }
  raw.sites.forEach((site, index) => {
    if (sumCrashMatrix(scenario.sites[index]!.crashes) === 0) {
      warnings.push({ code: "no-crashes", file: source.file, ...source.positionOf(["sites", index, "crashes"]), path: `sites[${index}].crashes`, message: `site '${site.id}' has no recorded crashes, so no treatment there can avoid any`, hint: "check the crash assignment, or use an Empirical Bayes baseline" });
    }
  });
  if (scenario.baseline === "empirical-bayes") {
    const performanceFunctions = new Map(scenario.catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
    scenario.sites.forEach((site, index) => {
      const gap = empiricalBayesGap(site, site.performanceFunction === undefined ? undefined : performanceFunctions.get(site.performanceFunction));
      if (gap !== undefined) {
        warnings.push({ code: "eb-fallback", file: source.file, ...source.positionOf(["sites", index]), path: `sites[${index}]`, message: `site '${site.id}' will use its observed counts, not Empirical Bayes: ${gap}`, hint: "give the site aadt and a performanceFunction that applies to its kind (and lengthKm for a segment)" });
      }
    });
  }
  return warnings;
}

// What the uncertainty draws will do with a CMF that has no standard error.
function uncertaintyHint(scenario: Scenario): string {
  const cv = assumedCmfCv(scenario);
  return cv === "off" || cv === 0
    ? "uncertainty analysis will hold this CMF exact (uncertainty.assumedCmfCv: off); give its published standard error if there is one"
    : `uncertainty analysis will draw it with an assumed standard error of ${cv} × CMF (uncertainty.assumedCmfCv); give its published standard error if there is one`;
}
