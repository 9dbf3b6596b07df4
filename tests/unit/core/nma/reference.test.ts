// The engine against tests/fixtures/reference/: values computed with the R package metafor 3.8-1
// (rma.mv, REML, correlation ½) following METHODS.md exactly — see that folder's README.
// Tolerances from METHODS.md §12: fixed-effect and network values 1e-6 relative, τ² and REML-based values 1e-5.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, type AnalysisResult } from "#core/nma/analyse";
import { comparisonOf } from "#core/nma/comparison";
import { parseDataset } from "#core/nma/parse";
import type { Better, Format, Measure } from "#core/nma/types";

const referenceFolder = path.resolve(__dirname, "../../../fixtures/reference");

interface ExpectedEstimate {
  estimate: number;
  se: number;
}
interface Expected {
  treatments: string[];
  reference: string;
  studies: number;
  heterogeneity: { Q: number; df: number; I2: number };
  inconsistency: { Qwithin: number; dfWithin: number; Qbetween: number; dfBetween: number };
  fixed: ModelExpected;
  random: ModelExpected;
}
interface ModelExpected {
  tau2: number;
  comparisons: {
    treatment: string;
    comparator: string;
    network: ExpectedEstimate;
    direct: (ExpectedEstimate & { studies: number }) | null;
    indirect: ExpectedEstimate | null;
    /** Only in the files computed by compute-binary.R. */
    incoherence?: { z: number; p: number } | null;
  }[];
  ranking: { pScore: Record<string, number>; sucra?: Record<string, number>; sucraDraws?: number };
}

function closeTo(actual: number | undefined, expected: number, relative: number, what: string) {
  const error = Math.abs((actual ?? Number.NaN) - expected) / Math.max(Math.abs(expected), 1e-12);
  expect(error, `${what}: ${actual} vs ${expected}`).toBeLessThanOrEqual(relative);
}

const cases: { file: string; data: string; format: Format; measure: Measure; better: Better; source: string }[] = [
  { file: "hasselblad1998", data: "hasselblad1998", format: "arm-binary", measure: "OR", better: "higher", source: "Hasselblad 1998 smoking cessation, metafor 3.8-1" },
  { file: "senn2013", data: "senn2013", format: "arm-continuous", measure: "MD", better: "lower", source: "Senn et al. 2013 HbA1c, metafor 3.8-1" },
  // The same open smoking data as a risk ratio and a risk difference (compute-binary.R in that folder).
  { file: "hasselblad1998-rr", data: "hasselblad1998", format: "arm-binary", measure: "RR", better: "higher", source: "Hasselblad 1998 as RR, metafor 3.8-1" },
  { file: "hasselblad1998-rd", data: "hasselblad1998", format: "arm-binary", measure: "RD", better: "higher", source: "Hasselblad 1998 as RD, metafor 3.8-1" },
];

