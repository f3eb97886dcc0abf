import { sumCrashMatrix } from "../model/crashMatrix.js";
import { MIN_CALIBRATION_CRASHES, MIN_CALIBRATION_SITES } from "../model/estimateCalibrationFactor.js";
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
  sitesSource: YamlSource = source,
): InputProblem[] {
  const warnings: InputProblem[] = [];
  const years = windowYears(scenario);
  if (scenario.programme !== undefined && scenario.economics.renewal === "none") {
    // Without renewal a later build acts as many years, only later: waiting costs no K+A unless its life runs past the horizon.
    warnings.push({
      code: "programme-without-renewal",
      file: source.file,
      ...source.positionOf(["programme"], true),
      path: "programme",
      message: "in a programme with renewal none, a treatment whose service life ends inside the horizon avoids as many K+A crashes built late as built early, so the optimiser may put the best sites last",
      hint: "set economics.renewal: renew (or residual-value) so that the years a project waits are lost",
    });
  }
  if (years < MIN_RECOMMENDED_WINDOW_YEARS) {
    // The window is written in the scenario, or else in its sites file.
    const windowSource = (source.data as { crashWindow?: unknown }).crashWindow === undefined ? sitesSource : source;
    warnings.push({
      code: "short-window",
      file: windowSource.file,
      ...windowSource.positionOf(["crashWindow"]),
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
      warnings.push({ code: "no-crashes", file: sitesSource.file, ...sitesSource.positionOf(["sites", index, "crashes"]), path: `sites[${index}].crashes`, message: `site '${site.id}' has no recorded crashes, so no treatment there can avoid any`, hint: "check the crash assignment, or use an Empirical Bayes baseline" });
    }
  });
  if (scenario.baseline === "empirical-bayes") {
    const performanceFunctions = new Map(scenario.catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
    scenario.sites.forEach((site, index) => {
      const gap = empiricalBayesGap(site, site.performanceFunction === undefined ? undefined : performanceFunctions.get(site.performanceFunction));
      if (gap !== undefined) {
        warnings.push({ code: "eb-fallback", file: sitesSource.file, ...sitesSource.positionOf(["sites", index]), path: `sites[${index}]`, message: `site '${site.id}' will use its observed counts, not Empirical Bayes: ${gap}`, hint: "give the site aadt and a performanceFunction that applies to its kind (and lengthKm for a segment)" });
      }
    });
  }
  warnings.push(...regressionToMeanWarnings(scenario, source), ...priceYearWarnings(scenario, raw, source), ...calibrationWarnings(scenario, source));
  return warnings;
}

/** Price years more than this far apart, with no escalation, deserve a warning. */
export const MAX_UNESCALATED_PRICE_YEARS = 2;

/**
 * Sites with candidates whose baseline is their own observed counts. Candidate sites are usually
 * flagged because their recent counts were high, and such counts overstate what comes next
 * (regression to the mean; Hauer 1997, Observational Before-After Studies in Road Safety, ch. 5).
 */
function regressionToMeanWarnings(scenario: Scenario, source: YamlSource): InputProblem[] {
  const performanceFunctions = new Map(scenario.catalogue.performanceFunctions.map((spf) => [spf.id, spf]));
  const observed = scenario.sites.filter(
    (site) =>
      site.candidates.length > 0 &&
      (scenario.baseline === "observed" || empiricalBayesGap(site, site.performanceFunction === undefined ? undefined : performanceFunctions.get(site.performanceFunction)) !== undefined),
  );
  if (observed.length === 0) return [];
  const candidates = scenario.sites.filter((site) => site.candidates.length > 0).length;
  const ids = observed.slice(0, 8).map((site) => site.id).join(", ") + (observed.length > 8 ? ", …" : "");
  return [
    {
      code: "regression-to-mean",
      file: source.file,
      ...source.positionOf(scenario.baseline === "observed" ? ["baseline"] : ["sites"], true),
      path: scenario.baseline === "observed" ? "baseline" : "sites",
      message: `${observed.length} of ${candidates} candidate site(s) use their observed crash counts as the baseline (${ids}); sites picked for their high recent counts usually have fewer crashes next, so the K+A crashes avoided there are probably overstated (regression to the mean)`,
      hint:
        scenario.baseline === "observed"
          ? "use baseline: auto, and give sites aadt and a performanceFunction, so Empirical Bayes corrects for it"
          : "give these sites aadt and a performanceFunction (and lengthKm for segments) so Empirical Bayes corrects for it",
    },
  ];
}

/** Crash costs priced years away from the programme's money, with no escalation. */
function priceYearWarnings(scenario: Scenario, raw: RawScenario, source: YamlSource): InputProblem[] {
  const costs = scenario.economics.crashCosts;
  if (costs.priceYear === undefined || raw.economics.crashCosts.escalation !== undefined) return [];
  const stated = scenario.economics.priceYear;
  const programmeYear = stated ?? scenario.crashWindow.lastYear + 1;
  if (Math.abs(programmeYear - costs.priceYear) <= MAX_UNESCALATED_PRICE_YEARS) return [];
  const which = stated === undefined ? `the programme (taken as ${programmeYear}, the year after the crash window; set economics.priceYear)` : `the programme's ${programmeYear} prices`;
  return [
    {
      code: "price-year-gap",
      file: source.file,
      ...source.positionOf(["economics", "crashCosts", "priceYear"]),
      path: "economics.crashCosts.priceYear",
      message: `crash costs are in ${costs.priceYear} prices, ${Math.abs(programmeYear - costs.priceYear)} years from ${which}, and are not escalated, so every benefit-cost ratio mixes ${costs.priceYear} benefits with current capital costs`,
      hint: "add crashCosts.escalation: { annualRate: 0.03 } (with economics.priceYear) or { baseIndex, targetIndex, source } from a price index",
    },
  ];
}

/** Calibration factors estimated from too few sites or crashes, and the bias of estimating on flagged sites. */
function calibrationWarnings(scenario: Scenario, source: YamlSource): InputProblem[] {
  return (scenario.calibrations ?? []).flatMap((calibration): InputProblem[] => {
    if (calibration.method !== "estimated") return [];
    const sites = calibration.sites ?? 0;
    const crashes = calibration.observedCrashes ?? 0;
    const small = sites < MIN_CALIBRATION_SITES || crashes < MIN_CALIBRATION_CRASHES;
    return [
      {
        code: small ? "calibration-sample" : "calibration-bias",
        file: source.file,
        ...source.positionOf(["calibration", calibration.performanceFunction]),
        path: `calibration.${calibration.performanceFunction}`,
        message: `calibration factor for '${calibration.performanceFunction}' estimated as ${calibration.factor.toFixed(3)} from ${sites} site(s) and ${crashes} crash(es)${small ? `, fewer than the ${MIN_CALIBRATION_SITES} sites and ${MIN_CALIBRATION_CRASHES} crashes common practice asks for` : ""}; sites flagged for high counts also push the estimate up`,
        hint: "estimate C from a random sample of the network's sites of this type and give it as a number",
      },
    ];
  });
}

// What the uncertainty draws will do with a CMF that has no standard error.
function uncertaintyHint(scenario: Scenario): string {
  const cv = assumedCmfCv(scenario);
  return cv === "off" || cv === 0
    ? "uncertainty analysis will hold this CMF exact (uncertainty.assumedCmfCv: off); give its published standard error if there is one"
    : `uncertainty analysis will draw it with an assumed standard error of ${cv} × CMF (uncertainty.assumedCmfCv); give its published standard error if there is one`;
}
