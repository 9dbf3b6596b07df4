// Certainty of evidence for network estimates (METHODS.md §8): GRADE for network meta-analysis,
// Puhan et al., BMJ 2014;349:g5630, and Brignardello-Petersen et al., J Clin Epidemiol 2018;93:36–44;
// imprecision against decision thresholds: Brignardello-Petersen et al., J Clin Epidemiol 2021;139:49–56.
// Pure functions: the analyst's judgements and the engine's result in, ratings and suggestions out.
import type { RiskOfBiasShares } from "../nma/risk-of-bias";

export const ratings = ["very_low", "low", "moderate", "high"] as const;
export type Rating = (typeof ratings)[number];

/** 0, 1 or 2 levels down, with the analyst's reason (required when the level is not 0). */
export interface Downgrade {
  levels: 0 | 1 | 2;
  reason: string;
}

export interface DirectJudgement {
  riskOfBias: Downgrade;
  inconsistency: Downgrade;
  indirectness: Downgrade;
  publicationBias: Downgrade;
}

const rank = (rating: Rating) => ratings.indexOf(rating);

/** Fairweigh's certainty mark: four rising steps, as many filled as the rating is high (pages, cards, share images). */
export const certaintySteps = (rating: Rating) => rank(rating) + 1;

/** Down by `levels` from `start`, never below very low. */
export function rateDown(start: Rating, levels: number): Rating {
  return ratings[Math.max(0, rank(start) - levels)]!;
}

export function lower(a: Rating, b: Rating): Rating {
  return rank(a) <= rank(b) ? a : b;
}

export function higher(a: Rating, b: Rating): Rating {
  return rank(a) >= rank(b) ? a : b;
}

/** Step 1: direct evidence from randomised trials starts high; the analyst rates down per domain. */
export function directCertainty(judgement: DirectJudgement): Rating {
  const levels = judgement.riskOfBias.levels + judgement.inconsistency.levels + judgement.indirectness.levels + judgement.publicationBias.levels;
  return rateDown("high", levels);
}

/**
 * Step 2: the dominant first-order loop A–C–B is the C, among treatments with direct evidence
 * against both A and B, with the smallest v_D(A,C) + v_D(C,B). Null where there is no such loop.
 */
export function dominantLoop(
  a: string,
  b: string,
  treatments: string[],
  directVariance: (x: string, y: string) => number | null,
): { via: string; first: [string, string]; second: [string, string] } | null {
  let best: { via: string; variance: number } | null = null;
  for (const c of treatments) {
    if (c === a || c === b) continue;
    const ac = directVariance(a, c);
    const cb = directVariance(c, b);
    if (ac === null || cb === null) continue;
    if (!best || ac + cb < best.variance) best = { via: c, variance: ac + cb };
  }
  return best ? { via: best.via, first: [a, best.via], second: [best.via, b] } : null;
}

/** The lower certainty of the loop's two direct estimates, then rated down for intransitivity. */
export function indirectCertainty(first: Rating, second: Rating, intransitivity: Downgrade): Rating {
  return rateDown(lower(first, second), intransitivity.levels);
}

export interface Suggestion {
  levels: number;
  /** A message key (locales/…/common.json) and the facts it needs, for the analyst and the footnote. */
  because: { key: string; values: Record<string, number> };
}

/**
 * Step 1, risk of bias (METHODS.md §13, common practice with no single source): the levels of the
 * risk-of-bias level that carries the largest share of the direct estimate's weight. Null where the
 * data say nothing (no direct evidence, no risk-of-bias column, or more than half not assessed).
 */
export function riskOfBiasSuggestion(shares: RiskOfBiasShares | null | undefined): Suggestion | null {
  if (!shares || shares.suggestedLevels === null) return null;
  const level = (["low", "someConcerns", "high"] as const)[shares.suggestedLevels];
  return { levels: shares.suggestedLevels, because: { key: `certainty.riskOfBias.${level}`, values: { share: Math.round(100 * shares[level]) } } };
}

/** Step 3: suggest one level down for incoherence when the direct and indirect estimates differ with p < 0.05. */
export function incoherenceSuggestion(incoherence: { z: number; p: number } | null): Suggestion {
  if (!incoherence) return { levels: 0, because: { key: "certainty.incoherence.notTestable", values: {} } };
  const values = { p: incoherence.p };
  return incoherence.p < 0.05
    ? { levels: 1, because: { key: "certainty.incoherence.found", values } }
    : { levels: 0, because: { key: "certainty.incoherence.notFound", values } };
}

/**
 * Step 3: suggest rating down for imprecision by the number of decision thresholds the 95% CI
 * crosses: one level for one, two for two or more. The thresholds are the null when the outcome has
 * none, otherwise ± its small, moderate and large thresholds, on the outcome's decision scale
 * (per 1000 for binary outcomes, units for continuous ones: ./decision-scale.ts).
 */
export function imprecisionSuggestion(
  interval: { lower: number; upper: number },
  thresholds: { small: number | null; moderate: number | null; large: number | null },
): Suggestion {
  const magnitudes = [thresholds.small, thresholds.moderate, thresholds.large].filter((t): t is number => t !== null);
  const lines = magnitudes.length > 0 ? magnitudes.flatMap((t) => [-t, t]) : [0];
  const crossed = lines.filter((t) => interval.lower < t && t < interval.upper).length;
  // Whether it crosses is said by the key, never by a plural form: French reads 0 as singular.
  const key = magnitudes.length > 0 ? (crossed > 0 ? "certainty.imprecision.crossesThresholds" : "certainty.imprecision.clearOfThresholds") : crossed > 0 ? "certainty.imprecision.crossesNull" : "certainty.imprecision.clearOfNull";
  return { levels: Math.min(2, crossed), because: { key, values: { count: crossed } } };
}

/** The analyst's answer to a suggestion: confirmed as suggested, or overridden with a reason. */
export interface SuggestionDecision {
  levels: number;
  reason: string;
}

export interface NetworkCertaintyInput {
  direct: Rating | null;
  indirect: Rating | null;
  /** Where the analyst says one source dominates the network estimate, that one is used. */
  dominant?: "direct" | "indirect" | null;
  incoherence: SuggestionDecision;
  imprecision: SuggestionDecision;
}

/**
 * The higher of the direct and indirect certainties (or the dominant one), then down by the
 * confirmed incoherence and imprecision levels. Null while no starting certainty is known.
 */
export function networkCertainty(input: NetworkCertaintyInput): Rating | null {
  const start =
    input.dominant === "direct" ? input.direct : input.dominant === "indirect" ? input.indirect
    : input.direct && input.indirect ? higher(input.direct, input.indirect)
    : (input.direct ?? input.indirect);
  if (!start) return null;
  return rateDown(start, input.incoherence.levels + input.imprecision.levels);
}
