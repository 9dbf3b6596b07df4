// How estimates on the analysis scale read (METHODS.md: ratio measures are exponentiated only for
// display): the one formatter of an effect and of its 95% CI, for pages, charts and the desk.
import type { Measure } from "./nma/types";
import type { Interval } from "./pairs";

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

/** "2.83 (1.99 to 4.01)": `to` is the locale's word (brief.to). */
export function formatInterval(measure: Measure, x: Interval, to: string): string {
  return `${formatEffect(measure, x.estimate)} (${formatEffect(measure, x.lower)} ${to} ${formatEffect(measure, x.upper)})`;
}
