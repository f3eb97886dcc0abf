import { buildCrashMatrix } from "../src/model/crashMatrix.js";
import { createPcg32 } from "../src/model/random/pcg32.js";
import type { Scenario, Site } from "../src/model/types.js";

/**
 * A large invented scenario for benchmarks: `siteCount` sites copied in turn from `template`'s
 * sites, each with its crash counts scaled by a random factor in [0.5, 1.5) and rounded, new ids,
 * and the budget scaled with the number of sites. With `varyTraffic`, each copy's AADT is also
 * scaled by its own factor in [0.7, 1.3), as distinct roads carry distinct traffic; without it, the
 * copies of one site often come out identical, a tie-heavy case that is much harder to prove.
 * Deterministic given `seed`.
 */
export function generatedCityScenario(template: Scenario, siteCount: number, seed = 1, varyTraffic = false): Scenario {
  const random = createPcg32(BigInt(seed), 99n);
  const sites: Site[] = Array.from({ length: siteCount }, (_, index) => {
    const source = template.sites[index % template.sites.length]!;
    const factor = 0.5 + random.nextUnitFloat();
    const traffic = varyTraffic ? 0.7 + 0.6 * random.nextUnitFloat() : 1;
    return {
      ...source,
      ...(varyTraffic && source.aadt !== undefined ? { aadt: Math.round(source.aadt * traffic) } : {}),
      id: `G-${String(index + 1).padStart(5, "0")}`,
      name: `${source.name} (copy ${Math.floor(index / template.sites.length) + 1})`,
      crashes: buildCrashMatrix((type, severity) => Math.round(source.crashes[type][severity] * factor)),
    };
  });
  return {
    ...template,
    name: `${template.name}, ${siteCount} generated sites`,
    budget: (template.budget * siteCount) / template.sites.length,
    sites,
    rules: [],
  };
}
