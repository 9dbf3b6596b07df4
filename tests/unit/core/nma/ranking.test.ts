// Rank scores (server/core/nma/ranking.ts, METHODS.md §6). P-scores as Rücker & Schwarzer define them
// (BMC Med Res Methodol 2015;15:58), checked against the normal table; rank probabilities and SUCRA
// (Salanti, Ades & Ioannidis, J Clin Epidemiol 2011;64:163–171) where the ranks are certain, and
// where they are a coin toss, within Monte Carlo error.
import { describe, expect, it } from "vitest";
import { pScores, rankProbabilities } from "#core/nma/ranking";
import type { Estimate } from "#core/nma/types";

/** Network estimates "a vs b" from effects against A, with one SE for every pair. */
const network = (effects: Record<string, number>, se: number) => (a: string, b: string): Estimate => ({ estimate: effects[a]! - effects[b]!, se });

describe("P-scores", () => {
  it("of two options are Φ(d/se) and its complement: 0.5 over 0.25 gives 0.977250 and 0.022750", () => {
    const scores = pScores(["A", "B"], network({ A: 0, B: 0.5 }, 0.25), "higher");
    expect(scores.B).toBeCloseTo(0.97725, 6);
    expect(scores.A).toBeCloseTo(0.02275, 6);
  });

  it("turn over when lower is better", () => {
    const scores = pScores(["A", "B"], network({ A: 0, B: 0.5 }, 0.25), "lower");
    expect(scores.A).toBeCloseTo(0.97725, 6);
  });

  it("average one half over the options, whatever the evidence (Rücker & Schwarzer's property)", () => {
    const scores = pScores(["A", "B", "C", "D"], network({ A: 0, B: 0.3, C: -0.2, D: 1.1 }, 0.4), "higher");
    expect(Object.values(scores).reduce((sum, score) => sum + score, 0) / 4).toBeCloseTo(0.5, 12);
  });
});

describe("rank probabilities and SUCRA", () => {
  it("are certain when the options are far apart: C first, B second, A last; SUCRA 1, 0.5, 0", () => {
    const ranks = rankProbabilities(["A", "B", "C"], "A", [10, 20], [[1e-4, 0], [0, 1e-4]], "higher", 2000);
    expect(ranks.probabilities).toEqual({ A: [0, 0, 1], B: [0, 1, 0], C: [1, 0, 0] });
    expect(ranks.meanRank).toEqual({ A: 3, B: 2, C: 1 });
    expect(ranks.sucra).toEqual({ A: 0, B: 0.5, C: 1 });
  });

  it("are a coin toss between two options with the same expected effect: 0.5 within 4 Monte Carlo SEs (0.02)", () => {
    const ranks = rankProbabilities(["A", "B"], "A", [0], [[1]], "higher", 10_000, 7);
    expect(Math.abs(ranks.probabilities.B![0]! - 0.5)).toBeLessThan(0.02);
    expect(ranks.probabilities.A![0]! + ranks.probabilities.B![0]!).toBeCloseTo(1, 12);
  });

  it("are the same for the same seed, and say which draws and seed they came from", () => {
    const first = rankProbabilities(["A", "B", "C"], "A", [0.1, 0.2], [[0.04, 0.01], [0.01, 0.05]], "lower", 500, 3);
    const again = rankProbabilities(["A", "B", "C"], "A", [0.1, 0.2], [[0.04, 0.01], [0.01, 0.05]], "lower", 500, 3);
    expect(again).toEqual(first);
    expect(first).toMatchObject({ draws: 500, seed: 3 });
  });

  it("take a seed from 1 to 2³² − 1 and refuse any other, naming it", () => {
    const draw = (seed: number) => rankProbabilities(["A", "B"], "A", [0], [[1]], "higher", 10, seed);
    expect(draw(2 ** 32 - 1).seed).toBe(4294967295);
    expect(() => draw(0)).toThrow("the seed must be a whole number from 1 to 4294967295, not 0");
    expect(() => draw(2.5)).toThrow("the seed must be a whole number from 1 to 4294967295, not 2.5");
  });
});
