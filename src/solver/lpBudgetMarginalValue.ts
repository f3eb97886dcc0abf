import { buildBudgetLayout } from "./buildBudgetLayout.js";
import { canonicalGroupOrder } from "./canonicalGroupOrder.js";
import type { Programme } from "./types.js";

/**
 * The budget's marginal value λ at the LP-relaxation optimum of a programme without side
 * constraints: objective gained per extra currency unit of budget (the right derivative, so at a
 * breakpoint it is the rate of the next step still to be bought; 0 when the budget buys everything).
 * For engines that report no λ of their own; the exact engine finds the same value as it solves.
 *
 * Method: the LP relaxation of the multiple-choice knapsack is solved greedily on each site's upper
 * convex hull of (cost, value) points, the "do nothing" point (0, 0) included unless the site is
 * required (Sinha & Zoltners, Operations Research 27(3), 1979; Kellerer, Pferschy & Pisinger,
 * Knapsack Problems, 2004, ch. 11): hull segments, as `buildBudgetLayout` sorts them, are bought in
 * falling order of value per cost and λ is the rate of the first that does not fit whole.
 * Cost: O(n log n) in the number of options.
 *
 * Returns undefined when the programme has side constraints (their duals also price the margin,
 * so λ alone would mislead) or when the required sites alone exceed the budget.
 */
export function lpBudgetMarginalValue(programme: Programme): number | undefined {
  if (programme.constraints.length > 0) return undefined;
  const layout = buildBudgetLayout(canonicalGroupOrder(programme.groups), programme.groups);
  let remaining = programme.budget - layout.baseCost;
  if (remaining < 0) return undefined;
  for (let s = 0; s < layout.segmentCost.length; s += 1) {
    if (layout.segmentCost[s]! > remaining) return layout.segmentRatio[s]!;
    remaining -= layout.segmentCost[s]!;
  }
  return 0;
}
