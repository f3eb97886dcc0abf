import type { Alternative, Objective, Site } from "../model/types.js";
import type { PolicyRule } from "../model/policyRule.js";
import type { ProgrammeYears } from "../model/programmeTypes.js";
import type { Programme, SideConstraint } from "../solver/index.js";
import { programmeYearRows } from "./programmeYearRows.js";

/** The figures of an alternative that the programme uses (an uncertainty draw changes the last two). */
export type AlternativeFigures = Pick<Alternative, "cost" | "ksiAvoided" | "benefitPV" | "spendByYear">;

/** A site as the programme sees it: its rules' scope, whether it must be funded, its alternatives' figures. */
export interface SiteFigures {
  readonly site: Site;
  readonly required: boolean;
  readonly alternatives: readonly AlternativeFigures[];
}

/** What the optimiser maximises for one alternative. */
export function objectiveValue(alternative: AlternativeFigures, objective: Objective): number {
  return objective === "ksi" ? alternative.ksiAvoided : alternative.benefitPV;
}

/**
 * The integer program for a scenario: one group per site (required under a must-fund rule),
 * its alternatives as options, and one side constraint per spending, KSI-share or count rule;
 * in a multi-year programme also one budget row per year (programmeYearRows), with `budget` the
 * total of the years' budgets.
 */
export function buildProgramme(
  sites: readonly SiteFigures[],
  rules: readonly PolicyRule[],
  objective: Objective,
  budget: number,
  years?: ProgrammeYears,
): Programme {
  return {
    budget,
    groups: sites.map((entry) => ({
      id: entry.site.id,
      required: entry.required,
      options: entry.alternatives.map((alternative) => ({ cost: alternative.cost, value: objectiveValue(alternative, objective) })),
    })),
    constraints: [
      ...(years === undefined ? [] : programmeYearRows(sites, years, budget)),
      ...rules.flatMap((rule, index) => sideConstraint(rule, index, sites, years?.firstYear ?? 0)),
    ],
  };
}

function covers(rule: { district?: string; tag?: string }, site: Site): boolean {
  if (rule.district !== undefined) return site.district === rule.district;
  if (rule.tag !== undefined) return site.tags.includes(rule.tag);
  return true;
}

function scopeLabel(rule: { district?: string; tag?: string }): string {
  if (rule.district !== undefined) return `district ${rule.district}`;
  if (rule.tag !== undefined) return `sites tagged ${rule.tag}`;
  return "all sites";
}

function sideConstraint(rule: PolicyRule, index: number, sites: readonly SiteFigures[], firstYear: number): SideConstraint[] {
  const id = `rule-${index + 1}-${rule.kind}`;
  // coefficient(alternative, inScope): one row entry per option of every group.
  const row = (coefficient: (alternative: AlternativeFigures, inScope: boolean) => number) =>
    sites.map((entry) => {
      const inScope = rule.kind !== "must-fund" && rule.kind !== "never-fund" && covers(rule, entry.site);
      return entry.alternatives.map((alternative) => coefficient(alternative, inScope));
    });
  switch (rule.kind) {
    case "must-fund":
    case "never-fund":
      return []; // applied when the alternatives were built
    case "spend-cap":
    case "spend-floor": {
      const sense = rule.kind === "spend-cap" ? "<=" : ">=";
      const word = rule.kind === "spend-cap" ? "at most" : "at least";
      if (rule.share !== undefined) {
        const share = rule.share;
        return [{
          id,
          label: `spend in ${scopeLabel(rule)} ${word} ${(share * 100).toFixed(1)}% of total spend`,
          sense,
          rhs: 0,
          coefficients: row((alternative, inScope) => (inScope ? alternative.cost : 0) - share * alternative.cost),
        }];
      }
      const year = rule.year;
      const spend = (alternative: AlternativeFigures) => (year === undefined ? alternative.cost : alternative.spendByYear?.[year - firstYear] ?? 0);
      return [{
        id,
        label: `spend in ${scopeLabel(rule)}${year === undefined ? "" : ` in ${year}`} ${word} ${rule.amount ?? 0}`,
        sense,
        rhs: rule.amount ?? 0,
        coefficients: row((alternative, inScope) => (inScope ? spend(alternative) : 0)),
      }];
    }
    case "ksi-share-floor":
      return [{
        id,
        label: `KSI avoided in ${scopeLabel(rule)} at least ${(rule.share * 100).toFixed(1)}% of all KSI avoided`,
        sense: ">=",
        rhs: 0,
        coefficients: row((alternative, inScope) => (inScope ? alternative.ksiAvoided : 0) - rule.share * alternative.ksiAvoided),
      }];
    case "max-projects":
      return [{
        id,
        label: `at most ${rule.count} project(s) in ${scopeLabel(rule)}`,
        sense: "<=",
        rhs: rule.count,
        coefficients: row((_alternative, inScope) => (inScope ? 1 : 0)),
      }];
  }
}
