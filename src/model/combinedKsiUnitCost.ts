/**
 * One unit cost for a fatal-or-serious-injury (K+A) crash: the K:A-weighted average of the K and
 * A unit costs, fatalShare × K + (1 − fatalShare) × A, with fatalShare = K ÷ (K + A) crashes.
 * Valuing K and A crashes alike keeps a chance fatal crash at one site from outweighing many
 * serious-injury crashes elsewhere (common practice; the combined K+A comprehensive unit cost is
 * tabulated this way in FHWA-SA-17-071, Harmon, Bahar and Gross 2018, from memory).
 * @example K 11,295,400, A 655,000, fatal share 0.1 → 1,719,040.
 */
export function combinedKsiUnitCost(fatalCost: number, seriousCost: number, fatalShare: number): number {
  if (!(fatalShare >= 0 && fatalShare <= 1)) throw new RangeError(`fatal share must lie in [0, 1], got ${fatalShare}`);
  return fatalShare * fatalCost + (1 - fatalShare) * seriousCost;
}
