import type { ProgrammeYears } from "../model/programmeTypes.js";
import type { FundedProject } from "./fundedProject.js";
import { yearBudgets } from "./programmeYearRows.js";

/** One year of a programme: its budget and spend, what carries over, and what the projects built in it achieve. */
export interface ProgrammeYearSummary {
  readonly year: number;
  readonly budget: number;
  /** Unspent budget of earlier years available this year (always 0 under carry-over `none`). */
  readonly carriedIn: number;
  /** Capital spent this year, by every funded project's phasing (a project may spend before its build year). */
  readonly spend: number;
  /** What this year leaves: carried to the next year under `unspent`, lost under `none`. */
  readonly unspent: number;
  /** Projects whose build year this is. */
  readonly projects: number;
  /** K+A crashes avoided, and benefit PV, of the projects built this year (each over its own years of benefit). */
  readonly ksiAvoided: number;
  readonly benefitPV: number;
  readonly cumulativeKsiAvoided: number;
  readonly cumulativeBenefitPV: number;
}

/** The programme year by year at a total budget of `budget` (each year's budget scaled alike). */
export function summariseYears(funded: readonly FundedProject[], programme: ProgrammeYears, budget: number): ProgrammeYearSummary[] {
  const budgets = yearBudgets(programme, budget);
  let carried = 0;
  let cumulativeKsiAvoided = 0;
  let cumulativeBenefitPV = 0;
  return budgets.map((yearBudget, y) => {
    const year = programme.firstYear + y;
    let spend = 0;
    let projects = 0;
    let ksiAvoided = 0;
    let benefitPV = 0;
    for (const { alternative } of funded) {
      spend += alternative.spendByYear?.[y] ?? 0;
      if (alternative.buildYear !== year) continue;
      projects += 1;
      ksiAvoided += alternative.ksiAvoided;
      benefitPV += alternative.benefitPV;
    }
    cumulativeKsiAvoided += ksiAvoided;
    cumulativeBenefitPV += benefitPV;
    const carriedIn = carried;
    const unspent = carriedIn + yearBudget - spend;
    carried = programme.carryOver === "unspent" ? unspent : 0;
    return { year, budget: yearBudget, carriedIn, spend, unspent, projects, ksiAvoided, benefitPV, cumulativeKsiAvoided, cumulativeBenefitPV };
  });
}
