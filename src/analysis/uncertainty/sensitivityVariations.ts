import { hasStandardError } from "../../model/sampleTreatmentCmfs.js";
import type { Effect, Scenario, Treatment } from "../../model/types.js";

/** One parameter moved to a low and a high value, everything else at its base. */
export interface SensitivityVariation {
  readonly parameter: string;
  readonly base: string;
  readonly low: { readonly label: string; readonly scenario: Scenario };
  readonly high: { readonly label: string; readonly scenario: Scenario };
}

/** Discount rates tried one at a time (fractions a year; a common range for public appraisal, common practice). */
export const DISCOUNT_RATE_RANGE = [0.02, 0.07] as const;
/** Relative change applied to unit crash costs and to service lives. */
export const RELATIVE_SWING = 0.25;
/** CMFs are moved this many standard errors either way. */
export const CMF_STANDARD_ERRORS = 2;
/** A CMF moved down never falls below this (a CMF must stay positive). */
export const CMF_FLOOR = 0.01;

function withTreatments(scenario: Scenario, change: (treatment: Treatment) => Treatment): Scenario {
  return { ...scenario, catalogue: { ...scenario.catalogue, treatments: scenario.catalogue.treatments.map(change) } };
}

function scaledCrashCosts(scenario: Scenario, factor: number): Scenario {
  const { perCrash } = scenario.economics.crashCosts;
  const scaled = { K: perCrash.K * factor, A: perCrash.A * factor, B: perCrash.B * factor, C: perCrash.C * factor, O: perCrash.O * factor };
  return { ...scenario, economics: { ...scenario.economics, crashCosts: { ...scenario.economics.crashCosts, perCrash: scaled } } };
}

// Service lives stay whole years, at least one.
function scaledLives(scenario: Scenario, factor: number): Scenario {
  return withTreatments(scenario, (t) => ({ ...t, serviceLifeYears: Math.max(1, Math.round(t.serviceLifeYears * factor)) }));
}

function withCmf(scenario: Scenario, treatmentId: string, effectIndex: number, cmf: number): Scenario {
  return withTreatments(scenario, (t) =>
    t.id !== treatmentId ? t : { ...t, effects: t.effects.map((e, i): Effect => (i === effectIndex ? { ...e, cmf } : e)) },
  );
}

function percent(rate: number): string {
  return `${(rate * 100).toFixed(1)}%`;
}

/**
 * The one-at-a-time variations: discount rate 2% and 7%; unit crash costs ±25%; service lives
 * ±25% (rounded to whole years); each CMF that has a standard error, of treatments that are some
 * site's candidate, at CMF ± 2 SE (floored at 0.01).
 */
export function sensitivityVariations(scenario: Scenario, candidateTreatments: ReadonlySet<string>): SensitivityVariation[] {
  const swing = RELATIVE_SWING;
  const variations: SensitivityVariation[] = [
    {
      parameter: "discount rate",
      base: percent(scenario.economics.discountRate),
      low: { label: percent(DISCOUNT_RATE_RANGE[0]), scenario: { ...scenario, economics: { ...scenario.economics, discountRate: DISCOUNT_RATE_RANGE[0] } } },
      high: { label: percent(DISCOUNT_RATE_RANGE[1]), scenario: { ...scenario, economics: { ...scenario.economics, discountRate: DISCOUNT_RATE_RANGE[1] } } },
    },
    {
      parameter: "unit crash costs",
      base: "as given",
      low: { label: `−${swing * 100}%`, scenario: scaledCrashCosts(scenario, 1 - swing) },
      high: { label: `+${swing * 100}%`, scenario: scaledCrashCosts(scenario, 1 + swing) },
    },
    {
      parameter: "service lives",
      base: "as given",
      low: { label: `−${swing * 100}%`, scenario: scaledLives(scenario, 1 - swing) },
      high: { label: `+${swing * 100}%`, scenario: scaledLives(scenario, 1 + swing) },
    },
  ];
  for (const treatment of scenario.catalogue.treatments) {
    if (!candidateTreatments.has(treatment.id)) continue;
    treatment.effects.forEach((effect, index) => {
      if (!hasStandardError(effect)) return;
      const move = CMF_STANDARD_ERRORS * effect.standardError!;
      const low = Math.max(CMF_FLOOR, effect.cmf - move);
      const high = effect.cmf + move;
      variations.push({
        parameter: `CMF ${treatment.id} (${effect.crashTypes.join(", ")}; ${effect.severities.join("")})`,
        base: effect.cmf.toFixed(3),
        low: { label: low.toFixed(3), scenario: withCmf(scenario, treatment.id, index, low) },
        high: { label: high.toFixed(3), scenario: withCmf(scenario, treatment.id, index, high) },
      });
    });
  }
  return variations;
}
