import type { PlanComparison } from "../analysis/comparePlans.js";
import { CAUTIONS } from "./cautions.js";
import { formatFixed, formatMoney } from "./formatNumber.js";
import { KSI_AVOIDED_LABEL } from "./ksiAvoidedLabel.js";
import { textTable } from "./textTable.js";

/** Names the two sides of a comparison, e.g. "budget 5,000,000" and "budget 9,700,000". */
export interface CompareLabels {
  readonly a: string;
  readonly b: string;
  readonly currency: string;
}

/** A what-if comparison as terminal text: totals side by side, then entering, leaving and changed projects. */
export function compareTable(comparison: PlanComparison, labels: CompareLabels): string {
  const { totalsA, totalsB, delta } = comparison;
  const signed = (text: string, value: number) => (value > 0 ? `+${text}` : text);
  const totals = textTable(
    [{ heading: "" }, { heading: labels.a, align: "right" }, { heading: labels.b, align: "right" }, { heading: "Change (B − A)", align: "right" }],
    [
    ["Status", comparison.sideA.status, comparison.sideB.status, ""],
    [`Spend (${labels.currency})`, formatMoney(totalsA.cost), formatMoney(totalsB.cost), signed(formatMoney(delta.spend), delta.spend)],
    ["Projects", String(totalsA.projects), String(totalsB.projects), signed(String(delta.projects), delta.projects)],
    [KSI_AVOIDED_LABEL, formatFixed(totalsA.ksiAvoided, 2), formatFixed(totalsB.ksiAvoided, 2), signed(formatFixed(delta.ksiAvoided, 2), delta.ksiAvoided)],
    [`Benefit PV (${labels.currency})`, formatMoney(totalsA.benefitPV), formatMoney(totalsB.benefitPV), signed(formatMoney(delta.benefitPV), delta.benefitPV)],
    ["B/C", formatFixed(totalsA.bcRatio, 2), formatFixed(totalsB.bcRatio, 2), signed(formatFixed(delta.bcRatio, 2), delta.bcRatio)],
    ],
  );
  const projectTable = (rows: readonly { site: string; name: string; treatments: string; cost: string; ksi: string }[]) => {
    return textTable(
      [{ heading: "Site" }, { heading: "Name", maxWidth: 26 }, { heading: "Treatments", maxWidth: 42 }, { heading: `Cost (${labels.currency})`, align: "right" }, { heading: KSI_AVOIDED_LABEL, align: "right" }],
      rows.map((row) => [row.site, row.name, row.treatments, row.cost, row.ksi]),
    );
  };
  const plain = (project: PlanComparison["entering"][number]) => ({
    site: project.site,
    name: project.name,
    treatments: project.treatments.join(" + "),
    cost: formatMoney(project.cost),
    ksi: formatFixed(project.ksiAvoided, 2),
  });
  const section = (title: string, rows: readonly ReturnType<typeof plain>[]) =>
    rows.length === 0 ? [`${title}: none`, ""] : [`${title} (${rows.length}):`, projectTable(rows), ""];
  const lines = [
    `What-if: A = ${labels.a}, B = ${labels.b}`,
    "",
    totals,
    ...[["A", comparison.sideA] as const, ["B", comparison.sideB] as const]
      .filter(([, side]) => side.diagnosis !== null)
      .map(([name, side]) => `No list in ${name}: ${side.diagnosis}`),
    "",
    ...section("Entering the list in B", comparison.entering.map(plain)),
    ...section("Leaving the list in B", comparison.leaving.map(plain)),
    ...section(
      "Change treatment (A → B)",
      comparison.changed.map((change) => ({
        site: change.site,
        name: change.name,
        treatments: `${change.before.treatments.join(" + ")} → ${change.after.treatments.join(" + ")}`,
        cost: `${formatMoney(change.before.cost)} → ${formatMoney(change.after.cost)}`,
        ksi: `${formatFixed(change.before.ksiAvoided, 2)} → ${formatFixed(change.after.ksiAvoided, 2)}`,
      })),
    ),
    ...(comparison.moved.length === 0 ? [] : section(
      "Same treatments, another build year (A → B)",
      comparison.moved.map((change) => ({
        site: change.site,
        name: change.name,
        treatments: `${change.after.treatments.join(" + ")}: ${change.before.buildYear} → ${change.after.buildYear}`,
        cost: `${formatMoney(change.before.cost)} → ${formatMoney(change.after.cost)}`,
        ksi: `${formatFixed(change.before.ksiAvoided, 2)} → ${formatFixed(change.after.ksiAvoided, 2)}`,
      })),
    )),
    "Cautions:",
    ...CAUTIONS.map((caution) => `- ${caution}`),
  ];
  return lines.join("\n") + "\n";
}
