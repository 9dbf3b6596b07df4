// Plain-language statements of an effect and its certainty (METHODS.md §10; Santesso et al., GRADE
// guidelines 26, J Clin Epidemiol 2020;119:126–135). The wording lives in locales/<locale>/common.json
// under "statement", so every language follows the same rule; this file only chooses the key.
import type { Rating } from "./certainty";

/**
 * "trivial" needs thresholds: the estimate lies below the smallest one. "unclear" is an outcome without
 * thresholds whose 95% CI includes the null (METHODS.md §10): no trivial band, so the evidence does not
 * show a clear difference — never "little to no difference", which claims a trivial effect.
 */
export type Magnitude = "large" | "moderate" | "small" | "trivial" | "unclear";

/** The size of the point estimate (absolute, analysis scale) against the outcome's thresholds. */
export function magnitudeOf(estimate: number, thresholds: { small: number; moderate: number; large: number }): Magnitude {
  const size = Math.abs(estimate);
  if (size >= thresholds.large) return "large";
  if (size >= thresholds.moderate) return "moderate";
  if (size >= thresholds.small) return "small";
  return "trivial";
}

export interface Statement {
  key: string;
  values: { treatment: string; comparator: string; outcome: string };
}

/**
 * The message key for "treatment vs comparator" on an outcome: very low certainty has one wording;
 * otherwise certainty × magnitude × whether the treatment lowers or raises the outcome.
 */
export function statementFor(input: {
  treatment: string;
  comparator: string;
  outcome: string;
  estimate: number;
  certainty: Rating;
  magnitude: Magnitude;
}): Statement {
  const values = { treatment: input.treatment, comparator: input.comparator, outcome: input.outcome };
  if (input.certainty === "very_low") return { key: "statement.very_low", values };
  if (input.magnitude === "trivial" || input.magnitude === "unclear") return { key: `statement.${input.certainty}.${input.magnitude}`, values };
  const change = input.estimate < 0 ? "reduce" : "increase";
  return { key: `statement.${input.certainty}.${input.magnitude}.${change}`, values };
}

/**
 * "N fewer per 1000 (from … to …)" for binary outcomes: the key and the rounded counts. A difference
 * that rounds to none reads "0 fewer", as summary-of-findings tables write it, never "no difference",
 * which would claim what the interval does not show.
 */
export function absoluteStatement(difference: { estimate: number; lower: number; upper: number }) {
  const round = (x: number) => Math.round(Math.abs(x));
  const side = (x: number) => (Math.round(x) > 0 ? "more" : "fewer");
  return {
    key: `statement.absolute.${side(difference.estimate)}`,
    values: {
      count: round(difference.estimate),
      from: `${round(difference.lower)} ${side(difference.lower)}`,
      to: `${round(difference.upper)} ${side(difference.upper)}`,
    },
  };
}
