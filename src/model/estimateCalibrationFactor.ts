import { sumCrashMatrix } from "./crashMatrix.js";
import { predictedCrashesPerYear } from "./predictedCrashesPerYear.js";
import type { SafetyPerformanceFunction, Site } from "./types.js";

/** An SPF calibration estimate with the sample behind it. */
export interface CalibrationEstimate {
  readonly factor: number;
  readonly sites: number;
  readonly observedCrashes: number;
  readonly predictedCrashes: number;
}

/** Sample below which an estimated calibration factor is unreliable (common practice; HSM 2010 Part C, Appendix A suggests 30 to 50 sites with at least 100 crashes, from memory). */
export const MIN_CALIBRATION_SITES = 30;
export const MIN_CALIBRATION_CRASHES = 100;

/**
 * The local calibration factor C = Σ observed crashes ÷ Σ uncalibrated SPF-predicted crashes over
 * the same sites and years (Highway Safety Manual 2010, Part C, Appendix A.1.1). `sites` must
 * all have what the SPF needs (AADT, and a length when it uses one); the SPF's own factor is
 * ignored. Undefined when nothing is predicted.
 */
export function estimateCalibrationFactor(spf: SafetyPerformanceFunction, sites: readonly Site[], windowYears: number): CalibrationEstimate | undefined {
  const uncalibrated = { ...spf, calibrationFactor: 1 };
  let observedCrashes = 0;
  let predictedCrashes = 0;
  for (const site of sites) {
    if (site.aadt === undefined) throw new RangeError(`site ${site.id} has no AADT`);
    observedCrashes += sumCrashMatrix(site.crashes);
    predictedCrashes += predictedCrashesPerYear(uncalibrated, site.kind, site.aadt, site.lengthKm) * windowYears;
  }
  if (!(predictedCrashes > 0)) return undefined;
  return { factor: observedCrashes / predictedCrashes, sites: sites.length, observedCrashes, predictedCrashes };
}
