// The full grid of plain-language statements: 4 certainty levels × 4 magnitudes × benefit or harm,
// against the wording of Santesso et al., GRADE guidelines 26, J Clin Epidemiol 2020;119:126–135
// (the phrases below are recalled from that paper's table of suggested statements; "slightly" stands
// before the verb, our wording, so that a long outcome phrase still reads naturally).
import { describe, expect, it } from "vitest";
import { createI18n, locales } from "#components/i18n";
import type { Rating } from "#core/grade/certainty";
import { absoluteStatement, magnitudeOf, statementFor, type Magnitude } from "#core/grade/statements";

const wording: Record<Exclude<Rating, "very_low">, Record<Magnitude, { reduce: string; increase: string }>> = {
  high: {
    large: { reduce: "results in a large reduction in pain", increase: "results in a large increase in pain" },
    moderate: { reduce: "reduces pain", increase: "increases pain" },
    small: { reduce: "slightly reduces pain", increase: "slightly increases pain" },
    trivial: { reduce: "results in little to no difference in pain", increase: "results in little to no difference in pain" },
  },
  moderate: {
    large: { reduce: "likely results in a large reduction in pain", increase: "likely results in a large increase in pain" },
    moderate: { reduce: "probably reduces pain", increase: "probably increases pain" },
    small: { reduce: "probably slightly reduces pain", increase: "probably slightly increases pain" },
    trivial: { reduce: "probably results in little to no difference in pain", increase: "probably results in little to no difference in pain" },
  },
  low: {
    large: { reduce: "may result in a large reduction in pain", increase: "may result in a large increase in pain" },
    moderate: { reduce: "may reduce pain", increase: "may increase pain" },
    small: { reduce: "may slightly reduce pain", increase: "may slightly increase pain" },
    trivial: { reduce: "may result in little to no difference in pain", increase: "may result in little to no difference in pain" },
  },
};

const magnitudes: Magnitude[] = ["large", "moderate", "small", "trivial"];

describe.each(locales)("statements in %s", (locale) => {
  const i18n = createI18n(locale);
  const say = (s: { key: string; values: Record<string, unknown> }) => i18n.t(s.key, s.values);

  for (const better of ["lower", "higher"] as const) {
    for (const effect of ["benefit", "harm"] as const) {
      // Where lower is better a benefit lowers the outcome; where higher is better it raises it.
      const change = (better === "lower") === (effect === "benefit") ? "reduce" : "increase";
      const estimate = change === "reduce" ? -0.5 : 0.5;
      for (const certainty of ["high", "moderate", "low"] as const) {
        for (const magnitude of magnitudes) {
          it(`${certainty} certainty, ${magnitude} ${effect} where ${better} is better`, () => {
            const statement = statementFor({ treatment: "Drug A", comparator: "placebo", outcome: "pain", estimate, certainty, magnitude });
            expect(say(statement)).toBe(`Drug A ${wording[certainty][magnitude][change]} compared with placebo.`);
          });
        }
      }
      it(`very low certainty, any magnitude, ${effect} where ${better} is better`, () => {
        for (const magnitude of magnitudes) {
          const statement = statementFor({ treatment: "Drug A", comparator: "placebo", outcome: "pain", estimate, certainty: "very_low", magnitude });
          expect(say(statement)).toBe("The evidence is very uncertain about the effect of Drug A on pain compared with placebo.");
        }
      });
    }
  }

  it("states the absolute effect per 1000 with its interval", () => {
    expect(say(absoluteStatement({ estimate: -23.4, lower: -40.2, upper: -3.6 }))).toBe("23 fewer per 1000 (from 40 fewer to 4 fewer)");
    expect(say(absoluteStatement({ estimate: 12.2, lower: -5.1, upper: 30 }))).toBe("12 more per 1000 (from 5 fewer to 30 more)");
  });
});

describe("magnitude from the outcome's thresholds", () => {
  const thresholds = { small: 0.1, moderate: 0.3, large: 0.6 };
  it("classifies the absolute size of the point estimate", () => {
    expect([0.05, -0.1, 0.29, -0.3, 0.59, 0.6, -2].map((x) => magnitudeOf(x, thresholds))).toEqual([
      "trivial", "small", "small", "moderate", "moderate", "large", "large",
    ]);
  });
});
