import fc from "fast-check";
import { completeCrashMatrix } from "../../src/model/crashMatrix.js";
import type { Scenario, Site, Treatment } from "../../src/model/types.js";
import type { PolicyRule } from "../../src/model/policyRule.js";

const DISTRICTS = ["North", "South"] as const;

/**
 * Small valid scenarios (1-4 sites, up to 4 treatments, random policy rules) for property tests.
 * Costs are whole thousands and shares quarters, so rule boundaries are exact in floating point.
 */
export const randomScenario: fc.Arbitrary<Scenario> = fc
  .record({
    treatments: fc.array(
      fc.record({
        costThousands: fc.integer({ min: 1, max: 200 }),
        serviceLifeYears: fc.integer({ min: 3, max: 25 }),
        cmf: fc.integer({ min: 40, max: 99 }).map((x) => x / 100),
        targetsPedestrians: fc.boolean(),
        grouped: fc.boolean(),
      }),
      { minLength: 1, maxLength: 4 },
    ),
    sites: fc.array(
      fc.record({
        district: fc.constantFrom(...DISTRICTS),
        tagged: fc.boolean(),
        pedestrianK: fc.nat(2),
        pedestrianA: fc.nat(4),
        angleA: fc.nat(4),
        angleB: fc.nat(6),
        candidateMask: fc.integer({ min: 1, max: 15 }),
      }),
      { minLength: 1, maxLength: 4 },
    ),
    maxTreatmentsPerSite: fc.integer({ min: 1, max: 2 }),
    budgetShare: fc.constantFrom(0, 0.1, 0.25, 0.5, 0.75, 1.5),
    rules: fc.array(
      fc.oneof(
        fc.record({ kind: fc.constant("must-fund" as const), siteIndex: fc.nat(3), withTreatment: fc.boolean() }),
        fc.record({ kind: fc.constant("never-fund" as const), siteIndex: fc.nat(3), withTreatment: fc.boolean() }),
        fc.record({ kind: fc.constantFrom("spend-cap" as const, "spend-floor" as const), scope: fc.constantFrom("North", "South", "tag", "all"), share: fc.option(fc.constantFrom(0.25, 0.5, 0.75), { nil: undefined }), amountThousands: fc.integer({ min: 0, max: 300 }) }),
        fc.record({ kind: fc.constant("ksi-share-floor" as const), scope: fc.constantFrom("North", "South", "tag"), share: fc.constantFrom(0.25, 0.5) }),
        fc.record({ kind: fc.constant("max-projects" as const), scope: fc.constantFrom("North", "South", "tag", "all"), count: fc.nat(3) }),
      ),
      { maxLength: 3 },
    ),
  })
  .map((raw): Scenario => {
    const treatments: Treatment[] = raw.treatments.map((t, index) => ({
      id: `t${index}`,
      name: `Treatment ${index}`,
      appliesTo: ["intersection", "segment", "corridor"],
      cost: { basis: "per-site", amount: t.costThousands * 1000 },
      upkeepPerYear: 0,
      serviceLifeYears: t.serviceLifeYears,
      ...(t.grouped && { exclusiveGroup: "g" }),
      effects: [{ crashTypes: t.targetsPedestrians ? ["pedestrian"] : ["pedestrian", "angle"], severities: ["K", "A", "B", "C", "O"], cmf: t.cmf, source: "random test value" }],
    }));
    const sites: Site[] = raw.sites.map((s, index) => {
      const candidates = treatments.filter((_, bit) => (s.candidateMask >> bit) & 1).map((t) => t.id);
      return {
        id: `s${index}`,
        name: `Site ${index}`,
        kind: "intersection",
        district: s.district,
        tags: s.tagged ? ["tag"] : [],
        crashes: completeCrashMatrix({ pedestrian: { K: s.pedestrianK, A: s.pedestrianA }, angle: { A: s.angleA, B: s.angleB } }),
        candidates: candidates.length > 0 ? candidates : [treatments[0]!.id],
        costOverrides: {},
      };
    });
    const scope = (name: string) => (name === "tag" ? { tag: "tag" } : name === "all" ? {} : { district: name });
    const mustFundSites = new Set<string>();
    const neverFundSites = new Set<string>();
    const rules: PolicyRule[] = [];
    for (const rule of raw.rules) {
      if (rule.kind === "must-fund" || rule.kind === "never-fund") {
        const site = sites[rule.siteIndex % sites.length]!;
        // The loader refuses a second must-fund entry for a site, and must-fund with never-fund-at-all.
        if (rule.kind === "must-fund" && (mustFundSites.has(site.id) || neverFundSites.has(site.id))) continue;
        if (rule.kind === "never-fund" && !rule.withTreatment && mustFundSites.has(site.id)) continue;
        if (rule.kind === "must-fund") mustFundSites.add(site.id);
        if (rule.kind === "never-fund" && !rule.withTreatment) neverFundSites.add(site.id);
        rules.push({ kind: rule.kind, site: site.id, treatments: rule.withTreatment ? [site.candidates[0]!] : [] });
      } else if (rule.kind === "spend-cap" || rule.kind === "spend-floor") {
        rules.push({ kind: rule.kind, ...scope(rule.scope), ...(rule.share !== undefined ? { share: rule.share } : { amount: rule.amountThousands * 1000 }) });
      } else if (rule.kind === "ksi-share-floor") {
        rules.push({ kind: rule.kind, ...scope(rule.scope), share: rule.share });
      } else if (rule.kind === "max-projects") {
        rules.push({ kind: rule.kind, ...scope(rule.scope), count: rule.count });
      }
    }
    const mostExpensive = sites.reduce((total, site) => total + Math.max(...site.candidates.map((id) => treatments.find((t) => t.id === id)!.cost.amount)), 0);
    return {
      name: "random",
      currency: "USD",
      budget: Math.round(mostExpensive * raw.budgetShare),
      crashWindow: { firstYear: 2021, lastYear: 2025 },
      economics: { discountRate: 0.04, horizonYears: 20, crashCosts: { perCrash: { K: 11295400, A: 655000, B: 198500, C: 125600, O: 11900 }, source: "FHWA-SA-17-071 (from memory)" } },
      objective: "ksi",
      baseline: "observed",
      maxTreatmentsPerSite: raw.maxTreatmentsPerSite,
      catalogue: { treatments, performanceFunctions: [] },
      sites,
      rules,
    };
  });
