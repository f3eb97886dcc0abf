import type { FormulaCell, NumberFormat } from "./workbookTypes.js";

/** A cell a formula reads: its address (or name) and the value it holds, for the cached result. */
export interface Term {
  readonly ref: string;
  readonly value: number;
}

// The same threshold as uniformSeriesPresentWorth and growingSeriesPresentWorth: below it a rate counts as zero.
const NEAR_ZERO = "1E-12";

function cell(formula: string, result: number, format?: NumberFormat): FormulaCell {
  return format === undefined ? { formula, result } : { formula, result, format };
}

/** (P/A, i, n) written out: (1 − (1 + i)^−n) ÷ i, or n at a zero rate. Not the PV function, so the factor reads as in a handbook. */
export function uniformSeriesFormula(rate: Term, years: Term): FormulaCell {
  const i = rate.value;
  const n = years.value;
  const result = n <= 0 ? 0 : Math.abs(i) < 1e-12 ? n : (1 - Math.pow(1 + i, -n)) / i;
  return cell(`IF(${years.ref}<=0,0,IF(ABS(${rate.ref})<${NEAR_ZERO},${years.ref},(1-(1+${rate.ref})^(-${years.ref}))/${rate.ref}))`, result, "factor");
}

/**
 * Present worth of amounts G^t at the ends of years t = start+1 … end, at rate i: with
 * q = G ÷ (1 + i), q^(start+1) × (1 − q^(end−start)) ÷ (1 − q), or end − start when q is 1
 * (the geometric-gradient series; growingSeriesPresentWorth). With i = 0 it counts crash-years.
 */
export function growingSeriesFormula(rate: Term | 0, growth: Term, start: Term, end: Term): FormulaCell {
  const q = rate === 0 ? growth.ref : `(${growth.ref}/(1+${rate.ref}))`;
  const qValue = rate === 0 ? growth.value : growth.value / (1 + rate.value);
  const years = end.value - start.value;
  const result = years <= 0 ? 0 : Math.abs(qValue - 1) < 1e-12 ? years : (Math.pow(qValue, start.value + 1) * (1 - Math.pow(qValue, years))) / (1 - qValue);
  const formula = `IF(${end.ref}<=${start.ref},0,IF(ABS(${q}-1)<${NEAR_ZERO},${end.ref}-${start.ref},${q}^(${start.ref}+1)*(1-${q}^(${end.ref}-${start.ref}))/(1-${q})))`;
  return cell(formula, result, "factor");
}

/** (P/F, i, n): (1 + i)^−n. */
export function singlePaymentFormula(rate: Term, years: Term): FormulaCell {
  return cell(`(1+${rate.ref})^(-${years.ref})`, Math.pow(1 + rate.value, -years.value), "factor");
}

/**
 * Present worth of renewals at the capital cost every `life` years, `count` times: Σ k=1…count
 * (1 + i)^−k·life, summed as a geometric series (lifecycleCostPV adds the terms one by one).
 */
export function renewalsFormula(rate: Term, capital: Term, life: Term, count: Term): FormulaCell {
  const v = Math.pow(1 + rate.value, -life.value);
  const factor = count.value === 0 ? 0 : Math.abs(v - 1) < 1e-12 ? count.value : (v * (1 - Math.pow(v, count.value))) / (1 - v);
  const vRef = `(1+${rate.ref})^(-${life.ref})`;
  const formula = `${capital.ref}*IF(${count.ref}=0,0,IF(ABS(${vRef}-1)<${NEAR_ZERO},${count.ref},${vRef}*(1-${vRef}^${count.ref})/(1-${vRef})))`;
  return cell(formula, capital.value * factor, "money");
}
