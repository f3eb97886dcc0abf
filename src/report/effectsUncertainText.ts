import type { EffectUncertainty } from "../analysis/uncertainty/analyseUncertainty.js";

/**
 * "N of M effects uncertain (K with a published standard error, L with the assumed CV)", with the
 * effects held exact after it when there are any: the basis that every probability is shown beside.
 * @example "23 of 23 effects uncertain (7 with a published standard error, 16 with the assumed CV)"
 */
export function effectsUncertainText(effects: EffectUncertainty): string {
  const uncertain = effects.withStandardError + effects.withAssumedCv;
  const exact = effects.heldExact === 0 ? "" : `; ${effects.heldExact} held exact (assumed CV ${effects.assumedCmfCv === "off" ? "off" : effects.assumedCmfCv})`;
  return `${uncertain} of ${effects.total} effects uncertain (${effects.withStandardError} with a published standard error, ${effects.withAssumedCv} with the assumed CV)${exact}`;
}
