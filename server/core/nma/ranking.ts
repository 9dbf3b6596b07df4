// Rank scores (METHODS.md §6), reported only beside the cautions of PRODUCT.md.
// P-scores: Rücker & Schwarzer, BMC Med Res Methodol 2015;15:58. Rank probabilities and SUCRA:
// Salanti, Ades & Ioannidis, J Clin Epidemiol 2011;64:163–171, from seeded draws of N(β̂, Cov(β̂)).
import normalCdf from "@stdlib/stats-base-dists-normal-cdf";
import normal from "@stdlib/random-base-normal";
import { CholeskyDecomposition } from "ml-matrix";
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

/**
 * Draws β from N(β̂, Cov(β̂)) (the reference fixed at 0), ranks the treatments in each draw and
 * counts. SUCRA_i = Σ_{r=1}^{T−1} cumP_i(r) / (T − 1).
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
  const T = treatments.length;
  const p = beta.length;
  const L = Float64Array.from(new CholeskyDecomposition(covariance).lowerTriangularMatrix.to1DArray()); // row-major p × p
  const mean = Float64Array.from(beta);
  const standardNormal = normal.factory(0, 1, { seed });
  const others = treatments.filter((t) => t !== reference);
  const counts = new Float64Array(T * T); // counts[t·T + rank]
  const referenceIndex = treatments.indexOf(reference);
  const parameterIndex = Int32Array.from(others.map((t) => treatments.indexOf(t)));
  const sign = better === "higher" ? -1 : 1; // sort ascending on sign·d: best first
  const values = new Float64Array(T);
  const order = new Int32Array(T);
  // The standard normals of a batch of draws first, in the order a draw at a time would take them
  // (the same numbers for the same seed), then the draws: two tight loops a cold process optimises
  // sooner than one loop around a call.
  const batch = Math.max(1, Math.min(draws, 1024));
  const z = new Float64Array(batch * p);

  for (let first = 0; first < draws; first += batch) {
    const size = Math.min(batch, draws - first);
    for (let k = 0; k < size * p; k++) z[k] = standardNormal();
    for (let draw = 0; draw < size; draw++) {
      const offset = draw * p;
      values[referenceIndex] = 0;
      for (let i = 0; i < p; i++) {
        let sum = mean[i]!;
        const row = i * p;
        for (let j = 0; j <= i; j++) sum += L[row + j]! * z[offset + j]!;
        values[parameterIndex[i]!] = sign * sum;
      }
      // Best first by insertion sort: for a few dozen treatments it beats a comparator sort ten
      // thousand times over, and like it keeps equal values in treatment order.
      for (let i = 0; i < T; i++) {
        const value = values[i]!;
        let at = i;
        for (; at > 0 && values[order[at - 1]!]! > value; at--) order[at] = order[at - 1]!;
        order[at] = i;
      }
      for (let rank = 0; rank < T; rank++) counts[order[rank]! * T + rank]! += 1;
    }
  }

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
