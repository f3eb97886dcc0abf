import type { Programme, ProgrammeOption } from "../solver/types.js";

/** One step along a site's upper convex hull of (cost, value): what the next upgrade adds. */
interface HullStep {
  readonly cost: number;
  readonly value: number;
}

/**
 * The budget's marginal value λ at the LP-relaxation optimum of a programme without side
 * constraints: objective gained per extra currency unit of budget (the right derivative, so at a
 * breakpoint it is the rate of the next step still to be bought; 0 when the budget buys everything).
 *
 * Method: the LP relaxation of the multiple-choice knapsack is solved greedily on each site's upper
 * convex hull of (cost, value) points, the "do nothing" point (0, 0) included unless the site is
 * required (Sinha & Zoltners, Operations Research 27(3), 1979; Kellerer, Pferschy & Pisinger,
 * Knapsack Problems, 2004, ch. 11): hull steps are bought in falling order of value per cost and λ
 * is the rate of the first step that does not fit whole. Cost: O(n log n) in the number of options.
 *
 * Returns undefined when the programme has side constraints (their duals also price the margin,
 * so λ alone would mislead) or when the required sites alone exceed the budget.
 */
export function lpBudgetMarginalValue(programme: Programme): number | undefined {
  if (programme.constraints.length > 0) return undefined;
  let remaining = programme.budget;
  const steps: HullStep[] = [];
  for (const group of programme.groups) {
    const points: ProgrammeOption[] = group.required ? [...group.options] : [{ cost: 0, value: 0 }, ...group.options];
    if (points.length === 0) continue;
    const hull = upperHull(points);
    remaining -= hull[0]!.cost;
    for (let i = 1; i < hull.length; i += 1) steps.push({ cost: hull[i]!.cost - hull[i - 1]!.cost, value: hull[i]!.value - hull[i - 1]!.value });
  }
  if (remaining < 0) return undefined;
  // Within a site the hull rates fall, so sorting by rate keeps each site's own steps in order.
  steps.sort((x, y) => rate(y) - rate(x));
  for (const step of steps) {
    if (step.cost > remaining) return step.value / step.cost;
    remaining -= step.cost;
  }
  return 0;
}

function rate(step: HullStep): number {
  return step.cost === 0 ? Infinity : step.value / step.cost;
}

// Upper-left convex hull from the cheapest (best on a tie) point: value rises strictly and the rate falls.
function upperHull(points: readonly ProgrammeOption[]): ProgrammeOption[] {
  const sorted = [...points].sort((p, q) => p.cost - q.cost || q.value - p.value);
  const hull: ProgrammeOption[] = [];
  for (const point of sorted) {
    const last = hull.at(-1);
    if (last !== undefined && point.value <= last.value) continue; // dearer and no better
    while (hull.length >= 2) {
      const a = hull[hull.length - 2]!;
      const b = hull[hull.length - 1]!;
      // Drop b when it lies on or below the chord from a to the new point.
      if ((b.value - a.value) * (point.cost - a.cost) <= (point.value - a.value) * (b.cost - a.cost)) hull.pop();
      else break;
    }
    hull.push(point);
  }
  return hull;
}
