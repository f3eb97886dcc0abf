import { combinedKsiUnitCost } from "./combinedKsiUnitCost.js";
import { totalsBySeverity } from "./crashMatrix.js";
import { escalationFactorFromIndex, escalationFactorFromRate } from "./escalationFactor.js";
import type { CrashCosts, Severity, Site } from "./types.js";

/** Crash unit costs as a scenario states them, before escalation and K+A combining. */
export interface StatedCrashCosts {
  readonly perCrash: Readonly<Record<Severity, number>>;
  readonly source: string;
  readonly priceYear?: number;
  readonly escalation?:
    | { readonly annualRate: number; readonly source?: string }
    | { readonly baseIndex: number; readonly targetIndex: number; readonly source: string };
  /** Default `combined`: one K+A unit cost weighted by fatalShare (default: the sites' own K ÷ (K + A)). */
  readonly ksiCosting?: { readonly method: "combined" | "by-severity"; readonly unitCost?: number; readonly fatalShare?: number };
}

/** When no fatal or serious crash is observed at any site, this share weights the K and A costs (stated in the basis). */
const FALLBACK_FATAL_SHARE = 0;

/**
 * The unit costs benefits are counted with: the stated costs times the escalation factor (from
 * their price year to `programmePriceYear`), then, unless `by-severity` is asked for, K and A
 * both valued at one combined K+A unit cost (see combinedKsiUnitCost). A user-given combined
 * unit cost is priced like the other crash costs and escalated with them. The fatal share
 * defaults to the K share of all observed K+A crashes at the scenario's sites.
 */
export function resolveCrashCosts(stated: StatedCrashCosts, programmePriceYear: number | undefined, sites: readonly Site[]): CrashCosts {
  const { factor, description } = escalation(stated, programmePriceYear);
  const escalated = Object.fromEntries(Object.entries(stated.perCrash).map(([severity, cost]) => [severity, cost * factor])) as Record<Severity, number>;
  const base = {
    statedPerCrash: stated.perCrash,
    source: stated.source,
    ...(stated.priceYear !== undefined && { priceYear: stated.priceYear }),
    escalationFactor: factor,
    ...(description !== undefined && { escalation: description }),
  };
  const costing = stated.ksiCosting ?? { method: "combined" };
  if (costing.method === "by-severity") return { ...base, perCrash: escalated, ksiCosting: { method: "by-severity" } };
  if (costing.unitCost !== undefined) {
    const unitCost = costing.unitCost * factor;
    return {
      ...base,
      perCrash: { ...escalated, K: unitCost, A: unitCost },
      ksiCosting: { method: "combined", unitCost, basis: "combined K+A unit cost given by the scenario" },
    };
  }
  let fatalShare = costing.fatalShare;
  let basis: string;
  if (fatalShare !== undefined) basis = `K and A unit costs weighted by the scenario's fatal share K ÷ (K + A) = ${round(fatalShare)}`;
  else {
    let fatal = 0;
    let serious = 0;
    for (const site of sites) {
      const counts = totalsBySeverity(site.crashes);
      fatal += counts.K;
      serious += counts.A;
    }
    fatalShare = fatal + serious > 0 ? fatal / (fatal + serious) : FALLBACK_FATAL_SHARE;
    basis =
      fatal + serious > 0
        ? `K and A unit costs weighted by the sites' observed crashes: ${fatal} K and ${serious} A, fatal share ${round(fatalShare)}`
        : "no K or A crash is observed at any site, so the A unit cost is used for both";
  }
  const unitCost = combinedKsiUnitCost(escalated.K, escalated.A, fatalShare);
  return { ...base, perCrash: { ...escalated, K: unitCost, A: unitCost }, ksiCosting: { method: "combined", unitCost, basis, fatalShare } };
}

function escalation(stated: StatedCrashCosts, programmePriceYear: number | undefined): { factor: number; description?: string } {
  const rule = stated.escalation;
  if (rule === undefined) return { factor: 1 };
  const from = stated.priceYear;
  if ("annualRate" in rule) {
    if (from === undefined || programmePriceYear === undefined) throw new RangeError("escalation at a rate needs both price years");
    const factor = escalationFactorFromRate(rule.annualRate, from, programmePriceYear);
    const source = rule.source === undefined ? "" : ` (${rule.source})`;
    return { factor, description: `unit costs escalated from ${from} to ${programmePriceYear} at ${(100 * rule.annualRate).toFixed(2)}% a year${source}: factor ${round(factor)}` };
  }
  const factor = escalationFactorFromIndex(rule.baseIndex, rule.targetIndex);
  const years = from !== undefined && programmePriceYear !== undefined ? ` from ${from} to ${programmePriceYear}` : "";
  return { factor, description: `unit costs escalated${years} by price index ${rule.targetIndex} ÷ ${rule.baseIndex} (${rule.source}): factor ${round(factor)}` };
}

function round(value: number): string {
  return String(Math.round(value * 10_000) / 10_000);
}
