import { growingSeriesPresentWorth } from "./growingSeriesPresentWorth.js";
import { yearsInService } from "./lifecycleCostPV.js";
import type { Economics } from "./types.js";

/**
 * The spans of years over which the set of an alternative's treatments in service does not
 * change, and what one crash avoided per year in each span is worth: `crashYears[k]` counts the
 * growing crashes over span k, `presentWorth[k]` discounts them. Span k runs from the previous
 * end to `ends[k]`; treatment i acts in it when `inService[i] >= ends[k]`.
 */
export interface ServiceSpans {
  readonly inService: Float64Array;
  readonly ends: Float64Array;
  readonly crashYears: Float64Array;
  readonly presentWorth: Float64Array;
}

/** The service spans of treatments with these service lives under the scenario's renewal rule. */
export function serviceSpans(serviceLivesYears: readonly number[], economics: Economics, crashGrowthPerYear = 1): ServiceSpans {
  const { discountRate, horizonYears } = economics;
  const renewal = economics.renewal ?? "none";
  const inService = serviceLivesYears.map((life) => yearsInService(life, horizonYears, renewal));
  const ends = [...new Set(inService)].sort((a, b) => a - b);
  const crashYears: number[] = [];
  const presentWorth: number[] = [];
  let start = 0;
  for (const end of ends) {
    crashYears.push(growingSeriesPresentWorth(0, crashGrowthPerYear, start, end));
    presentWorth.push(growingSeriesPresentWorth(discountRate, crashGrowthPerYear, start, end));
    start = end;
  }
  // Typed arrays: the draws read these in their innermost loop, for every alternative alike.
  return { inService: Float64Array.from(inService), ends: Float64Array.from(ends), crashYears: Float64Array.from(crashYears), presentWorth: Float64Array.from(presentWorth) };
}
