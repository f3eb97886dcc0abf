import type { FrontierLevel } from "../../analysis/budgetFrontier.js";
import type { PlanCase } from "../../analysis/casePlan.js";
import type { PlanResult } from "../../analysis/planProgramme.js";
import { workbookAlternatives } from "../../analysis/workbookAlternatives.js";
import { alternativesSheet } from "./alternativesSheet.js";
import { assumptionsSheet } from "./assumptionsSheet.js";
import { benefitStreamsSheet } from "./benefitStreamsSheet.js";
import { budgetLevelsSheet } from "./budgetLevelsSheet.js";
import { capitalListSheet } from "./capitalListSheet.js";
import { costStreamsSheet, lifecycleColumn } from "./costStreamsSheet.js";
import { notFundedSheet, type AlternativeSources, type NotFundedRow } from "./notFundedSheet.js";
import { summarySheet } from "./summarySheet.js";
import type { SheetSpec, WorkbookSpec } from "./workbookTypes.js";

export interface WorkbookInput {
  readonly plan: PlanResult;
  /** The plan's justification and ranking comparison; absent when no list was found. */
  readonly planCase?: PlanCase;
  /** The budget levels; empty leaves the Budget levels sheet out. */
  readonly frontier: readonly FrontierLevel[];
}

/**
 * The auditable workbook of a solved plan: Summary, Assumptions, Capital list, Not funded,
 * Budget levels and Alternatives, then the two stream sheets every money formula sums.
 */
export function buildWorkbook({ plan, planCase, frontier }: WorkbookInput): WorkbookSpec {
  const { scenario, baselines } = plan.prepared;
  const programme = scenario.programme !== undefined;
  const assumptions = assumptionsSheet(scenario, baselines);
  const alternatives = workbookAlternatives(plan);
  const benefit = benefitStreamsSheet(alternatives, assumptions.live);
  const costs = costStreamsSheet(alternatives, assumptions.live, programme);
  const lifecycleStreamColumn = lifecycleColumn(programme);
  const sources: AlternativeSources[] = alternatives.map((entry, index) => ({ entry, benefit: benefit.rows[index]!, lifecycle: costs.rows[index]! }));
  const bySite = new Map<string, AlternativeSources[]>();
  for (const source of sources) bySite.set(source.entry.site.id, [...(bySite.get(source.entry.site.id) ?? []), source]);

  const capitalList = capitalListSheet(sources.filter((source) => source.entry.funded), assumptions.live, programme, lifecycleStreamColumn);
  const totalsCells = capitalList.sheet.rows[capitalList.totals.row - 1]!;
  const notFunded = notFundedSheet(planCase?.justification.notFunded ?? withoutList(plan), bySite, assumptions.live, lifecycleStreamColumn, plan.prepared.objective === "ksi" ? { unit: "K+A crashes", format: "crashes" } : { unit: scenario.currency, format: "money" });
  const sheets: SheetSpec[] = [
    summarySheet(plan, planCase, capitalList.totals, totalsCells),
    assumptions.sheet,
    capitalList.sheet,
    notFunded,
    ...(frontier.length > 0 ? [budgetLevelsSheet(frontier)] : []),
    alternativesSheet(alternatives, benefit.rows, costs.rows, assumptions.live, programme, lifecycleStreamColumn),
    benefit.sheet,
    costs.sheet,
  ];
  return { sheets, names: assumptions.names, currency: scenario.currency };
}

// Without a list (no feasible one, or none found in time) every site is left out for that one reason.
function withoutList(plan: PlanResult): NotFundedRow[] {
  const why = `no list: the solve ended ${plan.solution.status}${plan.solution.diagnosis === undefined ? "" : ` (${plan.solution.diagnosis})`}`;
  return plan.prepared.sites.map((entry) => ({ site: entry.site.id, name: entry.site.name, reason: "no list", explanation: why, bestBcRatio: null, threshold: null }));
}
