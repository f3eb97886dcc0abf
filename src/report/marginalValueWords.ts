import type { Objective } from "../model/types.js";
import { formatFixed, formatMoney } from "./formatNumber.js";

/** The unit of the budget's marginal value per extra 1M, e.g. "K+A crashes avoided per extra 1M USD of budget". */
export function marginalValueUnit(objective: Objective, currency: string): string {
  return objective === "ksi" ? `K+A crashes avoided per extra 1M ${currency} of budget` : `${currency} of benefit PV per extra 1M ${currency} of budget`;
}

/**
 * The budget's marginal value λ (objective per currency unit) in words, scaled to 1M of the
 * currency, e.g. "2.35 K+A crashes avoided per extra 1M USD of budget".
 */
export function marginalValueWords(lambda: number, objective: Objective, currency: string): string {
  const perMillion = lambda * 1e6;
  return `${objective === "ksi" ? formatFixed(perMillion, 2) : formatMoney(perMillion)} ${marginalValueUnit(objective, currency)}`;
}

/** What a JSON `budgetMarginalValue` means, in words, for the output's `definitions`. */
export function marginalValueDefinition(objective: Objective, currency: string): string {
  const what = objective === "ksi" ? "K+A crashes avoided" : `${currency} of benefit PV`;
  return (
    `the budget's marginal value (λ): ${what} gained per extra 1 ${currency} of budget at the optimum of the LP relaxation; ` +
    `times 1,000,000 it reads as ${marginalValueUnit(objective, currency)} at the margin. Null or absent when unknown (policy rules that bind through side constraints).`
  );
}
