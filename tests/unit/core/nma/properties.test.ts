// Properties the model must have whatever the data (fast-check generates invented networks).
import fc from "fast-check";
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, type AnalysisResult } from "#core/nma/analyse";
import { comparisonOf } from "#core/nma/comparison";
import { parseDataset } from "#core/nma/parse";
import type { AnalysisOptions } from "#core/nma/types";

interface Arm {
  treatment: string;
  events: number;
  total: number;
}
type Study = Arm[];

const names = ["t0", "t1", "t2", "t3", "t4", "t5"];

/** A connected network: a chain t0–t1–…–t(T−1) plus extra studies, some with three arms. */
const networks = fc.integer({ min: 3, max: 6 }).chain((T) => {
  const arm = (treatment: string) =>
    fc.integer({ min: 20, max: 400 }).chain((total) => fc.integer({ min: 1, max: total - 1 }).map((events) => ({ treatment, events, total })));
  const chain = Array.from({ length: T - 1 }, (_, i) => fc.tuple(arm(names[i]!), arm(names[i + 1]!)));
  const extra = fc.array(
    fc.uniqueArray(fc.integer({ min: 0, max: T - 1 }), { minLength: 2, maxLength: 3 }).chain((ids) => fc.tuple(...ids.map((i) => arm(names[i]!)))),
    { minLength: 1, maxLength: 8 },
  );
  return fc.tuple(fc.tuple(...chain), extra).map(([a, b]) => [...a, ...b] as Study[]);
});

function toCsv(studies: Study[], rename: (t: string) => string = (t) => t, label: (s: number) => string = (s) => `S${s}`): string {
  const rows = studies.flatMap((arms, s) => arms.map((a) => `${label(s)},${rename(a.treatment)},${a.events},${a.total}`));
  return `study,treatment,events,total\n${rows.join("\n")}\n`;
}

/** Networks of two treatments only: one to fourteen two-arm studies of t0 and t1. */
const twoArm = fc.array(
  fc.tuple(fc.integer({ min: 20, max: 300 }), fc.integer({ min: 20, max: 300 })).chain(([n1, n2]) =>
    fc.tuple(fc.integer({ min: 1, max: n1 - 1 }), fc.integer({ min: 1, max: n2 - 1 })).map(([e1, e2]) => [
      { treatment: "t0", events: e1, total: n1 },
      { treatment: "t1", events: e2, total: n2 },
    ]),
  ),
  { minLength: 1, maxLength: 14 },
);

const options: AnalysisOptions = { measure: "OR", model: "random", reference: "t0", better: "higher", draws: 200 };
const run = (csv: string, overrides: Partial<AnalysisOptions> = {}) => analyse(parseDataset(csv, "arm-binary"), { ...options, ...overrides });

function expectSameEstimates(a: AnalysisResult, b: AnalysisResult, mapName: (t: string) => string = (t) => t) {
  expect(b.tau2).toBeCloseTo(a.tau2, 6);
  for (const pair of a.comparisons) {
    const other = comparisonOf(b, mapName(pair.treatment), mapName(pair.comparator))!;
    expect(other.network.estimate).toBeCloseTo(pair.network.estimate, 6);
    expect(other.network.se).toBeCloseTo(pair.network.se, 6);
    if (pair.direct) expect(other.direct?.estimate).toBeCloseTo(pair.direct.estimate, 6);
    else expect(other.direct).toBeNull();
  }
  expect(b.heterogeneity.Q).toBeCloseTo(a.heterogeneity.Q, 6);
}

describe("invariance", () => {
  it("does not depend on the order of the studies", () => {
    fc.assert(
      fc.property(networks, (studies) => {
        expectSameEstimates(run(toCsv(studies)), run(toCsv([...studies].reverse())));
      }),
      { numRuns: 25 },
    );
  });

  it("does not depend on the order of the arms within a study (the baseline arm)", () => {
    fc.assert(
      fc.property(networks, (studies) => {
        expectSameEstimates(run(toCsv(studies)), run(toCsv(studies.map((arms) => [...arms].reverse()))));
      }),
      { numRuns: 25 },
    );
  });

  it("does not depend on the treatments' names, even when renaming changes their sorted order", () => {
    const rename = (t: string) => `z${9 - Number(t.slice(1))}`; // t0 → z9, t1 → z8: the order reverses
    fc.assert(
      fc.property(networks, (studies) => {
        const renamed = run(toCsv(studies, rename), { reference: rename("t0") });
        expectSameEstimates(run(toCsv(studies)), renamed, rename);
      }),
      { numRuns: 25 },
    );
  });

  it("gives the same network estimates whichever treatment is the reference", () => {
    fc.assert(
      fc.property(networks, (studies) => {
        expectSameEstimates(run(toCsv(studies)), run(toCsv(studies), { reference: "t1" }));
      }),
      { numRuns: 15 },
    );
  });
});

