// A three-treatment triangle worked by hand (fixed effect, METHODS.md §3–5), arithmetic shown.
//
// Contrast studies, reference A, parameters d_B = θ_B − θ_A and d_C = θ_C − θ_A:
//   S1: B vs A, y = 1.0, se 0.5 → variance 0.25, weight 4
//   S2: C vs A, y = 2.0, se 0.5 → variance 0.25, weight 4
//   S3: C vs B, y = 0.5, se 1.0 → variance 1,    weight 1
// Rows of X: S1 (1, 0), S2 (0, 1), S3 (−1, 1).
//   XᵀWX = [[4 + 1, −1], [−1, 4 + 1]] = [[5, −1], [−1, 5]];  (XᵀWX)⁻¹ = (1/24)·[[5, 1], [1, 5]]
//   XᵀWy = (4·1 − 1·0.5, 4·2 + 1·0.5) = (3.5, 8.5)
//   β̂ = (1/24)·(5·3.5 + 8.5, 3.5 + 5·8.5) = (26/24, 46/24) = (1.083333…, 1.916666…)
//   Var(d_B) = Var(d_C) = 5/24, Cov = 1/24; C vs B = 20/24 = 0.833333…, variance (5 + 5 − 2)/24 = 1/3
// Residuals −1/12, 1/12, −1/3: Q = 4/144 + 4/144 + 1/9 = 1/6 on 3 − 2 = 1 df.
//   (The loop's incoherence squared over its variance: (2 − 1.5)² / (0.25 + 0.25 + 1) = 1/6.)
// B vs A by back-calculation (§5): 1/v_I = 24/5 − 4 = 0.8 → v_I = 1.25;
//   d_I = 1.25·(26/24 · 24/5 − 1·4) = 1.25·1.2 = 1.5 (= 2.0 − 0.5 through C); z = (1 − 1.5)/√1.5; direct share (5/24)/0.25 = 5/6.
import { describe, expect, it } from "vitest";
import { analyse } from "#core/nma/analyse";
import { comparisonOf } from "#core/nma/comparison";
import { parseDataset } from "#core/nma/parse";

const csv = "study,treatment1,treatment2,estimate,se\nS1,B,A,1.0,0.5\nS2,C,A,2.0,0.5\nS3,C,B,0.5,1.0\n";
const result = analyse(parseDataset(csv, "contrast"), { measure: "MD", model: "fixed", reference: "A", better: "higher" });

describe("a triangle worked by hand", () => {
  it("network estimates and variances", () => {
    const bA = comparisonOf(result, "B", "A")!;
    const cA = comparisonOf(result, "C", "A")!;
    const cB = comparisonOf(result, "C", "B")!;
    expect(bA.network.estimate).toBeCloseTo(26 / 24, 12);
    expect(cA.network.estimate).toBeCloseTo(46 / 24, 12);
    expect(bA.network.se ** 2).toBeCloseTo(5 / 24, 12);
    expect(cB.network.estimate).toBeCloseTo(20 / 24, 12);
    expect(cB.network.se ** 2).toBeCloseTo(1 / 3, 12);
    expect(cB.network.lower).toBeCloseTo(20 / 24 - 1.959964 * Math.sqrt(1 / 3), 12);
  });

  it("Q = 1/6 on 1 df, and the single design-free loop puts all of it between designs", () => {
    expect(result.heterogeneity.Q).toBeCloseTo(1 / 6, 12);
    expect(result.heterogeneity.df).toBe(1);
    expect(result.inconsistency.Qwithin).toBe(0);
    expect(result.inconsistency.Qbetween).toBeCloseTo(1 / 6, 12);
  });

  it("direct, back-calculated indirect, incoherence and direct share for B vs A", () => {
    const bA = comparisonOf(result, "B", "A")!;
    expect(bA.direct).toEqual({ estimate: 1, se: 0.5, studies: 1 });
    expect(bA.indirect!.estimate).toBeCloseTo(1.5, 12);
    expect(bA.indirect!.se ** 2).toBeCloseTo(1.25, 12);
    expect(bA.incoherence!.z).toBeCloseTo(-0.5 / Math.sqrt(1.5), 12);
    expect(bA.directShare).toBeCloseTo(5 / 6, 12);
  });

  it("lists each pair once, in the sorted order of treatment names", () => {
    expect(result.comparisons.map((c) => `${c.treatment}-${c.comparator}`)).toEqual(["A-B", "A-C", "B-C"]);
    expect(result.comparisons[0]!.network.estimate).toBeCloseTo(-26 / 24, 12);
  });
});
