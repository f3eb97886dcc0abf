import type { ProgrammeGroup } from "./types.js";

/**
 * Input indices of the groups sorted by id (plain code-unit order, not locale), then by input
 * index. Engines work in this order so that ties between equally good programmes are broken by
 * group id and the answer does not depend on the order sites were listed in.
 */
export function canonicalGroupOrder(groups: readonly ProgrammeGroup[]): Int32Array {
  const order = Int32Array.from(groups, (_, g) => g);
  return order.sort((x, y) => {
    const a = groups[x]!.id;
    const b = groups[y]!.id;
    return a < b ? -1 : a > b ? 1 : x - y;
  });
}
