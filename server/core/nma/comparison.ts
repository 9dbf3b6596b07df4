// One comparison read from a result in either direction. Kept apart from the engine so that pages
// and the desk can use it without loading the engine's numerical packages.
import { flipInterval, pairFinder } from "./pairs";
import type { AnalysisResult, Comparison } from "./analyse";
import type { Estimate } from "./types";

/** "a vs b" from a result, whichever order the result lists the pair in (θ_a − θ_b = −(θ_b − θ_a)). */
export function comparisonOf(result: AnalysisResult, a: string, b: string): Comparison | null {
  const found = pairFinder(result.comparisons)(a, b);
  if (!found || !found.flipped) return found?.item ?? null;
  const listed = found.item;
  const flip = (e: Estimate) => ({ ...e, estimate: -e.estimate });
  const n = listed.network;
  return {
    treatment: a,
    comparator: b,
    network: {
      ...flipInterval(n),
      predictionLower: n.predictionUpper === null ? null : -n.predictionUpper,
      predictionUpper: n.predictionLower === null ? null : -n.predictionLower,
    },
    direct: listed.direct ? { ...flip(listed.direct), studies: listed.direct.studies } : null,
    indirect: listed.indirect ? flip(listed.indirect) : null,
    incoherence: listed.incoherence ? { z: -listed.incoherence.z, p: listed.incoherence.p } : null,
    directShare: listed.directShare,
    // Both read the same either way round.
    importance: listed.importance,
    riskOfBias: listed.riskOfBias,
  };
}
