import type { ProgrammeYears } from "../model/programmeTypes.js";
import type { SideConstraint } from "../solver/index.js";
import type { Alternative } from "../model/types.js";

/** What the year rows read of a site: each alternative's spend by year (or its cost, all in the first year). */
type SiteSpend = { readonly alternatives: readonly Pick<Alternative, "cost" | "spendByYear">[] };

/**
 * Each year's budget at a total budget of `budget`: the scenario's years scaled by one factor, so
 * a frontier level or a `--budget` cut varies every year alike (equal shares when all are zero).
 */
export function yearBudgets(programme: ProgrammeYears, budget: number): number[] {
  const total = programme.budgets.reduce((sum, value) => sum + value, 0);
  return programme.budgets.map((value) => (total > 0 ? value * (budget / total) : budget / programme.years));
}

/**
 * The budget rows of a programme. Carry-over `none`: each year's spend within its own budget.
 * `unspent`: what a year leaves unspent moves to later years, never forward, so the spend up to
 * each year is within the budgets up to it (the last of these is the whole budget, the
 * programme's own budget row, and is not repeated; nor is a one-year programme's one row, so it
 * is solved exactly as the one-year list at its budget).
 */
export function programmeYearRows(sites: readonly SiteSpend[], programme: ProgrammeYears, budget: number): SideConstraint[] {
  const budgets = yearBudgets(programme, budget);
  const cumulative = programme.carryOver === "unspent";
  const rows: SideConstraint[] = [];
  let budgetSoFar = 0;
  budgets.forEach((yearBudget, y) => {
    budgetSoFar += yearBudget;
    const year = programme.firstYear + y;
    if ((cumulative || budgets.length === 1) && y === budgets.length - 1) return;
    rows.push({
      id: `year-${year}`,
      label: cumulative ? `spend in ${programme.firstYear}–${year} at most the budgets of those years` : `spend in ${year} at most its budget`,
      sense: "<=",
      rhs: cumulative ? budgetSoFar : yearBudget,
      coefficients: sites.map((entry) =>
        entry.alternatives.map((alternative) => {
          const spend = alternative.spendByYear ?? [];
          if (!cumulative) return spend[y] ?? 0;
          let sum = 0;
          for (let k = 0; k <= y; k += 1) sum += spend[k] ?? 0;
          return sum;
        }),
      ),
    });
  });
  return rows;
}
