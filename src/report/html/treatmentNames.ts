import type { Scenario } from "../../model/types.js";

/** Treatment ids → display names ("Raised crosswalk"), falling back to the id for unknown ids. */
export function treatmentNames(scenario: Scenario, ids: readonly string[]): string {
  const names = new Map(scenario.catalogue.treatments.map((treatment) => [treatment.id, treatment.name]));
  return ids.map((id) => names.get(id) ?? id).join(" + ");
}
