// What a version says about an outcome: groups with labels, a statement and an absolute effect for
// every comparison in both directions (METHODS.md §7, §9, §10).
import { describe, expect, it } from "vitest";
import { createI18n } from "#components/i18n";
import type { ComparisonCertainty } from "#core/grade/assess";
import type { Rating } from "#core/grade/certainty";
import { concludeOutcome, magnitudeFor } from "#core/grade/conclusions";
import { comparisonOf } from "#core/nma/comparison";
import { inventedResult } from "#tests/support/invented-network";

const result = inventedResult;
const rated = (rating: Rating): ComparisonCertainty[] =>
  result.comparisons.map((c) => ({ treatment: c.treatment, comparator: c.comparator, network: rating }) as ComparisonCertainty);
const names = { placebo: "Placebo", alpha: "Alpha", beta: "Beta" };
const none = { small: null, moderate: null, large: null };
const t = createI18n("en").t;

describe("conclusions of an outcome", () => {
  it("uses the minimally contextualised framework without thresholds and the partial one with them", () => {
    expect(concludeOutcome(result, rated("high"), { name: "Response", baselineRisk: 0.2, thresholds: none, names }).framework).toBe("minimal");
    expect(concludeOutcome(result, rated("high"), { name: "Response", baselineRisk: 0.2, thresholds: { small: 0.2, moderate: null, large: null }, names }).framework).toBe("partial");
  });

  it("reads every comparison in both directions, with opposite wording", () => {
    const { readings } = concludeOutcome(result, rated("moderate"), { name: "Response to treatment", baselineRisk: 0.2, thresholds: none, names });
    expect(readings).toHaveLength(3 * 2);
    const alpha = readings.find((r) => r.treatment === "alpha" && r.comparator === "placebo")!;
    const placebo = readings.find((r) => r.treatment === "placebo" && r.comparator === "alpha")!;
    // Alpha's CI excludes the null here (about OR 2.3), so without thresholds the wording is the unqualified one.
    expect(comparisonOf(result, "alpha", "placebo")!.network.lower).toBeGreaterThan(0);
    expect(t(alpha.statement!.key, alpha.statement!.values)).toBe("Alpha probably increases response to treatment compared with Placebo.");
    expect(t(placebo.statement!.key, placebo.statement!.values)).toBe("Placebo probably reduces response to treatment compared with Alpha.");
  });

  it("gives the absolute effect per 1000 from the baseline risk (METHODS.md §7, worked by hand here)", () => {
    const { readings } = concludeOutcome(result, rated("high"), { name: "Response", baselineRisk: 0.2, thresholds: none, names });
    const alpha = readings.find((r) => r.treatment === "alpha" && r.comparator === "placebo")!;
    const or = Math.exp(comparisonOf(result, "alpha", "placebo")!.network.estimate);
    const p1 = (or * 0.2) / (1 - 0.2 + or * 0.2);
    expect(alpha.absolute!.baselinePer1000).toBeCloseTo(200, 10);
    expect(alpha.absolute!.differencePer1000.estimate).toBeCloseTo(1000 * (p1 - 0.2), 10);
    expect(alpha.absolute!.statement.key).toBe("statement.absolute.more");
    // Beta vs Alpha: the comparator's risk is Alpha's, taken from the baseline through Alpha vs placebo.
    const beta = readings.find((r) => r.treatment === "beta" && r.comparator === "alpha")!;
    expect(beta.absolute!.baselinePer1000).toBeCloseTo(1000 * p1, 10);
  });

  it("has no absolute effect without a baseline risk, and no statement for an unrated comparison", () => {
    const { readings } = concludeOutcome(result, [], { name: "Response", baselineRisk: null, thresholds: none, names });
    expect(readings.every((r) => r.absolute === null && r.statement === null && r.certainty === null)).toBe(true);
  });

  it("without thresholds, says an interval that includes the null does not show a clear difference, never “little to no difference” (METHODS.md §10)", () => {
    const { readings } = concludeOutcome(result, rated("moderate"), { name: "Response to treatment", baselineRisk: 0.2, thresholds: none, names });
    const beta = readings.find((r) => r.treatment === "beta" && r.comparator === "alpha")!;
    const network = comparisonOf(result, "beta", "alpha")!.network;
    expect(network.lower).toBeLessThan(0);
    expect(network.upper).toBeGreaterThan(0);
    expect(t(beta.statement!.key, beta.statement!.values)).toBe("Beta probably does not show a clear difference in response to treatment compared with Alpha.");
    expect(createI18n("es").t(beta.statement!.key, beta.statement!.values)).toBe("Beta probablemente no muestra una diferencia clara en response to treatment en comparación con Alpha.");
  });

  it("hedges a group of moderate certainty with “probably”, and says “not shown to differ” of the group with the reference (METHODS.md §10)", () => {
    const labels = (rating: Rating) => concludeOutcome(result, rated(rating), { name: "Response", baselineRisk: 0.2, thresholds: none, names }).groups.map((g) => t(g.label.key, g.label.values));
    expect(labels("high")[0]).toBe("Among the most effective");
    expect(labels("moderate")[0]).toBe("Probably among the most effective");
    expect(labels("low")[0]).toBe("May be among the most effective");
    expect(t("groups.minimal.none.firm", { reference: "Placebo" })).toBe("Not shown to differ from Placebo");
  });

  it("speaks of harm, not effectiveness, for an outcome that measures a harm (METHODS.md §10)", () => {
    const labels = (rating: Rating, locale: "en" | "fr") =>
      concludeOutcome(result, rated(rating), { name: "Falls", baselineRisk: 0.2, thresholds: none, names, measuresHarm: true }).groups.map((g) => createI18n(locale).t(g.label.key, g.label.values));
    expect(labels("high", "en")[0]).toBe("Among the least harmful");
    expect(labels("moderate", "en")[0]).toBe("Probably among the least harmful");
    expect(labels("low", "fr")[0]).toBe("Pourrait être parmi les moins nocifs");
    const partial = concludeOutcome(result, rated("high"), { name: "Falls", baselineRisk: 0.2, thresholds: { small: 20, moderate: null, large: null }, names, measuresHarm: true }).groups;
    expect(t(partial[0]!.label.key, partial[0]!.label.values)).toBe("Slightly less harm than Placebo");
  });

  it("labels every group with words the locale has", () => {
    for (const thresholds of [none, { small: 0.2, moderate: 0.5, large: 1 }]) {
      for (const rating of ["high", "low", "very_low"] as const) {
        const { groups } = concludeOutcome(result, rated(rating), { name: "Response", baselineRisk: 0.2, thresholds, names });
        for (const group of groups) expect(t(group.label.key, group.label.values)).not.toBe(group.label.key);
      }
    }
    const { groups } = concludeOutcome(result, rated("low"), { name: "Response", baselineRisk: 0.2, thresholds: none, names });
    expect(groups.map((g) => t(g.label.key, g.label.values))[0]).toMatch(/^May be among the most effective/);
  });
});

