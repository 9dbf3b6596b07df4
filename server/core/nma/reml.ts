// τ² by restricted maximum likelihood (METHODS.md §3; Harville, JASA 1977;72:320–338), restricted to
// τ² ≥ 0. Fisher scoring, each step kept inside a bracket [lo, hi] on which the score changes sign;
// a step that leaves the bracket is replaced by bisection, so the search always converges.
import { fitAt, type Fit, type StudyBlock } from "./model";

export const remlTolerance = 1e-8;
const maximumIterations = 200;

/** `atZero` is the fit at τ² = 0 (the fixed-effect fit), which the caller has already made. */
export function estimateTau2(blocks: StudyBlock[], parameters: number, atZero: Fit): Fit {
  // The likelihood falls away from the boundary (or is flat, as with one contrast per parameter):
  // τ² = 0 is the restricted maximum.
  if (!(atZero.score > 0) || !(atZero.information > 0)) return atZero;

  let lo = 0;
  let hi = Number.POSITIVE_INFINITY;
  let current = atZero;
  let x = atZero.score / atZero.information;
  for (let iteration = 0; iteration < maximumIterations; iteration++) {
    current = fitAt(blocks, parameters, x);
    if (current.score > 0) lo = x;
    else hi = x;
    let next = current.information > 0 ? x + current.score / current.information : Number.NaN;
    if (!(next > lo && next < hi) || !Number.isFinite(next)) next = Number.isFinite(hi) ? (lo + hi) / 2 : 2 * x;
    if (Math.abs(next - x) <= remlTolerance * x) return fitAt(blocks, parameters, next);
    x = next;
  }
  throw new Error(`REML did not converge within ${maximumIterations} iterations (τ² ≈ ${x})`);
}
