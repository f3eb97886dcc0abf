/**
 * The multi-year programme's part of the vocabulary: build years, yearly budgets, carry-over,
 * cost escalation, committed projects and the phasing of a treatment's capital.
 */

/** How unspent budget moves between years: `none` keeps each year within its own; `unspent` carries it to later years. */
export type CarryOverRule = "none" | "unspent";
export const CARRY_OVER_RULES: readonly CarryOverRule[] = ["none", "unspent"];

/** A project already approved: it stays at its site, with these treatments, in this build year. */
export interface CommittedProject {
  readonly site: string;
  readonly treatments: readonly string[];
  readonly year: number;
}

export interface ProgrammeYears {
  readonly firstYear: number;
  /** Build years: firstYear … firstYear + years − 1. */
  readonly years: number;
  /** Capital budget of each build year, first year first. */
  readonly budgets: readonly number[];
  readonly carryOver: CarryOverRule;
  /** Capital cost of a project built in year t is cost × (1 + rate)^(t − firstYear). */
  readonly costEscalationRate: number;
  readonly committed: readonly CommittedProject[];
}

/** The share of a treatment's capital spent `yearsBeforeBuild` years before its build year. */
export interface CapitalPhase {
  readonly yearsBeforeBuild: number;
  readonly share: number;
}

/**
 * Benefits start this many years after the start of the build year: a project built during year
 * t (capital at the start of t, the convention of a one-year list) acts from year t + 1, the first
 * year counted by the discounting's end-of-year convention. One constant, stated in the README.
 */
export const BENEFIT_START_LAG_YEARS = 1;
