// Rank scores (METHODS.md §6), reported only beside the cautions of PRODUCT.md.
// P-scores: Rücker & Schwarzer, BMC Med Res Methodol 2015;15:58. Rank probabilities and SUCRA:
// Salanti, Ades & Ioannidis, J Clin Epidemiol 2011;64:163–171, from seeded draws of N(β̂, Cov(β̂)).
import normalCdf from "@stdlib/stats-base-dists-normal-cdf";
import { rankCounts } from "./kernels";
import type { Better, Estimate } from "./types";

export const defaultDraws = 10_000;
export const defaultSeed = 1;

/** P_i = mean over j ≠ i of Φ((d_i − d_j)/se_ij), the sign turned where lower is better. */
export function pScores(treatments: string[], network: (a: string, b: string) => Estimate, better: Better): Record<string, number> {
  const sign = better === "higher" ? 1 : -1;
  const scores: Record<string, number> = {};
  for (const a of treatments) {
    let sum = 0;
    for (const b of treatments) {
      if (a === b) continue;
      const { estimate, se } = network(a, b);
      sum += normalCdf((sign * estimate) / se, 0, 1);
    }
    scores[a] = sum / (treatments.length - 1);
  }
  return scores;
}

export interface RankProbabilities {
  /** probabilities[t][r]: the share of draws in which t ranks r + 1 (rank 1 = best). */
  probabilities: Record<string, number[]>;
  meanRank: Record<string, number>;
  sucra: Record<string, number>;
  draws: number;
  seed: number;
}

/** The generator's seeds: MT19937 takes a 32-bit seed, and 0 is not one (as in stdlib's, decision 0049). */
export const seedRange = { min: 1, max: 2 ** 32 - 1 } as const;

/**
 * Draws β from N(β̂, Cov(β̂)) (the reference fixed at 0), ranks the treatments in each draw and
 * counts. SUCRA_i = Σ_{r=1}^{T−1} cumP_i(r) / (T − 1). The draws run in WebAssembly (./kernels).
 */
export function rankProbabilities(
  treatments: string[],
  reference: string,
  beta: number[],
  covariance: number[][],
  better: Better,
  draws = defaultDraws,
  seed = defaultSeed,
): RankProbabilities {
  if (!Number.isInteger(seed) || seed < seedRange.min || seed > seedRange.max) {
    throw new RangeError(`the seed must be a whole number from ${seedRange.min} to ${seedRange.max}, not ${seed}`);
  }
  const T = treatments.length;
  const counts = rankCounts({
    covariance: Float64Array.from(covariance.flat()),
    mean: Float64Array.from(beta),
    parameterIndex: Int32Array.from(treatments.filter((t) => t !== reference).map((t) => treatments.indexOf(t))),
    options: T,
    reference: treatments.indexOf(reference),
    sign: better === "higher" ? -1 : 1, // ascending on sign·d: best first
    draws,
    seed,
  });

  const probabilities: Record<string, number[]> = {};
  const meanRank: Record<string, number> = {};
  const sucra: Record<string, number> = {};
  treatments.forEach((t, i) => {
    const probability = Array.from(counts.subarray(i * T, (i + 1) * T), (c) => c / draws);
    probabilities[t] = probability;
    meanRank[t] = probability.reduce((sum, q, r) => sum + q * (r + 1), 0);
    let cumulative = 0;
    let area = 0;
    for (let r = 0; r < T - 1; r++) {
      cumulative += probability[r]!;
      area += cumulative;
    }
    sucra[t] = area / (T - 1);
  });
  return { probabilities, meanRank, sucra, draws, seed };
}
