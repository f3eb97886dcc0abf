import type { Programme, SideConstraint } from "./types.js";

/**
 * Looks for a plain reason why no programme can exist, checking one condition at a time:
 * a must-fund site without options, must-fund sites whose cheapest options alone exceed the
 * budget, and any single rule that cannot be met even ignoring the budget and the other rules.
 * Returns undefined when each condition can be met on its own (the conflict, if any, is between
 * conditions). Cost: one pass over the coefficients.
 */
export function diagnoseInfeasibility(programme: Programme): string | undefined {
  const { groups, budget } = programme;
  let requiredCost = 0;
  const required: string[] = [];
  for (const group of groups) {
    if (!group.required) continue;
    if (group.options.length === 0) {
      return `Site ${group.id} must be funded but has no alternatives; give it at least one or drop the requirement.`;
    }
    const cheapest = Math.min(...group.options.map((o) => o.cost));
    required.push(`${group.id} (${formatAmount(cheapest)})`);
    requiredCost += cheapest;
  }
  if (requiredCost > budget) {
    return (
      `The must-fund sites' cheapest alternatives, ${required.join(", ")}, cost ${formatAmount(requiredCost)} together, ` +
      `${formatAmount(requiredCost - budget)} more than the budget of ${formatAmount(budget)}; ` +
      `raise the budget or drop some must-fund sites.`
    );
  }
  for (const constraint of programme.constraints) {
    const reason = diagnoseConstraintAlone(programme, constraint);
    if (reason !== undefined) return reason;
  }
  return undefined;
}

// The best a single row can reach when each group picks freely (required groups pick something).
function diagnoseConstraintAlone(programme: Programme, constraint: SideConstraint): string | undefined {
  const lowering = constraint.sense === "<=";
  let best = 0;
  programme.groups.forEach((group, g) => {
    const row = constraint.coefficients[g];
    const terms = group.options.map((_, a) => row?.[a] ?? 0);
    if (!group.required) terms.push(0);
    best += lowering ? Math.min(...terms) : Math.max(...terms);
  });
  const slack = 1e-9 * Math.max(1, Math.abs(constraint.rhs));
  if (lowering && best > constraint.rhs + slack) {
    return `Rule "${constraint.label}" cannot be met: even at its lowest the total is ${formatAmount(best)}, above the limit of ${formatAmount(constraint.rhs)}.`;
  }
  if (!lowering && best < constraint.rhs - slack) {
    return `Rule "${constraint.label}" cannot be met: even at its highest the total is ${formatAmount(best)}, below the required ${formatAmount(constraint.rhs)}.`;
  }
  return undefined;
}

// Locale-independent so that diagnoses are byte-identical on every machine.
function formatAmount(x: number): string {
  const rounded = Math.round(x * 100) / 100;
  const [whole, fraction] = Math.abs(rounded).toFixed(2).split(".") as [string, string];
  const grouped = whole.replace(/\B(?=(\d{3})+(?!\d))/g, ",");
  const trimmed = fraction === "00" ? "" : `.${fraction}`;
  return `${rounded < 0 ? "-" : ""}${grouped}${trimmed}`;
}
