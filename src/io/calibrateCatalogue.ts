import { estimateCalibrationFactor } from "../model/estimateCalibrationFactor.js";
import { empiricalBayesGap } from "../model/siteBaselines.js";
import type { Catalogue, SafetyPerformanceFunction, Site } from "../model/types.js";
import type { SpfCalibration } from "../model/spfCalibration.js";

/**
 * The catalogue with each calibrated SPF's factor set: a given number, or an estimate from the
 * scenario's own sites that name the SPF and have what it needs (see estimateCalibrationFactor).
 */
export function calibrateCatalogue(
  catalogue: Catalogue,
  requested: Readonly<Record<string, number | "estimate">>,
  sites: readonly Site[],
  windowYears: number,
): { catalogue: Catalogue; calibrations: SpfCalibration[] } {
  const calibrations: SpfCalibration[] = [];
  const performanceFunctions = catalogue.performanceFunctions.map((spf): SafetyPerformanceFunction => {
    const asked = Object.hasOwn(requested, spf.id) ? requested[spf.id] : undefined;
    if (asked === undefined) return spf;
    if (asked !== "estimate") {
      calibrations.push({ performanceFunction: spf.id, factor: asked, method: "given" });
      return { ...spf, calibrationFactor: asked };
    }
    const usable = sites.filter((site) => site.performanceFunction === spf.id && empiricalBayesGap(site, spf) === undefined);
    const estimate = estimateCalibrationFactor(spf, usable, windowYears);
    if (estimate === undefined) return spf;
    calibrations.push({ performanceFunction: spf.id, method: "estimated", ...estimate });
    return { ...spf, calibrationFactor: estimate.factor };
  });
  return { catalogue: { ...catalogue, performanceFunctions }, calibrations };
}
