// Absolute effects per 1000 for binary outcomes (METHODS.md §7; GRADE Handbook section 5, common
// practice): the risk under a treatment from the baseline risk p₀ and the relative effect.
import type { Measure } from "./types";

export interface AbsoluteEffect {
  baselinePer1000: number;
  treatmentPer1000: { estimate: number; lower: number; upper: number };
  differencePer1000: { estimate: number; lower: number; upper: number };
}

const clamp = (p: number) => Math.min(1, Math.max(0, p));

/** p₁ from p₀ and an effect on the analysis scale (log OR, log RR, or RD). */
export function treatmentRisk(measure: Measure, effect: number, p0: number): number {
  switch (measure) {
    case "OR": {
      const or = Math.exp(effect);
      return clamp((or * p0) / (1 - p0 + or * p0));
    }
    case "RR":
      return clamp(Math.exp(effect) * p0);
    case "RD":
      return clamp(p0 + effect);
    case "MD":
      throw new Error("absolute effects per 1000 are for binary outcomes; MD is already absolute");
  }
}

/** Each bound of the 95% CI is mapped through the same formula as the estimate. */
export function absoluteEffect(
  measure: Measure,
  effect: { estimate: number; lower: number; upper: number },
  p0: number,
): AbsoluteEffect {
  const risk = (x: number) => treatmentRisk(measure, x, p0);
  const per1000 = (p: number) => 1000 * p;
  const [low, high] = [risk(effect.lower), risk(effect.upper)].sort((a, b) => a - b) as [number, number];
  const estimate = risk(effect.estimate);
  return {
    baselinePer1000: per1000(p0),
    treatmentPer1000: { estimate: per1000(estimate), lower: per1000(low), upper: per1000(high) },
    differencePer1000: { estimate: per1000(estimate - p0), lower: per1000(low - p0), upper: per1000(high - p0) },
  };
}
