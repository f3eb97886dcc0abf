import type { SafetyPerformanceFunction, SiteKind } from "./types.js";

/**
 * Crashes per year a safety performance function predicts for a site like this one:
 * N = exp(intercept + aadtExponent·ln AADT + lengthExponent·ln L), L in km (ignored, taken as
 * 1, for an intersection), times the SPF's local calibration factor C. Form of the Highway Safety
 * Manual (AASHTO 2010), Part C SPFs; N_predicted = N_spf × C (Part C, section C.5).
 * @example an SPF with intercept ln(0.001), aadtExponent 1, lengthExponent 1 predicts 20 crashes a year for AADT 10 000 over 2 km.
 */
export function predictedCrashesPerYear(spf: SafetyPerformanceFunction, kind: SiteKind, aadt: number, lengthKm: number | undefined): number {
  if (!(aadt > 0)) throw new RangeError(`AADT must be positive, got ${aadt}`);
  const usesLength = kind !== "intersection" && spf.lengthExponent !== 0;
  if (usesLength && !(lengthKm !== undefined && lengthKm > 0)) throw new RangeError(`SPF ${spf.id} needs a positive length in km`);
  const lengthTerm = usesLength ? spf.lengthExponent * Math.log(lengthKm!) : 0;
  return (spf.calibrationFactor ?? 1) * Math.exp(spf.intercept + spf.aadtExponent * Math.log(aadt) + lengthTerm);
}
