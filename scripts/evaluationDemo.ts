import { predictedCrashesPerYear } from "../src/model/predictedCrashesPerYear.js";
import { createPcg32, type RandomSource } from "../src/model/random/pcg32.js";
import { sampleGamma } from "../src/model/random/sampleGamma.js";
import { CRASH_TYPES, SEVERITIES, type Catalogue, type SafetyPerformanceFunction, type SiteKind } from "../src/model/types.js";

/** The effects planted in the invented built-projects demo: what `averta evaluate` must recover. */
export const PLANTED_EFFECTS = { "retroreflective-backplates": 0.8, "speed-safety-cameras": 0.75 } as const;
export const EVALUATION_DEMO_SEED = 2019n;

const BEFORE = { from: "2015-01-01", to: "2018-12-31", years: 4 };
const AFTER = { from: "2020-01-01", to: "2022-12-31", years: 3 };
const AADT_GROWTH = 1.02 ** 5; // 2 % a year from the middle of one period to the middle of the other
const STREETS = ["Ostring", "Mühlweg", "Kasseler Tor", "Lindenallee", "Brunnenplatz", "Am Hang", "Feldgasse", "Uferweg", "Schmiedestraße", "Vogelsang", "Holzmarkt", "Kirchsteig", "Rosenhof", "Talweg", "Eichkamp", "Steinbruch"];

/** One Poisson variate: Knuth's product of uniforms, in pieces of mean at most 30 so exp(−mean) stays far from underflow. */
function samplePoisson(random: RandomSource, mean: number): number {
  let count = 0;
  for (let rest = mean; rest > 0; rest -= 30) {
    const limit = Math.exp(-Math.min(rest, 30));
    for (let product = random.nextUnitFloat(); product > limit; product *= random.nextUnitFloat()) count++;
  }
  return count;
}

interface Drawn {
  readonly id: string;
  readonly name: string;
  readonly kind: SiteKind;
  readonly lengthKm?: number;
  readonly aadt: number;
  readonly before: number[][];
  readonly after: number[][];
}

// Crashes per cell over a period: Poisson with mean λ × share × years, λ the site's true mean a year.
function drawCells(random: RandomSource, spf: SafetyPerformanceFunction, perYear: number, years: number): number[][] {
  return CRASH_TYPES.map((type) => SEVERITIES.map((severity) => samplePoisson(random, perYear * spf.shares[type][severity] * years)));
}

/**
 * A population of sites of one kind with true means μ = SPF × Gamma(1/k, 1/k) (mean 1), crashes
 * before and after (the after mean × θ at treated sites, and at the after AADT); the treated ones
 * are the `treated` sites with the most crashes before, as a programme picks them, so a naive
 * comparison shows regression to the mean. Comparison sites are drawn at random from the rest.
 */
function population(random: RandomSource, spf: SafetyPerformanceFunction, kind: SiteKind, prefix: string, size: number, treated: number, comparison: number, theta: number): { treated: Drawn[]; comparison: Drawn[] } {
  const drawn = Array.from({ length: size }, (_, index) => {
    const aadt = Math.round((kind === "intersection" ? 12000 + 20000 * random.nextUnitFloat() : 8000 + 14000 * random.nextUnitFloat()) / 100) * 100;
    const lengthKm = kind === "intersection" ? undefined : Math.round((0.6 + 1.4 * random.nextUnitFloat()) * 100) / 100;
    const k = spf.overdispersion;
    const frailty = sampleGamma(random, 1 / k, 1 / k);
    const mean = (volume: number) => predictedCrashesPerYear(spf, kind, volume, lengthKm) * frailty;
    const afterAadt = Math.round((aadt * AADT_GROWTH) / 100) * 100;
    const before = drawCells(random, spf, mean(aadt), BEFORE.years);
    return { id: `${prefix}-${String(index + 1).padStart(3, "0")}`, name: `${STREETS[index % STREETS.length]} ${kind === "intersection" ? "junction" : "section"} ${Math.floor(index / STREETS.length) + 1}`, kind, ...(lengthKm !== undefined && { lengthKm }), aadt, before, afterMean: mean(afterAadt), afterAadt };
  });
  const total = (cells: number[][]) => cells.flat().reduce((sum, count) => sum + count, 0);
  const order = [...drawn].sort((a, b) => total(b.before) - total(a.before) || a.id.localeCompare(b.id));
  const withAfter = (site: (typeof drawn)[number], effect: number): Drawn => ({ ...site, aadt: site.aadt, after: drawCells(random, spf, site.afterMean * effect, AFTER.years) });
  const rest = order.slice(treated);
  const picked: Drawn[] = [];
  while (picked.length < comparison && rest.length > 0) picked.push(withAfter(rest.splice(Math.floor(random.nextUnitFloat() * rest.length), 1)[0]!, 1));
  return { treated: order.slice(0, treated).map((site) => withAfter(site, theta)).sort((a, b) => a.id.localeCompare(b.id)), comparison: picked.sort((a, b) => a.id.localeCompare(b.id)) };
}

