// Direct, indirect and network evidence for every pair (METHODS.md §5). The indirect estimate is
// back-calculated from the network and direct estimates (Dias, Welton, Caldwell & Ades, Stat Med
// 2010;29:932–944; König, Krahn & Binder, Stat Med 2013;32:5414–5429).
import normalCdf from "@stdlib/stats-base-dists-normal-cdf";
import type { ArmEffects, Estimate } from "./types";

export interface DirectEstimate extends Estimate {
  studies: number;
}

/** "a vs b" in this order: each study adds both directions, so either can be looked up. */
function orderedPair(a: string, b: string): string {
  return `${a}\u0000${b}`;
}

/**
 * Inverse-variance pooled direct estimates of "a vs b" over every study that holds both, each study
 * contributing θ_a − θ_b with variance v_a + v_b (+ τ² under random effects). Keyed by a, b in the
 * order given by `pairs`.
 */
export function directEstimates(studies: ArmEffects[], tau2: number): (a: string, b: string) => DirectEstimate | null {
  const sums = new Map<string, { weight: number; weighted: number; studies: number }>();
  for (const study of studies) {
    study.treatments.forEach((a, i) => {
      study.treatments.forEach((b, j) => {
        if (i === j) return;
        const variance = study.variances[i]! + study.variances[j]! + tau2;
        const key = orderedPair(a, b);
        const sum = sums.get(key) ?? { weight: 0, weighted: 0, studies: 0 };
        sum.weight += 1 / variance;
        sum.weighted += (study.effects[i]! - study.effects[j]!) / variance;
        sum.studies += 1;
        sums.set(key, sum);
      });
    });
  }
  return (a, b) => {
    const sum = sums.get(orderedPair(a, b));
    return sum ? { estimate: sum.weighted / sum.weight, se: Math.sqrt(1 / sum.weight), studies: sum.studies } : null;
  };
}

/**
 * v_I = 1/(1/v_N − 1/v_D), d_I = v_I·(d_N/v_N − d_D/v_D). Where 1/v_N − 1/v_D ≤ 1e-10/v_N the direct
 * evidence is all there is (the pair is a bridge) and there is no indirect estimate.
 */
export function indirectEstimate(network: Estimate, direct: Estimate | null): Estimate | null {
  if (!direct) return null;
  const vN = network.se ** 2;
  const vD = direct.se ** 2;
  const precision = 1 / vN - 1 / vD;
  if (!(precision > 1e-10 / vN)) return null;
  const vI = 1 / precision;
  return { estimate: vI * (network.estimate / vN - direct.estimate / vD), se: Math.sqrt(vI) };
}

/** z = (d_D − d_I)/√(v_D + v_I), with its two-sided normal p-value. */
export function incoherence(direct: Estimate | null, indirect: Estimate | null): { z: number; p: number } | null {
  if (!direct || !indirect) return null;
  const z = (direct.estimate - indirect.estimate) / Math.sqrt(direct.se ** 2 + indirect.se ** 2);
  return { z, p: 2 * (1 - normalCdf(Math.abs(z), 0, 1)) };
}
