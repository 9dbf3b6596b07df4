// One comparison read from a result in either direction. Kept apart from the engine so that pages
// and the desk can use it without loading the engine's numerical packages.
import type { AnalysisResult, Comparison } from "./analyse";
import type { Estimate } from "./types";

const indexes = new WeakMap<AnalysisResult, Map<string, Comparison>>();

/** Each pair once, keyed by both of its orders; built once per result. */
function index(result: AnalysisResult): Map<string, Comparison> {
  let byPair = indexes.get(result);
  if (!byPair) {
    byPair = new Map();
    for (const c of result.comparisons) {
      byPair.set(`${c.treatment}\u0000${c.comparator}`, c);
      byPair.set(`${c.comparator}\u0000${c.treatment}`, c);
    }
    indexes.set(result, byPair);
  }
  return byPair;
}

/** "a vs b" from a result, whichever order the result lists the pair in (θ_a − θ_b = −(θ_b − θ_a)). */
export function comparisonOf(result: AnalysisResult, a: string, b: string): Comparison | null {
  const listed = index(result).get(`${a}\u0000${b}`);
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
