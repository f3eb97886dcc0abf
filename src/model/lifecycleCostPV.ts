import { singlePaymentPresentWorth } from "./singlePaymentPresentWorth.js";
import { uniformSeriesPresentWorth } from "./uniformSeriesPresentWorth.js";
import type { RenewalRule } from "./types.js";

/** Years a treatment acts within the horizon under a renewal rule: its life (capped), or the whole horizon when renewed. */
export function yearsInService(serviceLifeYears: number, horizonYears: number, renewal: RenewalRule): number {
  return renewal === "renew" ? horizonYears : Math.min(serviceLifeYears, horizonYears);
}

/** How often a treatment is renewed within the horizon, and the unexpired years of its last installation there (0 without residual value). */
export function renewalSchedule(serviceLifeYears: number, horizonYears: number, renewal: RenewalRule): { readonly renewals: number; readonly unexpiredYears: number } {
  let renewals = 0;
  let lastInstalled = 0;
  if (renewal === "renew") {
    for (let year = serviceLifeYears; year < horizonYears; year += serviceLifeYears) {
      renewals += 1;
      lastInstalled = year;
    }
  }
  const unexpired = lastInstalled + serviceLifeYears - horizonYears;
  return { renewals, unexpiredYears: renewal !== "none" && unexpired > 0 ? unexpired : 0 };
}

/**
 * Lifecycle cost PV of one treatment at one site: capital now, upkeep each year it is in service,
 * and by the renewal rule:
 * - `none`: nothing more (service stops at the end of its life or the horizon);
 * - `renew`: a new installation at the capital cost each time its life ends inside the horizon,
 *   discounted by (P/F, i, year), in service to the horizon;
 * - `residual-value` and `renew`: the unexpired part of the last installation's life at the
 *   horizon is credited at straight-line value, discounted from the horizon (common practice for
 *   salvage value in benefit-cost analysis).
 */
export function lifecycleCostPV(capitalCost: number, upkeepPerYear: number, serviceLifeYears: number, discountRate: number, horizonYears: number, renewal: RenewalRule): number {
  const years = yearsInService(serviceLifeYears, horizonYears, renewal);
  let total = capitalCost + upkeepPerYear * uniformSeriesPresentWorth(discountRate, years);
  let lastInstalled = 0;
  if (renewal === "renew") {
    for (let year = serviceLifeYears; year < horizonYears; year += serviceLifeYears) {
      total += capitalCost * singlePaymentPresentWorth(discountRate, year);
      lastInstalled = year;
    }
  }
  if (renewal !== "none") {
    const unexpired = lastInstalled + serviceLifeYears - horizonYears;
    if (unexpired > 0) total -= capitalCost * (unexpired / serviceLifeYears) * singlePaymentPresentWorth(discountRate, horizonYears);
  }
  return total;
}
