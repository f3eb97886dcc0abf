import { alternativeCells } from "./alternativeCells.js";
import { avoidedOverSpans } from "./avoidedOverSpans.js";
import type { CellCmf } from "./combineCmfs.js";
import { lifecycleCostPV } from "./lifecycleCostPV.js";
import { serviceSpans } from "./serviceSpans.js";
import { treatmentCmf } from "./treatmentCmf.js";
import { treatmentCapitalCost } from "./treatmentCapitalCost.js";
import { SEVERITIES, type Alternative, type CrashMatrix, type Economics, type RenewalRule, type Severity, type Site, type Treatment } from "./types.js";
import { benefitCostRatio } from "./benefitCostRatio.js";

/** How benefits are counted when treatments in one alternative have different service lives, by renewal rule. */
export function describeServiceLives(renewal: RenewalRule): string {
  const combined = "in each year the CMFs of the treatments in service are combined";
  if (renewal === "renew") {
    return `each treatment is renewed at its capital cost (discounted) whenever its service life ends inside the analysis horizon, so it acts to the horizon; ${combined}; upkeep is paid every year to the horizon; the unexpired life of the last installation at the horizon is credited at straight-line residual value`;
  }
  if (renewal === "residual-value") {
    return `each treatment acts for its own service life, capped at the analysis horizon, and is not renewed; ${combined}; upkeep is paid over each treatment's own life; a treatment whose life runs past the horizon is credited the straight-line residual value of its unexpired life`;
  }
  return `each treatment acts for its own service life, capped at the analysis horizon, and is not renewed; ${combined}; upkeep is paid over each treatment's own life; no residual value is counted`;
}

/**
 * Effects and economics of applying `treatments` together at `site`, given the site's expected
 * crashes per year without treatment.
 *
 * Year by year (1 … horizon) only the treatments in service act (see describeServiceLives);
 * crashes avoided in year t = G^t × Σ cells expected × (1 − combined CMF of the active treatments),
 * with G the site's crash growth per year (traffic growth; 1 for none). K+A avoided = the K and A
 * cells summed over those years. Benefit PV discounts each year's avoided crash costs with the
 * geometric-series present-worth factor over the span the active set is constant. Lifecycle cost
 * = Σ treatments' lifecycleCostPV. `cellCmf` may replace treatmentCmf with a faster lookup of the
 * same values (buildAlternatives). The arithmetic is avoidedOverSpans, which the uncertainty
 * draws share.
 */
export function evaluateAlternative(
  site: Site,
  treatments: readonly Treatment[],
  expectedPerYear: CrashMatrix,
  economics: Economics,
  cellCmf: CellCmf = treatmentCmf,
  crashGrowthPerYear = 1,
): Alternative {
  const { discountRate, horizonYears, crashCosts } = economics;
  const renewal = economics.renewal ?? "none";
  const capital = treatments.map((treatment) => treatmentCapitalCost(treatment, site));
  const cost = capital.reduce((total, amount) => total + amount, 0);
  const lifecycle = treatments.reduce(
    (total, t, i) => total + lifecycleCostPV(capital[i]!, t.upkeepPerYear, t.serviceLifeYears, discountRate, horizonYears, renewal),
    0,
  );

  const n = treatments.length;
  const cells = alternativeCells(treatments, expectedPerYear, cellCmf);
  const spans = serviceSpans(treatments.map((t) => t.serviceLifeYears), economics, crashGrowthPerYear);
  const figures = { ksiAvoided: 0, benefitPV: 0 };
  const firstYear = new Float64Array(SEVERITIES.length);
  const costPerCrash = Float64Array.from(SEVERITIES, (severity) => crashCosts.perCrash[severity]);
  avoidedOverSpans(spans, cells.count, cells.expected, cells.severity, cells.cmfs, economics.cmfCombination, costPerCrash, new Float64Array(n), figures, firstYear);
  const { ksiAvoided, benefitPV } = figures;
  // Cells where more than one treatment acts (CMF ≠ 1): their combination rule matters.
  let sharedCells = 0;
  if (n > 1) {
    for (let c = 0; c < cells.count; c += 1) {
      let acting = 0;
      for (let i = 0; i < n; i += 1) if (cells.cmfs[c * n + i] !== 1) acting += 1;
      if (acting > 1) sharedCells += 1;
    }
  }

  return {
    site: site.id,
    treatments: treatments.map((t) => t.id),
    cost,
    lifecycleCostPV: lifecycle,
    crashesAvoidedPerYear: scaleSeverities(firstYear, crashGrowthPerYear),
    ksiAvoided,
    benefitPV,
    bcRatio: benefitCostRatio(benefitPV, lifecycle),
    npv: benefitPV - lifecycle,
    costPerKsi: ksiAvoided > 0 ? lifecycle / ksiAvoided : Infinity,
    effectiveYears: spans.ends[spans.ends.length - 1] ?? 0,
    sharedCells,
  };
}

function scaleSeverities(values: Float64Array, factor: number): Record<Severity, number> {
  const [K, A, B, C, O] = factor === 1 ? values : values.map((value) => value * factor);
  return { K: K!, A: A!, B: B!, C: C!, O: O! };
}
