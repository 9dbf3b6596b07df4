// One comparison read from a result in either direction. Kept apart from the engine so that pages
// and the desk can use it without loading the engine's numerical packages.
import type { AnalysisResult, Comparison } from "./analyse";
import type { Estimate } from "./types";

/** "a vs b" from a result, whichever order the result lists the pair in (θ_a − θ_b = −(θ_b − θ_a)). */
export function comparisonOf(result: AnalysisResult, a: string, b: string): Comparison | null {
  const listed = result.comparisons.find((c) => (c.treatment === a && c.comparator === b) || (c.treatment === b && c.comparator === a));
  if (!listed || listed.treatment === a) return listed ?? null;
  const flip = (e: Estimate) => ({ ...e, estimate: -e.estimate });
  const n = listed.network;
  return {
    treatment: a,
    comparator: b,
    network: {
      estimate: -n.estimate,
      se: n.se,
      lower: -n.upper,
      upper: -n.lower,
      predictionLower: n.predictionUpper === null ? null : -n.predictionUpper,
      predictionUpper: n.predictionLower === null ? null : -n.predictionLower,
    },
    direct: listed.direct ? { ...flip(listed.direct), studies: listed.direct.studies } : null,
    indirect: listed.indirect ? flip(listed.indirect) : null,
    incoherence: listed.incoherence ? { z: -listed.incoherence.z, p: listed.incoherence.p } : null,
    directShare: listed.directShare,
  };
}
