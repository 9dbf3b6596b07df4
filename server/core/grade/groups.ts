// Groups of treatments by the minimally contextualised framework, and its partially contextualised
// variant when the outcome has thresholds (METHODS.md §9; Brignardello-Petersen et al., BMJ
// 2020;371:m3900). Pure.
import type { Better } from "../nma/types";
import type { Thresholds } from "./assess";
import type { Rating } from "./certainty";

export interface PairEvidence {
  /** θ_t − θ_u on the analysis scale, with its 95% CI. */
  estimate: number;
  lower: number;
  upper: number;
  /** The certainty of the comparison; null while it is not rated. */
  certainty: Rating | null;
}

/**
 * How firmly a group's membership can be stated, from the certainty of each treatment against the
 * reference. "not-assessed": nobody judged that certainty yet (METHODS.md §9: never shown as a rating).
 */
export type Firmness = "firm" | "may" | "very-uncertain" | "not-assessed";

export interface TreatmentGroup {
  /** 0: no different from the reference; ≥ 1: better; ≤ −1: worse. */
  level: number;
  firmness: Firmness;
  treatments: string[];
}

/**
 * "t is convincingly better than u": the 95% CI of t vs u excludes the null on the beneficial side,
 * and the certainty of that comparison is not very low (nor unrated).
 */
export function convincinglyBetter(evidence: PairEvidence, better: Better): boolean {
  if (evidence.certainty === null || evidence.certainty === "very_low") return false;
  return better === "higher" ? evidence.lower > 0 : evidence.upper < 0;
}

/** Very low certainty is listed apart, and so, in its own list, is a comparison nobody has rated. */
function firmness(certainty: Rating | null): Firmness {
  if (certainty === "high" || certainty === "moderate") return "firm";
  if (certainty === "low") return "may";
  return certainty === "very_low" ? "very-uncertain" : "not-assessed";
}

const apart = (kind: Firmness) => kind === "very-uncertain" || kind === "not-assessed";

/**
 * Level 0 holds the reference and every treatment not convincingly better or worse than it. A
 * treatment convincingly better than the reference has level 1 + the highest level among the
 * better-than-reference treatments it is convincingly better than (0 if none); harm mirrors this.
 * Each level is split by firmness; a treatment whose comparison with the reference is of very low
 * certainty is listed apart.
 */
export function groupTreatments(
  treatments: string[],
  reference: string,
  better: Better,
  evidence: (t: string, u: string) => PairEvidence,
): TreatmentGroup[] {
  const worse: Better = better === "higher" ? "lower" : "higher";
  const betterThanReference = treatments.filter((t) => t !== reference && convincinglyBetter(evidence(t, reference), better));
  const worseThanReference = treatments.filter((t) => t !== reference && convincinglyBetter(evidence(t, reference), worse));

  const levels = new Map<string, number>();
  // "Convincingly better" cannot cycle (each step needs a positive estimate), so the recursion ends.
  const depth = (t: string, pool: string[], side: Better): number => {
    const memo = levels.get(t);
    if (memo !== undefined) return Math.abs(memo);
    const below = pool.filter((u) => u !== t && convincinglyBetter(evidence(t, u), side)).map((u) => depth(u, pool, side));
    const level = 1 + Math.max(0, ...below);
    levels.set(t, side === better ? level : -level);
    return level;
  };
  for (const t of betterThanReference) depth(t, betterThanReference, better);
  for (const t of worseThanReference) depth(t, worseThanReference, worse);

  return splitByFirmness(treatments, reference, evidence, (t) => levels.get(t) ?? 0);
}

/**
 * The partially contextualised variant: the thresholds for small, moderate and large effects replace
 * the null, and a treatment's level is the size of its point estimate against the reference — 1
 * small, 2 moderate, 3 large on the beneficial side, mirrored for harm, 0 below the smallest given
 * threshold. A threshold left empty is skipped, so an outcome with only a "small" threshold has
 * levels −1, 0 and 1. Certainty splits each level as in the minimally contextualised framework.
 */
export function groupByMagnitude(
  treatments: string[],
  reference: string,
  better: Better,
  thresholds: Thresholds,
  evidence: (t: string, u: string) => PairEvidence,
): TreatmentGroup[] {
  const steps = [thresholds.small, thresholds.moderate, thresholds.large];
  const levelOf = (t: string) => {
    if (t === reference) return 0;
    const estimate = evidence(t, reference).estimate;
    const benefit = better === "higher" ? estimate : -estimate;
    const size = steps.reduce<number>((level, threshold, i) => (threshold !== null && Math.abs(benefit) >= threshold ? i + 1 : level), 0);
    return size === 0 ? 0 : benefit < 0 ? -size : size;
  };
  return splitByFirmness(treatments, reference, evidence, levelOf);
}

/** Each level split by firmness, best level first, firm before "may"; the very uncertain apart, then the not yet assessed. */
function splitByFirmness(
  treatments: string[],
  reference: string,
  evidence: (t: string, u: string) => PairEvidence,
  levelOf: (t: string) => number,
): TreatmentGroup[] {
  const groups = new Map<string, TreatmentGroup>();
  for (const t of treatments) {
    const level = levelOf(t);
    const certainty = t === reference ? "high" : evidence(t, reference).certainty;
    const kind = t === reference ? "firm" : firmness(certainty);
    const key = `${apart(kind) ? "apart" : level}|${kind}`;
    const group = groups.get(key) ?? { level: apart(kind) ? 0 : level, firmness: kind, treatments: [] };
    group.treatments.push(t);
    groups.set(key, group);
  }
  const sortKey = (g: TreatmentGroup) => [g.firmness === "not-assessed" ? 2 : g.firmness === "very-uncertain" ? 1 : 0, -g.level, g.firmness === "may" ? 1 : 0];
  return [...groups.values()]
    .map((g) => ({ ...g, treatments: g.treatments.sort() }))
    .sort((a, b) => {
      const [x, y] = [sortKey(a), sortKey(b)];
      return x[0]! - y[0]! || x[1]! - y[1]! || x[2]! - y[2]!;
    });
}
