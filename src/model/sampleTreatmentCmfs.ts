import { lognormalFromMeanSd, sampleLognormal } from "./random/lognormalFromMeanSd.js";
import type { RandomSource } from "./random/pcg32.js";
import type { Effect, Treatment } from "./types.js";

/** Whether an effect's CMF is uncertain in the draws (it publishes a standard error above zero). */
export function hasStandardError(effect: Effect): boolean {
  return effect.standardError !== undefined && effect.standardError > 0;
}

/**
 * The treatments with every uncertain CMF replaced by one lognormal draw whose mean is the
 * published CMF and whose standard deviation is its standard error; effects without one keep
 * their CMF. One draw per effect, shared by every site that uses the treatment (the CMF is one
 * unknown quantity, not a site-by-site one). Effects are drawn in catalogue order, so the same
 * random source gives the same CMFs.
 */
export function sampleTreatmentCmfs(treatments: readonly Treatment[], random: RandomSource): Treatment[] {
  return treatments.map((treatment) => {
    if (!treatment.effects.some(hasStandardError)) return treatment;
    return {
      ...treatment,
      effects: treatment.effects.map((effect) =>
        hasStandardError(effect) ? { ...effect, cmf: sampleLognormal(random, lognormalFromMeanSd(effect.cmf, effect.standardError!)) } : effect,
      ),
    };
  });
}
