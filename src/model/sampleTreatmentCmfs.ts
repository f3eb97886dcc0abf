import type { Effect, Scenario } from "./types.js";

/**
 * Coefficient of variation given to a CMF that publishes no standard error, when the scenario
 * sets none (common practice: a CMF without a published standard error is treated as no better
 * known than a moderately reliable one; at CMF 0.7 it gives SE 0.14, between the Highway Safety
 * Manual Part D's "most reliable" class, SE ≤ 0.1, and its "less reliable" class, SE 0.2 to 0.3,
 * from memory).
 */
export const DEFAULT_ASSUMED_CMF_CV = 0.2;

/** The scenario's `uncertainty.assumedCmfCv`, or DEFAULT_ASSUMED_CMF_CV when it sets none. */
export function assumedCmfCv(scenario: Scenario): number | "off" {
  return scenario.uncertainty?.assumedCmfCv ?? DEFAULT_ASSUMED_CMF_CV;
}

/** Whether an effect publishes a standard error above zero (a standard error of 0 counts as none published). */
export function hasStandardError(effect: Effect): boolean {
  return effect.standardError !== undefined && effect.standardError > 0;
}

/**
 * The standard error an effect's CMF is drawn with: its published one, else `assumedCv` × CMF;
 * 0 (held exact) when it has none and `assumedCv` is "off" or 0.
 * @example drawnStandardError({ cmf: 0.7, ... }, 0.2) === 0.14
 */
export function drawnStandardError(effect: Effect, assumedCv: number | "off"): number {
  if (hasStandardError(effect)) return effect.standardError!;
  return assumedCv === "off" ? 0 : assumedCv * effect.cmf;
}

/** How CMFs are drawn with this assumed CV; stated in every uncertainty output. */
export function cmfSamplingRule(assumedCv: number | "off"): string {
  const without =
    assumedCv === "off" || assumedCv === 0
      ? "CMFs without a standard error are held at their value (uncertainty.assumedCmfCv: off)"
      : `a CMF without one is drawn the same way with an assumed standard error of ${assumedCv} × CMF (uncertainty.assumedCmfCv: ${assumedCv}${assumedCv === DEFAULT_ASSUMED_CMF_CV ? ", the default" : ""})`;
  return `each CMF with a published standard error is drawn once per draw from a lognormal whose mean is the CMF and whose standard deviation is its standard error (sigma² = ln(1 + (se/cmf)²), mu = ln(cmf) − sigma²/2), shared by every site; ${without}`;
}