describe("the size of an effect for its statement", () => {
  it("follows the thresholds when there are any (METHODS.md §10)", () => {
    const thresholds = { small: 0.1, moderate: 0.3, large: 0.6 };
    expect(magnitudeFor({ estimate: 0.35, lower: -0.1, upper: 0.8 }, thresholds)).toBe("moderate");
    expect(magnitudeFor({ estimate: -0.05, lower: -0.2, upper: 0.1 }, thresholds)).toBe("trivial");
    expect(magnitudeFor({ estimate: 0.7, lower: 0.65, upper: 0.75 }, { small: 0.1, moderate: null, large: null })).toBe("small");
  });

  it("without thresholds, is unclear when the CI includes the null and gives the direction alone otherwise (METHODS.md §10)", () => {
    expect(magnitudeFor({ estimate: 0.2, lower: -0.1, upper: 0.5 }, none)).toBe("unclear");
    expect(magnitudeFor({ estimate: 0.2, lower: 0.1, upper: 0.3 }, none)).toBe("moderate");
  });
});

describe("statements with the outcome's own phrase", () => {
  it("read naturally in both directions: 'may slightly increase the chance of …' and its mirror", () => {
    const low = result.comparisons.map((c) => ({ treatment: c.treatment, comparator: c.comparator, network: "low" }) as ComparisonCertainty);
    // Alpha is about 201 more per 1000 than placebo at a baseline of 200 (tests/unit/core/grade/decision-scale.test.ts): a small effect against 100 / 300 / 500.
    const { readings } = concludeOutcome(result, low, {
      name: "Free of pain at 2 hours",
      statementPhrase: "the chance of being free of pain two hours after one dose",
      baselineRisk: 0.2,
      thresholds: { small: 100, moderate: 300, large: 500 },
      names,
    });
    const say = (t1: string, t2: string) => {
      const statement = readings.find((r) => r.treatment === t1 && r.comparator === t2)!.statement!;
      return t(statement.key, statement.values);
    };
    expect(say("alpha", "placebo")).toBe("Alpha may slightly increase the chance of being free of pain two hours after one dose compared with Placebo.");
    expect(say("placebo", "alpha")).toBe("Placebo may slightly reduce the chance of being free of pain two hours after one dose compared with Alpha.");
  });
});
