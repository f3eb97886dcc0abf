import type { FrontierSummary } from "../analysis/summariseFrontier.js";
import { CAUTIONS } from "./cautions.js";
import { formatFixed, formatMoney } from "./formatNumber.js";
import { KSI_AVOIDED_LABEL } from "./ksiAvoidedLabel.js";
import { textTable } from "./textTable.js";

/** What a frontier report needs besides the rows. */
export interface FrontierContext {
  readonly scenarioName: string;
  readonly currency: string;
  /** The scenario's own budget, marked in the table and chart. */
  readonly scenarioBudget: number;
  readonly objective: "ksi" | "benefit";
}

/** The budget frontier as a terminal table with the diminishing-returns reading and the cautions. */
export function frontierTable(summary: FrontierSummary, context: FrontierContext): string {
  const { currency } = context;
  const right = (heading: string) => ({ heading, align: "right" as const });
  const table = textTable(
    [right(`Budget (${currency})`), { heading: "Status" }, right(`Spend (${currency})`), right("Projects"), right(KSI_AVOIDED_LABEL), right(`Benefit PV (${currency})`), right("B/C"), right(`K+A crashes avoided per extra 1M ${currency}`), { heading: "" }],
    summary.rows.map((row) => [
      formatMoney(row.budget) + (row.budget === context.scenarioBudget ? " ◀" : ""),
      row.status,
      formatMoney(row.spend),
      String(row.projects),
      formatFixed(row.ksiAvoided, 2),
      formatMoney(row.benefitPV),
      formatFixed(row.bcRatio, 2),
      row.marginalKsiPerMillion === null ? "" : formatFixed(row.marginalKsiPerMillion, 2),
      row.diminishing ? "< half" : "",
    ]),
  );
  const reference = summary.referenceKsiPerMillion;
  const lines = [
    `${context.scenarioName}: budget frontier (${context.objective === "ksi" ? "maximising K+A crashes avoided" : "maximising benefit PV"} at each level)`,
    `Scenario budget ${formatMoney(context.scenarioBudget)} ${currency}.`,
    "",
    table,
    `K+A crashes avoided per extra 1M ${currency} = (K+A crashes avoided at this level − at the previous level) ÷ (budget step in millions of ${currency}).`,
    reference === null
      ? "Fewer than two budget levels have a list, so no diminishing-returns reading."
      : `"First 1M" = ${formatFixed(reference, 2)} K+A crashes avoided per extra 1M ${currency}, the rate from ${formatMoney(summary.referenceFromBudget!)} (the lowest budget with a list) to ${formatMoney(summary.referenceToBudget!)} ${currency}; "< half" marks steps that buy less than half of it.`,
    summary.diminishingFrom === null
      ? "No point past which every further step buys less than half the first 1M's rate."
      : `Past ${formatMoney(summary.diminishingFrom)} ${currency}, every further 1M buys less than half of what the first 1M bought.`,
    "",
    "Cautions:",
    ...CAUTIONS.map((caution) => `- ${caution}`),
  ];
  return lines.join("\n") + "\n";
}
