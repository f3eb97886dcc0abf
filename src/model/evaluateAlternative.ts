import { combineCmfs, type CellCmf } from "./combineCmfs.js";
import { treatmentCmf } from "./treatmentCmf.js";
import { treatmentCapitalCost } from "./treatmentCapitalCost.js";
import { uniformSeriesPresentWorth } from "./uniformSeriesPresentWorth.js";
import { CRASH_TYPES, KSI_SEVERITIES, SEVERITIES, type Alternative, type CrashMatrix, type Economics, type Severity, type Site, type Treatment } from "./types.js";

/** How benefits are counted when treatments in one alternative have different service lives. */
export const SERVICE_LIFE_RULE =
  "each treatment acts for its own service life, capped at the analysis horizon, and is not renewed; in each year the CMFs of the treatments still in service are combined; upkeep is paid over each treatment's own life; no residual value is counted";

/**
 * Effects and economics of applying `treatments` together at `site`, given the site's expected
 * crashes per year without treatment.
 *
 * Year by year (1 … horizon) only the treatments still within their service life act; crashes
 * avoided in a year = Σ cells expected × (1 − combined CMF of the active treatments). KSI avoided
 * = the K and A cells summed over those years. Benefit PV discounts each year's avoided crash
 * costs with the uniform-series present-worth factor over the span the active set is constant.
 * Lifecycle cost = capital + Σ upkeep × (P/A, i, min(life, horizon)).
 * `cellCmf` may replace treatmentCmf with a faster lookup of the same values (uncertainty draws).
 */
export function evaluateAlternative(
  site: Site,
  treatments: readonly Treatment[],
  expectedPerYear: CrashMatrix,
  economics: Economics,
  cellCmf: CellCmf = treatmentCmf,
): Alternative {
  const { discountRate, horizonYears, crashCosts } = economics;
  const cost = treatments.reduce((total, treatment) => total + treatmentCapitalCost(treatment, site), 0);
  const lifecycleCostPV =
    cost +
    treatments.reduce((total, t) => total + t.upkeepPerYear * uniformSeriesPresentWorth(discountRate, Math.min(t.serviceLifeYears, horizonYears)), 0);

  // Spans of years over which the set of treatments in service does not change.
  const ends = [...new Set(treatments.map((t) => Math.min(t.serviceLifeYears, horizonYears)))].sort((a, b) => a - b);
  let start = 0;
  let ksiAvoided = 0;
  let benefitPV = 0;
  let firstYear: Record<Severity, number> | undefined;
  for (const end of ends) {
    const active = treatments.filter((t) => Math.min(t.serviceLifeYears, horizonYears) >= end);
    const avoided = { K: 0, A: 0, B: 0, C: 0, O: 0 };
    for (const type of CRASH_TYPES) {
      for (const severity of SEVERITIES) {
        const expected = expectedPerYear[type][severity];
        // Empty cells avoid nothing; skipping them is most of the work saved on sparse crash matrices.
        if (expected !== 0) avoided[severity] += expected * (1 - combineCmfs(active, type, severity, cellCmf));
      }
    }
    firstYear ??= avoided;
    const years = end - start;
    ksiAvoided += KSI_SEVERITIES.reduce((total, severity) => total + avoided[severity], 0) * years;
    const benefitPerYear = SEVERITIES.reduce((total, severity) => total + avoided[severity] * crashCosts.perCrash[severity], 0);
    benefitPV += benefitPerYear * (uniformSeriesPresentWorth(discountRate, end) - uniformSeriesPresentWorth(discountRate, start));
    start = end;
  }

  return {
    site: site.id,
    treatments: treatments.map((t) => t.id),
    cost,
    lifecycleCostPV,
    crashesAvoidedPerYear: firstYear ?? { K: 0, A: 0, B: 0, C: 0, O: 0 },
    ksiAvoided,
    benefitPV,
    bcRatio: lifecycleCostPV > 0 ? benefitPV / lifecycleCostPV : benefitPV > 0 ? Infinity : 0,
    npv: benefitPV - lifecycleCostPV,
    costPerKsi: ksiAvoided > 0 ? lifecycleCostPV / ksiAvoided : Infinity,
    effectiveYears: ends[ends.length - 1] ?? 0,
  };
}
