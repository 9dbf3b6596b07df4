// The risk of bias of a direct estimate (server/core/nma/risk-of-bias.ts, METHODS.md §13): each study's
// share of the inverse-variance weight by its RoB 2 judgement, worked out by hand, and the suggested
// levels (common practice: the level with the largest share, a tie to the worse, none when more than
// half of the weight is not assessed).
import { describe, expect, it } from "vitest";
import { directRiskOfBias, suggestedLevels } from "#core/nma/risk-of-bias";
import type { ArmEffects, RiskOfBias } from "#core/nma/types";

const study = (name: string, variance: number, riskOfBias: RiskOfBias | null): ArmEffects => ({ study: name, treatments: ["a", "b"], effects: [0, 0], variances: [variance / 2, variance / 2], participants: [null, null], riskOfBias });

describe("risk-of-bias shares", () => {
  // Contrast variances 0.1, 0.2 and 0.4: weights 10, 5 and 2.5 of 17.5.
  const studies = [study("s1", 0.1, "low"), study("s2", 0.2, "high"), study("s3", 0.4, null)];

  it("are each judgement's share of the inverse-variance weight: 10, 5 and 2.5 of 17.5", () => {
    const shares = directRiskOfBias(studies, 0, true)("a", "b")!;
    expect(shares.low).toBeCloseTo(0.571429, 6);
    expect(shares.high).toBeCloseTo(0.285714, 6);
    expect(shares.notAssessed).toBeCloseTo(0.142857, 6);
    expect(shares.someConcerns).toBe(0);
    expect(shares.suggestedLevels).toBe(0);
    expect(directRiskOfBias(studies, 0, true)("b", "a")).toEqual(shares);
  });

  it("weigh with τ² under random effects: τ² 0.1 gives weights 5, 3.333 and 2 of 10.333", () => {
    const shares = directRiskOfBias(studies, 0.1, true)("a", "b")!;
    expect(shares.low).toBeCloseTo(0.483871, 6);
    expect(shares.high).toBeCloseTo(0.322581, 6);
  });

  it("are absent without the column, and for a pair no study compares", () => {
    expect(directRiskOfBias(studies, 0, false)("a", "b")).toBeNull();
    expect(directRiskOfBias(studies, 0, true)("a", "c")).toBeNull();
  });
});

describe("the suggested levels", () => {
  it("follow the largest share; a tie goes to the worse level", () => {
    expect(suggestedLevels({ low: 0.2, someConcerns: 0.5, high: 0.3, notAssessed: 0 })).toBe(1);
    expect(suggestedLevels({ low: 0.4, someConcerns: 0.2, high: 0.4, notAssessed: 0 })).toBe(2);
  });

  it("are none when more than half of the weight is not assessed", () => {
    expect(suggestedLevels({ low: 0.49, someConcerns: 0, high: 0, notAssessed: 0.51 })).toBeNull();
    expect(suggestedLevels({ low: 0.5, someConcerns: 0, high: 0, notAssessed: 0.5 })).toBe(0);
  });
});