function matrixYaml(cells: number[][]): string {
  const rows = CRASH_TYPES.map((type, t) => {
    const parts = SEVERITIES.map((severity, s) => (cells[t]![s]! > 0 ? `${severity}: ${cells[t]![s]}` : "")).filter((part) => part !== "");
    return parts.length > 0 ? `${type}: { ${parts.join(", ")} }` : "";
  }).filter((row) => row !== "");
  return `{ ${rows.join(", ")} }`;
}

function siteYaml(site: Drawn, spf: string | undefined, withAadt: boolean, group?: string): string[] {
  const aadt = (value: number) => (withAadt ? `, aadt: ${value}` : "");
  return [
    `  - id: ${site.id}`,
    ...(group === undefined ? [`    name: ${JSON.stringify(site.name)}`, `    kind: ${site.kind}`] : [`    group: ${JSON.stringify(group)}`]),
    ...(group === undefined && site.lengthKm !== undefined ? [`    lengthKm: ${site.lengthKm}`] : []),
    ...(group === undefined && spf !== undefined ? [`    performanceFunction: ${spf}`] : []),
    `    before: { from: ${BEFORE.from}, to: ${BEFORE.to}${aadt(site.aadt)}, crashes: ${matrixYaml(site.before)} }`,
    `    after: { from: ${AFTER.from}, to: ${AFTER.to}${aadt(Math.round((site.aadt * AADT_GROWTH) / 100) * 100)}, crashes: ${matrixYaml(site.after)} }`,
  ];
}

/**
 * The invented Vellmar built-projects file: signal backplates at the 30 junctions with the most
 * crashes in 2015–2018 of 150, speed cameras on the 24 sections with the most of 120, built in
 * 2019, with crashes drawn from the demo catalogue's SPFs and the planted effects, and untreated
 * comparison junctions. Two camera sections have no AADT, so they cannot use Empirical Bayes.
 */
export function evaluationDemoYaml(catalogue: Catalogue): string {
  const random = createPcg32(EVALUATION_DEMO_SEED, 54n);
  const spf = (id: string) => catalogue.performanceFunctions.find((candidate) => candidate.id === id)!;
  const junctions = population(random, spf("urban-4sg-intersection"), "intersection", "J", 150, 30, 30, PLANTED_EFFECTS["retroreflective-backplates"]);
  const sections = population(random, spf("urban-2u-segment"), "segment", "R", 120, 24, 0, PLANTED_EFFECTS["speed-safety-cameras"]);
  const lines = [
    "# yaml-language-server: $schema=../schema/projects.schema.json",
    "#",
    "# Invented demo data: safety projects built in Vellmar in 2019, with crash counts drawn by",
    "# scripts/evaluationDemo.ts from the demo catalogue's SPFs with planted effects",
    `# (backplates θ = ${PLANTED_EFFECTS["retroreflective-backplates"]}, speed cameras θ = ${PLANTED_EFFECTS["speed-safety-cameras"]} on all crashes), so that`,
    "# `averta evaluate` can be seen to recover them. Not real crashes, not real sites.",
    "evaluation: Vellmar safety projects built in 2019",
    "catalogues: [../catalogs/demo-catalogue.yaml]",
    "projects:",
    ...junctions.treated.flatMap((site) => [`  - site: ${site.id}`, "    treatments: [retroreflective-backplates]", "    completedYear: 2019"]),
    ...sections.treated.flatMap((site) => [`  - site: ${site.id}`, "    treatments: [speed-safety-cameras]", "    completed: 2019-10-31", "    constructionStart: 2019-06-01"]),
    "sites:",
    ...junctions.treated.flatMap((site) => siteYaml(site, "urban-4sg-intersection", true)),
    ...sections.treated.flatMap((site, index) => siteYaml(site, "urban-2u-segment", index % 12 !== 5)),
    "comparisonSites:",
    ...junctions.comparison.flatMap((site) => siteYaml(site, undefined, false, "retroreflective-backplates")),
  ];
  return lines.join("\n") + "\n";
}
