// τ² by restricted maximum likelihood (server/core/nma/reml.ts, METHODS.md §3), against metafor
// 3.8.1's rma.mv (REML) on the open smoking-cessation network as log odds ratios
// (tests/fixtures/reference/hasselblad1998.expected.json).
import { describe, expect, it } from "vitest";
import { fitAt } from "#core/nma/model";
import { estimateTau2, remlTolerance } from "#core/nma/reml";
import { smokingBlocks, smokingExpected as expected } from "#tests/support/smoking-network";

describe("the REML estimate of τ²", () => {
  const { blocks, parameters } = smokingBlocks();
  const fixed = fitAt(blocks, parameters, 0);
  const fit = estimateTau2(blocks, parameters, fixed);

  it("is metafor's 0.450230 to six decimals", () => {
    expect(fit.tau2).toBeCloseTo(expected.random.tau2, 6);
  });

  it("is where the restricted likelihood's slope is zero, and its highest point nearby", () => {
    expect(Math.abs(fit.score)).toBeLessThan(1e-4);
    const below = fitAt(blocks, parameters, fit.tau2 * 0.9).restrictedLogLikelihood;
    const above = fitAt(blocks, parameters, fit.tau2 * 1.1).restrictedLogLikelihood;
    expect(fit.restrictedLogLikelihood).toBeGreaterThan(below);
    expect(fit.restrictedLogLikelihood).toBeGreaterThan(above);
    expect(remlTolerance).toBe(1e-8);
  });
});
