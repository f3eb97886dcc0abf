import { buildCrashMatrix } from "../src/model/crashMatrix.js";
import { createPcg32 } from "../src/model/random/pcg32.js";
import type { Scenario, Site } from "../src/model/types.js";

/**
 * A large invented scenario for benchmarks: `siteCount` sites copied in turn from `template`'s
 * sites, each with its crash counts scaled by a random factor in [0.5, 1.5) and rounded, new ids,
 * and the budget scaled with the number of sites. Deterministic given `seed`.
 */
export function generatedCityScenario(template: Scenario, siteCount: number, seed = 1): Scenario {
  const random = createPcg32(BigInt(seed), 99n);
  const sites: Site[] = Array.from({ length: siteCount }, (_, index) => {
    const source = template.sites[index % template.sites.length]!;
    const factor = 0.5 + random.nextUnitFloat();
    return {
      ...source,
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