for (const { file, data, format, measure, better, source } of cases) {
  describe(`${file} (${source})`, () => {
    const expected = JSON.parse(readFileSync(path.join(referenceFolder, `${file}.expected.json`), "utf8")) as Expected;
    const dataset = parseDataset(readFileSync(path.join(referenceFolder, `${data}.csv`)), format);
    const results: Record<"fixed" | "random", AnalysisResult> = {
      fixed: analyse(dataset, { measure, model: "fixed", reference: expected.reference, better }),
      random: analyse(dataset, { measure, model: "random", reference: expected.reference, better }),
    };

    it("uses the same treatments and number of studies", () => {
      expect(results.fixed.treatments).toEqual(expected.treatments);
      expect(results.fixed.studies).toBe(expected.studies);
    });

    it("matches Q, df and I² of the fixed-effect fit (METHODS.md §4)", () => {
      const { heterogeneity } = results.fixed;
      closeTo(heterogeneity.Q, expected.heterogeneity.Q, 1e-6, "Q");
      expect(heterogeneity.df).toBe(expected.heterogeneity.df);
      closeTo(heterogeneity.I2, expected.heterogeneity.I2, 1e-6, "I²");
    });

    it("matches the decomposition of Q within and between designs (METHODS.md §4)", () => {
      const { inconsistency } = results.fixed;
      closeTo(inconsistency.Qwithin, expected.inconsistency.Qwithin, 1e-6, "Q within");
      closeTo(inconsistency.Qbetween, expected.inconsistency.Qbetween, 1e-6, "Q between");
      expect(inconsistency.dfWithin).toBe(expected.inconsistency.dfWithin);
      expect(inconsistency.dfBetween).toBe(expected.inconsistency.dfBetween);
    });

    for (const model of ["fixed", "random"] as const) {
      const tolerance = model === "fixed" ? 1e-6 : 1e-5;
      const modelExpected = expected[model];

      it(`${model}: τ² ${model === "random" ? "by REML " : ""}matches`, () => {
        if (model === "fixed") expect(results.fixed.tau2).toBe(0);
        else closeTo(results.random.tau2, modelExpected.tau2, 1e-5, "τ²");
      });

      it(`${model}: network, direct and indirect estimates and SEs match for every pair (§3, §5)`, () => {
        expect(results[model].comparisons).toHaveLength(modelExpected.comparisons.length);
        for (const pair of modelExpected.comparisons) {
          const label = `${pair.treatment} vs ${pair.comparator}`;
          const actual = comparisonOf(results[model], pair.treatment, pair.comparator)!;
          closeTo(actual.network.estimate, pair.network.estimate, tolerance, `${label} network`);
          closeTo(actual.network.se, pair.network.se, tolerance, `${label} network SE`);
          if (pair.direct) {
            closeTo(actual.direct?.estimate, pair.direct.estimate, tolerance, `${label} direct`);
            closeTo(actual.direct?.se, pair.direct.se, tolerance, `${label} direct SE`);
            expect(actual.direct?.studies, `${label} studies`).toBe(pair.direct.studies);
          } else {
            expect(actual.direct, `${label} direct`).toBeNull();
          }
          if (pair.indirect) {
            closeTo(actual.indirect?.estimate, pair.indirect.estimate, tolerance, `${label} indirect`);
            closeTo(actual.indirect?.se, pair.indirect.se, tolerance, `${label} indirect SE`);
          } else {
            expect(actual.indirect, `${label} indirect`).toBeNull();
          }
        }
      });

      it(`${model}: P-scores match (§6)`, () => {
        for (const [treatment, score] of Object.entries(modelExpected.ranking.pScore)) {
          closeTo(results[model].ranking.pScore[treatment], score, tolerance, `P-score of ${treatment}`);
        }
      });

      if (modelExpected.comparisons.some((pair) => pair.incoherence !== undefined)) {
        it(`${model}: the incoherence z and two-sided p of every pair with direct and indirect evidence match (§5)`, () => {
          for (const pair of modelExpected.comparisons) {
            const actual = comparisonOf(results[model], pair.treatment, pair.comparator)!.incoherence;
            if (!pair.incoherence) {
              expect(actual, `${pair.treatment} vs ${pair.comparator}`).toBeNull();
              continue;
            }
            closeTo(actual?.z, pair.incoherence.z, tolerance, `${pair.treatment} vs ${pair.comparator} z`);
            closeTo(actual?.p, pair.incoherence.p, tolerance, `${pair.treatment} vs ${pair.comparator} p`);
          }
        });
      }

      if (modelExpected.ranking.sucra) {
        // R's SUCRA from 100 000 draws of its own generator against ours from 10 000 seeded draws: two
        // Monte Carlo estimates of one value, whose difference has a standard deviation of at most
        // √(0.25/10 000 + 0.25/100 000) ≈ 0.0052; 0.02 is about four of them.
        it(`${model}: SUCRA from draws agrees with R's own draws within Monte Carlo error (§6)`, () => {
          for (const [treatment, sucra] of Object.entries(modelExpected.ranking.sucra!)) {
            expect(Math.abs(results[model].ranking.sucra[treatment]! - sucra), `SUCRA of ${treatment}: ${results[model].ranking.sucra[treatment]} vs ${sucra}`).toBeLessThanOrEqual(0.02);
          }
        });
      }
    }
  });
}

