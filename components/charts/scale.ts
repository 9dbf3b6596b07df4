// The axis of a chart of effects: ratios (OR, RR) tick at round ratios on a log axis.
import { isRatio } from "#core/publication/effects";
import type { Measure } from "#core/nma/types";

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
