// How a comparison's certainty was reached, step by step, so that a reader can add it up (METHODS.md
// §8 step 5): the direct certainty and its steps down, the indirect certainty and the loop it came
// from, which of the two the network estimate took, then the network's steps down to the published
// rating. Pure: one assessment in (and the direct ratings of the loop's two sides), the path out.
import type { ComparisonCertainty } from "./assess";
import { higher, type Rating } from "./certainty";

/** One step down: a domain (a key of the public pages' words) and how many levels. */
export interface CertaintyStep {
  domainKey: string;
  levels: number;
}

export interface CertaintyPath {
  /** Null: no trial compared the two. */
  direct: { rating: Rating; steps: CertaintyStep[] } | null;
  /**
   * `via`: the dominant first-order loop's middle option, with the direct ratings of its two sides;
   * null where there is none and the analysts set the rating (`reason`). Null as a whole: no indirect
   * evidence (the network estimate rests on the direct trials alone).
   */
  indirect: { rating: Rating; via: string | null; sides: [Rating, Rating] | null; steps: CertaintyStep[]; reason: string | null } | null;
  /** Which certainty the network estimate started from. */
  took: "direct" | "indirect";
  steps: CertaintyStep[];
  rating: Rating;
}

const down = (domainKey: string, levels: number): CertaintyStep[] => (levels > 0 ? [{ domainKey, levels }] : []);

/** Null while the comparison has no certainty. `directOf(x, y)`: the direct rating of that pair, or null. */
export function certaintyPath(c: ComparisonCertainty, directOf: (x: string, y: string) => Rating | null): CertaintyPath | null {
  if (!c.network) return null;
  const { judgement } = c;
  const direct = c.direct && judgement.direct
    ? { rating: c.direct, steps: (["riskOfBias", "inconsistency", "indirectness", "publicationBias"] as const).flatMap((d) => down(`certainty.domain.${d}`, judgement.direct![d].levels)) }
    : null;
  let indirect: CertaintyPath["indirect"] = null;
  if (c.indirect) {
    const first = c.indirectVia ? directOf(c.treatment, c.indirectVia) : null;
    const second = c.indirectVia ? directOf(c.indirectVia, c.comparator) : null;
    indirect = c.indirectVia
      ? { rating: c.indirect, via: c.indirectVia, sides: first && second ? [first, second] : null, steps: down("certainty.footnote.intransitivity", judgement.intransitivity?.levels ?? 0), reason: null }
      : { rating: c.indirect, via: null, sides: null, steps: [], reason: judgement.indirectRating?.reason ?? null };
  }
  const took: CertaintyPath["took"] =
    judgement.dominant === "direct" || judgement.dominant === "indirect" ? judgement.dominant
    : direct && indirect ? (higher(direct.rating, indirect.rating) === direct.rating ? "direct" : "indirect")
    : direct ? "direct" : "indirect";
  const steps = [...(direct ? down("certainty.domain.incoherence", judgement.incoherence?.levels ?? 0) : []), ...down("certainty.domain.imprecision", judgement.imprecision?.levels ?? 0)];
  return { direct, indirect, took, steps, rating: c.network };
}
