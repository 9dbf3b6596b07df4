// Direct, indirect and network evidence of a pair (server/core/nma/split.ts, METHODS.md §5). The
// expected values are worked out by hand from the formulas the module cites (inverse-variance
// pooling; Bucher's back-calculation as in Dias et al. 2010) and written out here to six figures.
import { describe, expect, it } from "vitest";
import { directEstimates, incoherence, indirectEstimate } from "#core/nma/split";
import type { ArmEffects } from "#core/nma/types";

const study = (name: string, treatments: string[], effects: number[], variances: number[]): ArmEffects => ({ study: name, treatments, effects, variances, participants: treatments.map(() => null) });
const studies = [study("s1", ["A", "B"], [0, 0.5], [0.04, 0.05]), study("s2", ["A", "B"], [0.2, 0.4], [0.1, 0.06])];

describe("direct estimates", () => {
  it("pool θ_a − θ_b by inverse variance: −0.5 (v 0.09) and −0.2 (v 0.16) give −0.392, SE 0.24", () => {
    const direct = directEstimates(studies, 0)("A", "B")!;
    expect(direct.estimate).toBeCloseTo(-0.392, 6);
    expect(direct.se).toBeCloseTo(0.24, 6);
    expect(direct.studies).toBe(2);
    // The other direction is the same evidence with the sign turned.
    expect(directEstimates(studies, 0)("B", "A")!.estimate).toBeCloseTo(0.392, 6);
  });

  it("add τ² to each study's variance under random effects: τ² 0.03 gives −0.383871, SE 0.271198", () => {
    const direct = directEstimates(studies, 0.03)("A", "B")!;
    expect(direct.estimate).toBeCloseTo(-0.383871, 6);
    expect(direct.se).toBeCloseTo(0.271198, 6);
  });

  it("are missing for a pair no study compares", () => {
    expect(directEstimates(studies, 0)("A", "C")).toBeNull();
  });
});

describe("the indirect estimate, back-calculated", () => {
  it("network 0.3 (SE 0.1) and direct 0.5 (SE 0.2) leave an indirect 0.233333, SE 0.115470", () => {
    const indirect = indirectEstimate({ estimate: 0.3, se: 0.1 }, { estimate: 0.5, se: 0.2 })!;
    expect(indirect.estimate).toBeCloseTo(0.233333, 6);
    expect(indirect.se).toBeCloseTo(0.11547, 6);
  });

  it("does not exist where the direct evidence is all there is (a bridge), nor without direct evidence", () => {
    expect(indirectEstimate({ estimate: 0.5, se: 0.2 }, { estimate: 0.5, se: 0.2 })).toBeNull();
    expect(indirectEstimate({ estimate: 0.5, se: 0.2 }, null)).toBeNull();
  });
});

describe("incoherence between direct and indirect", () => {
  it("is z = (d_D − d_I)/√(v_D + v_I) with its two-sided p: 1.154701 and 0.248213 for the pair above", () => {
    const test = incoherence({ estimate: 0.5, se: 0.2 }, { estimate: 0.233333333, se: 0.115470054 })!;
    expect(test.z).toBeCloseTo(1.154701, 6);
    expect(test.p).toBeCloseTo(0.248213, 6);
  });

  it("gives p = 0.05 at z = 1.959964, the normal table's two-sided 5% point", () => {
    const test = incoherence({ estimate: 1.959964, se: Math.SQRT1_2 }, { estimate: 0, se: Math.SQRT1_2 })!;
    expect(test.z).toBeCloseTo(1.959964, 6);
    expect(test.p).toBeCloseTo(0.05, 6);
  });

  it("cannot be tested without both kinds of evidence", () => {
    expect(incoherence({ estimate: 0.5, se: 0.2 }, null)).toBeNull();
  });
});
