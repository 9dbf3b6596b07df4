// What a version says about one outcome, built once when it is published and frozen with it: the
// groups with their plain-language labels (METHODS.md §9), a statement and, for binary outcomes, the
// absolute effect of every comparison in both directions (§10, §7), and the rank-score explainer.
// Pure: the engine's result, the ratings and the outcome's settings in; message keys and facts out.
import { absoluteEffect, type AbsoluteEffect } from "../nma/absolute";
import type { AnalysisResult } from "../nma/analyse";
import { comparisonOf } from "../nma/comparison";
import type { ComparisonCertainty } from "./assess";
import { decisionScale, hasThresholds, type Thresholds } from "./decision-scale";
import { pairKey } from "../nma/pairs";
import type { Rating } from "./certainty";
import { groupByMagnitude, groupTreatments, type TreatmentGroup } from "./groups";
import { rankExplainer, type RankExplainer } from "./rank-explainer";
import { absoluteStatement, magnitudeOf, statementFor, type Magnitude } from "./statements";

/** A message key of locales/<locale>/common.json with the facts it needs: the words are chosen per locale. */
export interface Message {
  key: string;
  values: Record<string, string | number>;
}

export type Framework = "minimal" | "partial";

export interface LabelledGroup extends TreatmentGroup {
  label: Message;
}

/** "treatment vs comparator": one direction of one comparison. */
export interface ComparisonReading {
  treatment: string;
  comparator: string;
  certainty: Rating | null;
  magnitude: Magnitude;
  /** Null while the comparison is not rated (a brief is not published then). */
  statement: Message | null;
  /** Binary outcomes with a baseline risk: per 1000, the comparator's risk taken from the reference's. */
  absolute: (AbsoluteEffect & { statement: Message }) | null;
}

export interface OutcomeConclusions {
  framework: Framework;
  groups: LabelledGroup[];
  readings: ComparisonReading[];
  rankScores: RankExplainer;
}

export interface OutcomeFacts {
  name: string;
  /** How the outcome reads inside a statement, when the analysts gave it ("the chance of being free of pain"). */
  statementPhrase?: string | null;
  /** The outcome is a harm: its groups speak of harm, not effectiveness (METHODS.md §10). */
  measuresHarm?: boolean;
  baselineRisk: number | null;
  thresholds: Thresholds;
  /** The names readers see, by the label in the data. */
  names: Record<string, string>;
}

/**
 * The size of an effect for its statement. With thresholds, the point estimate against them, both on
 * the decision scale (§9, §10). Without any (METHODS.md §10), "unclear" when the 95% CI includes the
 * null, else the direction alone: "moderate", whose wording ("reduces", "probably reduces", "may
 * reduce") carries no size word.
 */
export function magnitudeFor(network: { estimate: number; lower: number; upper: number }, thresholds: Thresholds | null): Magnitude {
  if (!thresholds || !hasThresholds(thresholds)) return network.lower <= 0 && network.upper >= 0 ? "unclear" : "moderate";
  const given = (value: number | null) => value ?? Number.POSITIVE_INFINITY;
  return magnitudeOf(network.estimate, { small: given(thresholds.small), moderate: given(thresholds.moderate), large: given(thresholds.large) });
}

/** "Good sleep" reads "good sleep" inside a sentence; "HbA1c" and "IL-6" keep their capitals. */
function inSentence(name: string): string {
  return /^[A-Z][a-z]/.test(name) ? name[0]!.toLowerCase() + name.slice(1) : name;
}

const sizes = ["small", "moderate", "large"] as const;

/**
 * A group's label. `hedged`: some member's comparison with the reference is of moderate certainty, so
 * a placement away from the reference reads "probably" (METHODS.md §10); "not shown to differ" needs
 * no hedge, as it claims no effect.
 */