/** The same studies with the same importances, to 6 decimals (METHODS.md §13), for every pair. */
function expectSameImportances(a: AnalysisResult, b: AnalysisResult, mapName: (t: string) => string = (t) => t) {
  for (const pair of a.comparisons) {
    const other = comparisonOf(b, mapName(pair.treatment), mapName(pair.comparator))!;
    const values = new Map(other.importance.map((s) => [s.study, s.value]));
    // The tenth place may hold a different study of (nearly) the same importance; the first nine may not.
    for (const study of pair.importance.slice(0, 9)) expect(values.get(study.study), `${pair.treatment} vs ${pair.comparator}, ${study.study}`).toBeCloseTo(study.value, 6);
  }
}

describe("study importance (METHODS.md §13)", () => {
  it("does not depend on the order of the studies or the treatments' names", () => {
    const rename = (t: string) => `z${9 - Number(t.slice(1))}`;
    fc.assert(
      fc.property(networks, (studies) => {
        const label = (s: number) => `S${s}`;
        const base = run(toCsv(studies));
        const reversed = run(toCsv([...studies].reverse(), undefined, (s) => label(studies.length - 1 - s)));
        expectSameImportances(base, reversed);
        expectSameImportances(base, run(toCsv(studies, rename), { reference: rename("t0") }), rename);
      }),
      { numRuns: 20 },
    );
  });

  it("in a network of two treatments equals each study's share of the inverse-variance weight", () => {
    fc.assert(
      fc.property(twoArm, fc.constantFrom("fixed" as const, "random" as const), (studies, model) => {
        const result = run(toCsv(studies), { model });
        const weights = studies.map(([a, b]) => 1 / (1 / a!.events + 1 / (a!.total - a!.events) + 1 / b!.events + 1 / (b!.total - b!.events) + result.tau2));
        const total = weights.reduce((x, y) => x + y, 0);
        const expected = weights
          .map((w, s) => ({ study: `S${s}`, value: w / total }))
          .filter((s) => s.value >= 0.001)
          .sort((x, y) => y.value - x.value || (x.study < y.study ? -1 : 1))
          .slice(0, 10);
        const actual = comparisonOf(result, "t1", "t0")!.importance;
        expect(actual.map((s) => s.study)).toEqual(expected.map((s) => s.study));
        actual.forEach((s, i) => expect(s.value).toBeCloseTo(expected[i]!.value, 10));
      }),
      { numRuns: 60 },
    );
  });

  it("is 1 for a study that is the only link to a treatment, and absent where that treatment is not in the pair", () => {
    // t0 appears in the first study of the chain alone: the extra studies avoid it.
    const avoiding = networks.filter((studies) => studies.slice(1).every((arms) => arms.every((a) => a.treatment !== "t0")));
    fc.assert(
      fc.property(avoiding, fc.constantFrom("fixed" as const, "random" as const), (studies, model) => {
        const result = run(toCsv(studies), { model });
        for (const pair of result.comparisons) {
          const only = pair.importance.find((s) => s.study === "S0");
          if (pair.treatment === "t0" || pair.comparator === "t0") expect(only?.value).toBe(1);
          else expect(only).toBeUndefined();
        }
      }),
      { numRuns: 30 },
    );
  });

  it("is 1 for a bridge: the only study between two parts of the network", () => {
    // t0–t1 and t2–t3 are joined by one study of t1 and t2.
    const csv = "study,treatment,events,total\nA1,t0,10,50\nA1,t1,15,50\nA2,t0,12,60\nA2,t1,20,60\nB,t1,14,55\nB,t2,9,55\nC1,t2,8,40\nC1,t3,13,40\nC2,t2,11,45\nC2,t3,16,45\n";
    const result = run(csv, { model: "fixed" });
    expect(comparisonOf(result, "t0", "t3")!.importance[0]).toEqual({ study: "B", value: 1 });
    expect(comparisonOf(result, "t1", "t2")!.importance[0]).toEqual({ study: "B", value: 1 });
    expect(comparisonOf(result, "t0", "t1")!.importance.map((s) => s.study).sort()).toEqual(["A1", "A2"]);
  });
});

