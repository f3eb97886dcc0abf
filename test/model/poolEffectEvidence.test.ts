import { describe, expect, it } from "vitest";
import { effectEvidenceLines } from "../../src/model/effectEvidenceLines.js";
import { poolEffectEvidence } from "../../src/model/poolEffectEvidence.js";
import { SEVERITIES, type Effect, type Treatment } from "../../src/model/types.js";

// The rule: fixed-effect inverse-variance pooling of ln CMF (common practice for combining CMF
// studies), Var(ln CMF) ≈ (SE / CMF)² by the delta method, w = 1 / Var, ln C = Σ w ln CMF / Σ w,
// SE(ln C) = 1 / sqrt(Σ w), CMF = exp(ln C), SE = CMF × SE(ln C). The sums below were worked by
// hand from that rule (logarithms to 12 digits) and checked to 30 digits with mpmath.
const pedestrian: Effect = { crashTypes: ["pedestrian"], severities: SEVERITIES, cmf: 0.87, standardError: 0.05, source: "published study P" };
const local = { cmf: 0.79, standardError: 0.08, source: "averta evaluate: study L" };

describe("poolEffectEvidence", () => {
  it("pools a published CMF with a standard error and a local one by inverse-variance weighting of ln CMF", () => {
    // w = (0.87 / 0.05)² = 17.4² = 302.76 and (0.79 / 0.08)² = 9.875² = 97.515625; Σ w = 400.275625.
    // ln 0.87 = −0.139262067334, ln 0.79 = −0.235722333521;
    // ln C = (302.76 × −0.139262067334 + 97.515625 × −0.235722333521) / 400.275625 = −0.162761832389.
    // C = exp(−0.162761832389) = 0.849794; SE(ln C) = 1 / sqrt(400.275625) = 0.049982782335; SE = 0.849794 × 0.049983 = 0.042475.
    const pooled = poolEffectEvidence({ ...pedestrian, published: pedestrian, local: [local] });
    expect(pooled.cmf).toBeCloseTo(0.849794, 6);
    expect(pooled.standardError!).toBeCloseTo(0.042475, 6);
    expect(pooled.crashTypes).toEqual(["pedestrian"]);
    expect(pooled.evidence).toEqual({ published: { cmf: 0.87, standardError: 0.05, source: "published study P" }, local: [local], rule: "inverse-variance" });
    expect(pooled.source).toBe("pooled by inverse-variance weighting of ln CMF: published 0.87 (SE 0.05, published study P) and local 0.79 (SE 0.08, averta evaluate: study L)");
    // The pooled relative SE is below each input's (weights add): 0.042475 / 0.849794 = 0.04998 < 0.05 / 0.87 = 0.0575.
    expect(pooled.standardError! / pooled.cmf).toBeLessThan(0.05 / 0.87);
  });

  it("pools several local estimates with the published one, in one step", () => {
    // Published 0.8 (SE 0.08, w 100) with local 0.6 (SE 0.12, w 25) and 0.6 (SE 0.12, w 25) is
    // published 0.8 (w 100) with 0.6 at w 50: ln C = (100 ln 0.8 + 50 ln 0.6) / 150
    // = (100 × −0.223143551314 + 50 × −0.510825623766) / 150 = −0.319037575465, C = 0.726848;
    // SE = 0.726848 / sqrt(150) = 0.059347.
    const effect: Effect = { ...pedestrian, cmf: 0.8, standardError: 0.08 };
    const pooled = poolEffectEvidence({ ...effect, published: effect, local: [{ cmf: 0.6, standardError: 0.12, source: "a" }, { cmf: 0.6, standardError: 0.12, source: "b" }] });
    expect(pooled.cmf).toBeCloseTo(0.726848, 6);
    expect(pooled.standardError!).toBeCloseTo(0.059347, 6);
    expect(pooled.source).toMatch(/and local 0\.6 \(SE 0\.12, a\) and local 0\.6 \(SE 0\.12, b\)$/);
  });

  it("keeps a published CMF without a standard error as it is: it cannot be weighted", () => {
    const { standardError: _, ...unweighted } = pedestrian;
    const kept = poolEffectEvidence({ ...unweighted, published: unweighted, local: [local] });
    expect(kept.cmf).toBe(0.87);
    expect(kept.standardError).toBeUndefined();
    expect(kept.evidence?.rule).toBe("published-only (no standard error)");
    expect(kept.evidence?.published).toEqual({ cmf: 0.87, source: "published study P" });
    expect(kept.source).toBe("published 0.87 (no standard error, published study P) kept; local 0.79 (SE 0.08, averta evaluate: study L) not pooled: the published CMF has no standard error to weight it by");
    // A standard error of 0 counts as none published (hasStandardError), not as infinite weight.
    expect(poolEffectEvidence({ ...pedestrian, published: { ...pedestrian, standardError: 0 }, local: [local] }).cmf).toBe(0.87);
  });

  it("gives cells no published effect covers the local CMF alone, pooled when there are several", () => {
    const alone = poolEffectEvidence({ crashTypes: ["angle"], severities: ["K", "A"], local: [local] });
    expect(alone).toMatchObject({ crashTypes: ["angle"], severities: ["K", "A"], cmf: 0.79, standardError: 0.08, evidence: { local: [local], rule: "local-only" } });
    expect(alone.evidence?.published).toBeUndefined();
    expect(alone.source).toBe("local 0.79 (SE 0.08, averta evaluate: study L); no published effect covers these crashes");
    // w = (0.8 / 0.08)² = 100 and (0.6 / 0.12)² = 25: ln C = (100 × −0.223143551314 + 25 × −0.510825623766) / 125
    // = −0.280679965805, C = 0.755270; SE = 0.755270 / sqrt(125) = 0.067553.
    const two = poolEffectEvidence({ crashTypes: ["angle"], severities: SEVERITIES, local: [{ cmf: 0.8, standardError: 0.08, source: "a" }, { cmf: 0.6, standardError: 0.12, source: "b" }] });
    expect(two.cmf).toBeCloseTo(0.75527, 6);
    expect(two.standardError!).toBeCloseTo(0.067553, 6);
    expect(two.source).toMatch(/^pooled by inverse-variance weighting of ln CMF: local 0\.8 .* no published effect covers these crashes$/);
  });

  it("refuses to pool nothing", () => {
    expect(() => poolEffectEvidence({ ...pedestrian, published: pedestrian, local: [] })).toThrow(RangeError);
  });
});

describe("effectEvidenceLines", () => {
  it("lists each effect with local evidence, with its cells, the result and the effect's source; nothing else", () => {
    const pooled = poolEffectEvidence({ ...pedestrian, published: pedestrian, local: [local] });
    const treatment = (effects: Effect[]): Treatment => ({ id: "lpi", name: "LPI", appliesTo: ["intersection"], cost: { basis: "per-site", amount: 1 }, upkeepPerYear: 0, serviceLifeYears: 10, effects });
    const lines = effectEvidenceLines([treatment([pooled, { ...pedestrian, crashTypes: ["angle"] }]), { ...treatment([pedestrian]), id: "plain" }]);
    expect(lines).toEqual([`lpi on pedestrian crashes, all severities: CMF 0.850 (SE 0.042), ${pooled.source}`]);
  });
});
