// One comparison read in either direction (server/core/nma/comparison.ts): b vs a is a vs b with
// every estimate's sign turned and every interval's ends swapped; tests and shares read the same.
import { describe, expect, it } from "vitest";
import type { AnalysisResult, Comparison } from "#core/nma/analyse";
import { comparisonOf } from "#core/nma/comparison";

const listed: Comparison = {
  treatment: "light",
  comparator: "usual_care",
  network: { estimate: 0.4, se: 0.1, lower: 0.204004, upper: 0.595996, predictionLower: -0.1, predictionUpper: 0.9 },
  direct: { estimate: 0.5, se: 0.2, studies: 3 },
  indirect: { estimate: 0.233333, se: 0.11547 },
  incoherence: { z: 1.154701, p: 0.248213 },
  directShare: 0.25,
  importance: [],
  riskOfBias: null,
} as Comparison;
const result = { comparisons: [listed] } as unknown as AnalysisResult;

describe("a comparison", () => {
  it("reads as listed in the result's order", () => {
    expect(comparisonOf(result, "light", "usual_care")).toEqual(listed);
  });

  it("reads the other way with signs turned and interval ends swapped", () => {
    expect(comparisonOf(result, "usual_care", "light")).toEqual({
      treatment: "usual_care",
      comparator: "light",
      network: { estimate: -0.4, se: 0.1, lower: -0.595996, upper: -0.204004, predictionLower: -0.9, predictionUpper: 0.1 },
      direct: { estimate: -0.5, se: 0.2, studies: 3 },
      indirect: { estimate: -0.233333, se: 0.11547 },
      incoherence: { z: -1.154701, p: 0.248213 },
      directShare: 0.25,
      importance: [],
      riskOfBias: null,
    });
  });

  it("is absent for a pair the result does not hold", () => {
    expect(comparisonOf(result, "light", "walking")).toBeNull();
  });
});
