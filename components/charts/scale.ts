// How estimates on the analysis scale are shown: ratios (OR, RR) exponentiated, differences as they are.
import type { Measure } from "../../server/nma/types";

export const isRatio = (measure: Measure) => measure === "OR" || measure === "RR";

export function displayValue(measure: Measure, value: number): number {
  return isRatio(measure) ? Math.exp(value) : value;
}

export function formatEffect(measure: Measure, value: number): string {
  const shown = displayValue(measure, value);
  const text = isRatio(measure) ? shown.toFixed(2) : shown.toFixed(Math.abs(shown) < 10 ? 2 : 1);
  // A value that rounds to zero reads as zero, not "-0.00".
  return /^-0(\.0+)?$/.test(text) ? text.slice(1) : text;
}