describe("published figures for the HbA1c network (second check, recalled from memory, two decimals)", () => {
  it("Q = 96.98 on 18 df, I² = 81.4%, Q between designs = 22.53 on 7 df", () => {
    const dataset = parseDataset(readFileSync(path.join(referenceFolder, "senn2013.csv")), "arm-continuous");
    const result = analyse(dataset, { measure: "MD", model: "fixed", reference: "placebo", better: "lower" });
    expect(result.heterogeneity.Q).toBeCloseTo(96.98, 2);
    expect(result.heterogeneity.df).toBe(18);
    expect(result.heterogeneity.I2 * 100).toBeCloseTo(81.4, 1);
    expect(result.inconsistency.Qbetween).toBeCloseTo(22.53, 2);
    expect(result.inconsistency.dfBetween).toBe(7);
  });
});

// METHODS.md §13 against tests/fixtures/reference/hasselblad1998-rob.expected.json: the same open data
// with an invented risk-of-bias column (labelled as invented in that folder's README), importances
// and direct risk-of-bias shares computed with metafor 3.8-1 and base R (leave-one-out fits with a
// generalised inverse). Tolerances: 1e-6 under fixed effect, 1e-4 under random effects.
describe("hasselblad1998-rob: study importance and risk of bias of direct estimates (§13, metafor 3.8-1 + base R)", () => {
  interface RobExpected {
    riskOfBias: { low: number; someConcerns: number; high: number; notAssessed: number; suggestedLevels: number | null } | null;
    importance: { study: string; value: number }[];
  }
  const expected = JSON.parse(readFileSync(path.join(referenceFolder, "hasselblad1998-rob.expected.json"), "utf8")) as Record<"fixed" | "random", { tau2: number; comparisons: (RobExpected & { treatment: string; comparator: string })[] }>;
  const dataset = parseDataset(readFileSync(path.join(referenceFolder, "hasselblad1998-rob.csv")), "arm-binary");

  for (const [model, tolerance] of [["fixed", 1e-6], ["random", 1e-4]] as const) {
    const result = analyse(dataset, { measure: "OR", model, reference: "no_contact", better: "higher" });

    it(`${model}: the ten most important studies of every pair, in order, with their importances`, () => {
      expect(result.comparisons).toHaveLength(expected[model].comparisons.length);
      for (const pair of expected[model].comparisons) {
        const label = `${pair.treatment} vs ${pair.comparator}`;
        const actual = comparisonOf(result, pair.treatment, pair.comparator)!;
        expect(actual.importance.map((s) => s.study), `${label} studies`).toEqual(pair.importance.map((s) => s.study));
        pair.importance.forEach((s, i) => closeTo(actual.importance[i]?.value, s.value, tolerance, `${label} importance of ${s.study}`));
      }
    });

    it(`${model}: the risk-of-bias shares of every direct estimate and the suggested levels`, () => {
      for (const pair of expected[model].comparisons) {
        const label = `${pair.treatment} vs ${pair.comparator}`;
        const actual = comparisonOf(result, pair.treatment, pair.comparator)!.riskOfBias;
        if (!pair.riskOfBias) {
          expect(actual, label).toBeNull();
          continue;
        }
        for (const level of ["low", "someConcerns", "high", "notAssessed"] as const) {
          expect(Math.abs(actual![level] - pair.riskOfBias[level]), `${label} ${level}`).toBeLessThanOrEqual(tolerance);
        }
        expect(actual!.suggestedLevels, `${label} suggestion`).toBe(pair.riskOfBias.suggestedLevels);
      }
    });
  }

  it("without the column, no direct estimate has risk-of-bias shares", () => {
    const plain = parseDataset(readFileSync(path.join(referenceFolder, "hasselblad1998.csv")), "arm-binary");
    const result = analyse(plain, { measure: "OR", model: "fixed", reference: "no_contact", better: "higher" });
    expect(result.comparisons.map((c) => c.riskOfBias)).toEqual(result.comparisons.map(() => null));
    expect(result.comparisons.every((c) => c.importance.length > 0)).toBe(true);
  });
});
