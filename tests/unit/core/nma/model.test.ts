// The network model fitted by generalised least squares (server/core/nma/model.ts, METHODS.md §3),
// against metafor 3.8.1 (rma.mv) on the open smoking-cessation network, as log odds ratios
// (tests/fixtures/reference/hasselblad1998.expected.json; source in tests/fixtures/reference/README.md).
import { describe, expect, it } from "vitest";
import { fitAt, symmetrise } from "#core/nma/model";
import { smokingBlocks, smokingExpected as expected } from "#tests/support/smoking-network";

describe("the fixed-effect fit", () => {
  const { blocks, parameters } = smokingBlocks();
  const fixed = fitAt(blocks, parameters, 0);

  it("leaves metafor's Q as its weighted residual: 202.619 on 23 degrees of freedom", () => {
    expect(blocks).toHaveLength(24);
    expect(fixed.residual).toBeCloseTo(expected.heterogeneity.Q, 6);
    expect(blocks.reduce((sum, block) => sum + block.y.length, 0) - parameters).toBe(expected.heterogeneity.df);
  });

  it("has a symmetric covariance with positive variances", () => {
    expect(fixed.covariance).toEqual(symmetrise(fixed.covariance));
    for (let i = 0; i < parameters; i++) expect(fixed.covariance[i]![i]).toBeGreaterThan(0);
  });
});
