// Thresholds are read on the outcome's decision scale (METHODS.md §9): per 1000 people at the
// baseline risk for binary outcomes (through §7), never on the analysis scale.
import { describe, expect, it } from "vitest";
import type { ComparisonCertainty } from "#core/grade/assess";
import { concludeOutcome } from "#core/grade/conclusions";
import { decisionScale } from "#core/grade/decision-scale";
import { comparisonOf } from "#core/nma/comparison";
import { inventedResult } from "#tests/support/invented-network";

const result = inventedResult;
const moderate = result.comparisons.map((c) => ({ treatment: c.treatment, comparator: c.comparator, network: "moderate" }) as ComparisonCertainty);
const names = { placebo: "Placebo", alpha: "Alpha", beta: "Beta" };

describe("the decision scale of a binary outcome", () => {
  const scale = decisionScale(result, { small: 50, moderate: 100, large: 200 }, 0.2);

  it("states alpha vs placebo as the difference per 1000 at the baseline risk: 1000·(OR·p₀/(1 − p₀ + OR·p₀) − p₀)", () => {
    const or = Math.exp(comparisonOf(result, "alpha", "placebo")!.network.estimate);
    const byHand = 1000 * ((or * 0.2) / (1 - 0.2 + or * 0.2) - 0.2);
    expect(scale.effect("alpha", "placebo").estimate).toBeCloseTo(byHand, 10);
    expect(scale.unit).toBe("per1000");
  });

  it("compares with the per-1000 thresholds, not the log odds ratio: alpha is about 201 more per 1000, a moderate effect against 50 / 100 / 250", () => {
    // On the analysis scale its log odds ratio (about 0.98) is below every one of these thresholds and
    // would read "trivial": the false conclusion the stated scale prevents.
    expect(comparisonOf(result, "alpha", "placebo")!.network.estimate).toBeLessThan(50);
    const { readings, groups } = concludeOutcome(result, moderate, { name: "Response", baselineRisk: 0.2, thresholds: { small: 50, moderate: 100, large: 250 }, names });
    expect(readings.find((r) => r.treatment === "alpha" && r.comparator === "placebo")!.magnitude).toBe("moderate");
    expect(groups.find((g) => g.treatments.includes("alpha"))!.level).toBe(2);
  });

  it("without a baseline risk, a binary outcome's thresholds cannot be read: the minimally contextualised framework is used", () => {
    expect(decisionScale(result, { small: 50, moderate: 100, large: 200 }, null).thresholds).toBeNull();
    expect(concludeOutcome(result, moderate, { name: "Response", baselineRisk: null, thresholds: { small: 50, moderate: 100, large: 200 }, names }).framework).toBe("minimal");
  });
});

describe("unrated comparisons (METHODS.md §9)", () => {
  it("are never shown as rated: listed apart as not assessed, never as very low certainty", () => {
    const unrated = result.comparisons.map((c) => ({ treatment: c.treatment, comparator: c.comparator, network: c.treatment === "beta" || c.comparator === "beta" ? null : "high" }) as ComparisonCertainty);
    const { groups } = concludeOutcome(result, unrated, { name: "Response", baselineRisk: 0.2, thresholds: { small: null, moderate: null, large: null }, names });
    const beta = groups.find((g) => g.treatments.includes("beta"))!;
    expect(beta.firmness).toBe("not-assessed");
    expect(beta.label.key).toBe("groups.notAssessed");
    expect(groups.some((g) => g.firmness === "very-uncertain")).toBe(false);
  });
});
