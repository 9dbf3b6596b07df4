// Certainty for every comparison of an outcome: the analyst's judgements and the engine's result
// in, ratings, suggestions and what still needs a judgement out (METHODS.md §8). Pure.
import type { AnalysisResult } from "../nma/analyse";
import { decisionScale, type Thresholds } from "./decision-scale";
import { pairKey } from "../nma/pairs";
import {
  directCertainty,
  dominantLoop,
  imprecisionSuggestion,
  incoherenceSuggestion,
  indirectCertainty,
  networkCertainty,
  riskOfBiasSuggestion,
  type DirectJudgement,
  type Downgrade,
  type Rating,
  type Suggestion,
  type SuggestionDecision,
} from "./certainty";

/** What the analyst records for one comparison; every part is optional until it is given. */
export interface ComparisonJudgement {
  direct?: DirectJudgement;
  intransitivity?: Downgrade;
  /** Where there is no first-order loop, the analyst sets the indirect certainty. */
  indirectRating?: { rating: Rating; reason: string };
  dominant?: "direct" | "indirect" | null;
  incoherence?: SuggestionDecision;
  imprecision?: SuggestionDecision;
}

export type Pending = "direct" | "indirect" | "incoherence" | "imprecision";

export interface ComparisonCertainty {
  treatment: string;
  comparator: string;
  direct: Rating | null;
  indirect: Rating | null;
  indirectVia: string | null;
  network: Rating | null;
  /** riskOfBias: for the direct estimate's risk-of-bias domain, where the data carry judgements (§13). */
  suggestions: { incoherence: Suggestion; imprecision: Suggestion; riskOfBias: Suggestion | null };
  judgement: ComparisonJudgement;
  /** The parts that still need the analyst: the desk lists these comparisons first. */
  pending: Pending[];
}

export type { Thresholds };

/**
 * A recorded decision on a suggestion still stands when it follows the suggestion as it is now, or
 * departs from it with a reason. One that followed an earlier suggestion, which has since changed
 * (the outcome's settings changed), is pending again: nobody judged the new one.
 */
function standing(decision: SuggestionDecision | undefined, suggestion: Suggestion): SuggestionDecision | undefined {
  return decision && (decision.levels === suggestion.levels || decision.reason.trim() !== "") ? decision : undefined;
}

/**
 * The direct evidence's judgement stands when its risk-of-bias domain follows the suggestion as it is
 * now or departs from it with a reason; without a suggestion, a rating down needs its reason.
 */
function directStanding(judgement: ComparisonJudgement["direct"], suggestion: Suggestion | null): DirectJudgement | undefined {
  if (!judgement) return undefined;
  const { levels, reason } = judgement.riskOfBias;
  const explained = reason.trim() !== "" || (suggestion ? levels === suggestion.levels : levels === 0);
  return explained ? judgement : undefined;
}

/** Incoherence compares direct with indirect evidence: without direct evidence there is nothing to judge. */
const notApplicable: SuggestionDecision = { levels: 0, reason: "" };

/** Thresholds are read on the outcome's decision scale (METHODS.md §9): per 1000 at `baselineRisk` for binary outcomes. */
export function assessCertainty(result: AnalysisResult, judgements: Map<string, ComparisonJudgement>, thresholds: Thresholds, baselineRisk: number | null = null): ComparisonCertainty[] {
  const scale = decisionScale(result, thresholds, baselineRisk);
  const none = { small: null, moderate: null, large: null };
  const byPair = new Map(result.comparisons.map((c) => [pairKey(c.treatment, c.comparator), c]));
  const directVariance = (a: string, b: string) => {
    const direct = byPair.get(pairKey(a, b))?.direct;
    return direct ? direct.se ** 2 : null;
  };
  const directRating = (a: string, b: string): Rating | null => {
    const comparison = byPair.get(pairKey(a, b));
    const judgement = directStanding(judgements.get(pairKey(a, b))?.direct, riskOfBiasSuggestion(comparison?.riskOfBias));
    return comparison?.direct && judgement ? directCertainty(judgement) : null;
  };

  return result.comparisons.map((comparison) => {
    const { treatment: a, comparator: b } = comparison;
    const judgement = judgements.get(pairKey(a, b)) ?? {};
    const pending: Pending[] = [];

    const direct = comparison.direct ? directRating(a, b) : null;
    if (comparison.direct && !direct) pending.push("direct");

    // A pair no trial compared (METHODS.md §8 step 4): its network estimate is wholly indirect, so its
    // certainty starts from the indirect certainty like any other, and incoherence does not apply.
    const whollyIndirect = comparison.direct === null;
    let indirect: Rating | null = null;
    let indirectVia: string | null = null;
    if (comparison.indirect || whollyIndirect) {
      const loop = dominantLoop(a, b, result.treatments, directVariance);
      if (loop) {
        indirectVia = loop.via;
        const first = directRating(...loop.first);
        const second = directRating(...loop.second);
        indirect = first && second ? indirectCertainty(first, second, judgement.intransitivity ?? { levels: 0, reason: "" }) : null;
      } else {
        indirect = judgement.indirectRating?.rating ?? null;
      }
      if (!indirect) pending.push("indirect");
    }

    const suggestions = {
      incoherence: incoherenceSuggestion(comparison.incoherence),
      imprecision: imprecisionSuggestion(scale.effect(a, b), scale.thresholds ?? none),
      riskOfBias: comparison.direct ? riskOfBiasSuggestion(comparison.riskOfBias) : null,
    };
    const incoherence = whollyIndirect ? notApplicable : standing(judgement.incoherence, suggestions.incoherence);
    const imprecision = standing(judgement.imprecision, suggestions.imprecision);
    if (!incoherence) pending.push("incoherence");
    if (!imprecision) pending.push("imprecision");

    const network = incoherence && imprecision ? networkCertainty({ direct, indirect, dominant: judgement.dominant, incoherence, imprecision }) : null;
    return { treatment: a, comparator: b, direct, indirect, indirectVia, network, suggestions, judgement, pending };
  });
}
