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

/** Round ratios read better than e^k on a log axis: 0.5, 1, 2, 4 rather than 1.65 or 2.72. */
const roundRatios = [0.01, 0.02, 0.05, 0.1, 0.2, 0.25, 0.5, 0.75, 1, 1.5, 2, 3, 4, 5, 10, 20, 50, 100];

export function axisTicks(measure: Measure, [low, high]: [number, number], linear: number[]): number[] {
  if (!isRatio(measure)) return linear;
  const inside = roundRatios.map(Math.log).filter((t) => t >= low && t <= high);
  // At most seven ticks: keep every second one, then every third, until they fit.
  for (let step = 1; ; step++) {
    const kept = inside.filter((_, i) => i % step === 0 || inside[i] === 0);
    if (kept.length <= 7) return kept;
  }
}
