// The scale an outcome's thresholds are stated on (METHODS.md §9, as the GRADE guidance frames them
// in absolute terms): for a binary outcome, the difference per 1000 people at the outcome's baseline
// risk (§7), each CI bound mapped the same way; for a continuous outcome, its own units (the mean
// difference). Never the analysis scale (log OR). Pure.
import type { Interval } from "../nma/pairs";
import { absoluteEffect, treatmentRisk } from "../nma/absolute";
import type { AnalysisResult } from "../nma/analyse";
import { comparisonOf } from "../nma/comparison";

export interface Thresholds {
  small: number | null;
  moderate: number | null;
  large: number | null;
}

export const hasThresholds = (thresholds: Thresholds) => thresholds.small !== null || thresholds.moderate !== null || thresholds.large !== null;

export interface DecisionScale {
  /** The outcome's thresholds, or null when it has none, or when a binary outcome has no baseline risk to state them through. */
  thresholds: Thresholds | null;
  /**
   * "t vs u" on the thresholds' scale: per 1000 at the comparator's risk (the baseline risk for the
   * reference, otherwise the risk under u that the baseline risk and u vs the reference give), or the
   * mean difference. Without a baseline risk, the analysis scale: whether an interval holds the null
   * reads the same on every scale.
   */
  effect(t: string, u: string): Interval;
  /** The risk under u (binary outcomes with a baseline risk), the comparator's risk of "t vs u"; null otherwise. */
  riskUnder(u: string): number | null;
  /** "per1000" or "units": how the thresholds read. */
  unit: "per1000" | "units";
}

export function decisionScale(result: AnalysisResult, thresholds: Thresholds, baselineRisk: number | null): DecisionScale {
  const network = (t: string, u: string) => comparisonOf(result, t, u)!.network;
  if (result.measure === "MD") return { thresholds: hasThresholds(thresholds) ? thresholds : null, effect: network, riskUnder: () => null, unit: "units" };
  if (baselineRisk === null) return { thresholds: null, effect: network, riskUnder: () => null, unit: "per1000" };
  const riskUnder = (u: string) => (u === result.reference ? baselineRisk : treatmentRisk(result.measure, network(u, result.reference).estimate, baselineRisk));
  return {
    thresholds: hasThresholds(thresholds) ? thresholds : null,
    effect: (t, u) => absoluteEffect(result.measure, network(t, u), riskUnder(u)).differencePer1000,
    riskUnder,
    unit: "per1000",
  };
}
