// Absolute effects per 1000 (METHODS.md §7; GRADE Handbook section 5).
import { describe, expect, it } from "vitest";
import { absoluteEffect, treatmentRisk } from "#core/nma/absolute";

describe("treatment risk from the baseline risk", () => {
  it("OR: p₁ = OR·p₀ / (1 − p₀ + OR·p₀); with OR 2 and p₀ 0.1, 0.2/1.1", () => {
    expect(treatmentRisk("OR", Math.log(2), 0.1)).toBeCloseTo(0.2 / 1.1, 12);
  });
  it("RR: p₁ = RR·p₀, capped at 1", () => {
    expect(treatmentRisk("RR", Math.log(0.5), 0.3)).toBeCloseTo(0.15, 12);
    expect(treatmentRisk("RR", Math.log(5), 0.3)).toBe(1);
  });
  it("RD: p₁ = p₀ + RD, capped at 0", () => {
    expect(treatmentRisk("RD", -0.5, 0.3)).toBe(0);
  });
});

describe("per 1000 with the CI mapped through the same formula", () => {
  it("RR 0.5 (0.25 to 1) at a baseline of 200 per 1000", () => {
    const effect = absoluteEffect("RR", { estimate: Math.log(0.5), lower: Math.log(0.25), upper: Math.log(1) }, 0.2);
    expect(effect.baselinePer1000).toBeCloseTo(200, 12);
    expect(effect.treatmentPer1000.estimate).toBeCloseTo(100, 10);
    expect(effect.treatmentPer1000.lower).toBeCloseTo(50, 10);
    expect(effect.treatmentPer1000.upper).toBeCloseTo(200, 10);
    expect(effect.differencePer1000).toEqual({
      estimate: expect.closeTo(-100, 10),
      lower: expect.closeTo(-150, 10),
      upper: expect.closeTo(0, 10),
    });
  });
});
