import type { Economics } from "./types.js";

/** Economics with the source of each value, as a new scenario states them. */
export interface SourcedEconomics extends Economics {
  readonly discountRateSource: string;
  readonly horizonSource: string;
  /** The currency the unit crash costs are in. */
  readonly crashCostsCurrency: string;
}

/**
 * The economics `averta init` writes into a new scenario, the same as the bundled demo's: a 4%
 * real discount rate and a 20-year horizon (common practice), and comprehensive unit crash costs
 * by KABCO severity from FHWA-SA-17-071 in 2016 US dollars. Starting points to be replaced by
 * the agency's own appraisal values.
 */
export const DEFAULT_ECONOMICS: SourcedEconomics = {
  discountRate: 0.04,
  discountRateSource: "4% a year real: a discount rate commonly used for public road-safety appraisal (common practice)",
  horizonYears: 20,
  horizonSource: "20 years: a usual analysis period for road-safety treatments, covering the service life of most (common practice)",
  crashCosts: {
    perCrash: { K: 11295400, A: 655000, B: 198500, C: 125600, O: 11900 },
    source:
      'FHWA-SA-17-071 "Crash Costs for Highway Safety Analysis" (Harmon, Bahar, Gross 2018), comprehensive unit costs per crash by KABCO severity, 2016 dollars (from memory)',
    priceYear: 2016,
  },
  crashCostsCurrency: "USD",
};