describe("antisymmetry", () => {
  it('"A vs B" is −("B vs A") with the same SE', () => {
    fc.assert(
      fc.property(networks, (studies) => {
        const result = run(toCsv(studies));
        for (const pair of result.comparisons) {
          const reversed = comparisonOf(result, pair.comparator, pair.treatment)!;
          expect(reversed.network.estimate).toBe(-pair.network.estimate);
          expect(reversed.network.se).toBe(pair.network.se);
          expect(reversed.network.lower).toBe(-pair.network.upper);
        }
      }),
      { numRuns: 10 },
    );
  });
});

describe("two treatments", () => {
  it("the network estimate is the inverse-variance pooled estimate of the studies", () => {
    fc.assert(
      fc.property(twoArm, fc.constantFrom("fixed" as const, "random" as const), (studies, model) => {
        const result = run(toCsv(studies), { model });
        let weight = 0;
        let weighted = 0;
        for (const [a, b] of studies) {
          const y = Math.log(b!.events / (b!.total - b!.events)) - Math.log(a!.events / (a!.total - a!.events));
          const v = 1 / a!.events + 1 / (a!.total - a!.events) + 1 / b!.events + 1 / (b!.total - b!.events) + result.tau2;
          weight += 1 / v;
          weighted += y / v;
        }
        const t1VsT0 = comparisonOf(result, "t1", "t0")!;
        expect(t1VsT0.network.estimate).toBeCloseTo(weighted / weight, 10);
        expect(t1VsT0.network.se).toBeCloseTo(Math.sqrt(1 / weight), 10);
      }),
      { numRuns: 60 },
    );
  });
});

describe("a single study", () => {
  it("has no degrees of freedom for heterogeneity, so the random-effects τ² is 0 (found by fast-check)", () => {
    const result = run(toCsv([[{ treatment: "t0", events: 6, total: 20 }, { treatment: "t1", events: 52, total: 96 }]]));
    expect(result.heterogeneity.df).toBe(0);
    expect(result.tau2).toBe(0);
    expect(comparisonOf(result, "t1", "t0")!.network.estimate).toBeCloseTo(Math.log(52 / 44) - Math.log(6 / 14), 12);
  });
});

describe("SUCRA and P-score", () => {
  const referenceFolder = path.resolve(__dirname, "../../../fixtures/reference");

  it("agree within 0.01 at 100 000 draws (equal in expectation; Rücker & Schwarzer 2015), on both reference networks", () => {
    const sets = [
      { file: "hasselblad1998.csv", format: "arm-binary", measure: "OR", reference: "no_contact", better: "higher" },
      { file: "senn2013.csv", format: "arm-continuous", measure: "MD", reference: "placebo", better: "lower" },
    ] as const;
    for (const set of sets) {
      const dataset = parseDataset(readFileSync(path.join(referenceFolder, set.file)), set.format);
      const result = analyse(dataset, { ...set, model: "random", draws: 100_000, seed: 1 });
      for (const t of result.treatments) {
        expect(Math.abs(result.ranking.sucra[t]! - result.ranking.pScore[t]!), `${set.file} ${t}`).toBeLessThan(0.01);
      }
    }
  });

  it("agree within 0.01 at 100 000 draws on invented networks", () => {
    fc.assert(
      fc.property(networks, (studies) => {
        const result = run(toCsv(studies), { draws: 100_000 });
        for (const t of result.treatments) expect(Math.abs(result.ranking.sucra[t]! - result.ranking.pScore[t]!)).toBeLessThan(0.01);
      }),
      { numRuns: 5 },
    );
  });

  it("the same seed gives the same draws; the seed and draws are recorded", () => {
    const csv = readFileSync(path.join(referenceFolder, "hasselblad1998.csv"));
    const settings = { measure: "OR", model: "random", reference: "no_contact", better: "higher", draws: 2000, seed: 7 } as const;
    const first = analyse(parseDataset(csv, "arm-binary"), settings);
    const second = analyse(parseDataset(csv, "arm-binary"), settings);
    expect(second.ranking).toEqual(first.ranking);
    expect(first.ranking).toMatchObject({ draws: 2000, seed: 7 });
    const other = analyse(parseDataset(csv, "arm-binary"), { ...settings, seed: 8 });
    expect(other.ranking.sucra).not.toEqual(first.ranking.sucra);
  });
});