export function groupLabel(group: TreatmentGroup, framework: Framework, extremes: { best: number; worst: number }, reference: { label: string; name: string }, hedged = false, measuresHarm = false): Message {
  const values = { reference: reference.name };
  if (group.firmness === "very-uncertain") return { key: "groups.veryUncertain", values };
  if (group.firmness === "not-assessed") return { key: "groups.notAssessed", values };
  const firmness = group.firmness === "firm" && hedged && group.level !== 0 ? "probably" : group.firmness;
  if (group.treatments.length === 1 && group.treatments[0] === reference.label) return { key: "groups.referenceOnly", values };
  // For a harm outcome "better" means less harm: the labels say so rather than "most effective".
  const words = measuresHarm ? "groups.harmOutcome" : "groups";
  if (framework === "partial") {
    if (group.level === 0) return { key: `groups.partial.trivial.${firmness}`, values };
    const size = sizes[Math.abs(group.level) - 1];
    return group.level > 0 ? { key: `${words}.partial.benefit.${size}.${firmness}`, values } : { key: `groups.partial.harm.${size}.${firmness}`, values };
  }
  if (group.level === 0) return { key: `groups.minimal.none.${firmness}`, values };
  if (group.level > 0) return { key: `${words}.minimal.${group.level === extremes.best ? "best" : "better"}.${firmness}`, values };
  return { key: `${words}.minimal.${group.level === extremes.worst && group.level < -1 ? "worst" : "worse"}.${firmness}`, values };
}

export function concludeOutcome(result: AnalysisResult, certainty: ComparisonCertainty[], outcome: OutcomeFacts): OutcomeConclusions {
  const rated = new Map(certainty.map((c) => [pairKey(c.treatment, c.comparator), c.network]));
  const scale = decisionScale(result, outcome.thresholds, outcome.baselineRisk);
  // On the thresholds' scale: whether an interval holds the null reads the same on every scale.
  const evidence = (t: string, u: string) => ({ ...scale.effect(t, u), certainty: rated.get(pairKey(t, u)) ?? null });
  const framework: Framework = scale.thresholds ? "partial" : "minimal";
  const groups = scale.thresholds
    ? groupByMagnitude(result.treatments, result.reference, result.better, scale.thresholds, evidence)
    : groupTreatments(result.treatments, result.reference, result.better, evidence);
  const levels = groups.filter((g) => g.firmness === "firm" || g.firmness === "may").map((g) => g.level);
  const extremes = { best: Math.max(0, ...levels), worst: Math.min(0, ...levels) };
  const name = (label: string) => outcome.names[label] ?? label;

  const readings = result.treatments.flatMap((t) =>
    result.treatments
      .filter((u) => u !== t)
      .map((u): ComparisonReading => {
        const network = comparisonOf(result, t, u)!.network;
        const rating = rated.get(pairKey(t, u)) ?? null;
        const magnitude = magnitudeFor(scale.effect(t, u), scale.thresholds);
        const statement = rating
          ? statementFor({ treatment: name(t), comparator: name(u), outcome: outcome.statementPhrase?.trim() || inSentence(outcome.name), estimate: network.estimate, certainty: rating, magnitude })
          : null;
        const comparatorRisk = scale.riskUnder(u);
        const absolute = comparatorRisk === null ? null : absoluteEffect(result.measure, network, comparatorRisk);
        return {
          treatment: t,
          comparator: u,
          certainty: rating,
          magnitude,
          statement,
          absolute: absolute ? { ...absolute, statement: absoluteStatement(absolute.differencePer1000) } : null,
        };
      }),
  );

  return {
    framework,
    groups: groups.map((group) => {
      const hedged = group.treatments.some((t) => t !== result.reference && rated.get(pairKey(t, result.reference)) === "moderate");
      return { ...group, label: groupLabel(group, framework, extremes, { label: result.reference, name: name(result.reference) }, hedged, outcome.measuresHarm) };
    }),
    readings,
    rankScores: rankExplainer(result),
  };
}
