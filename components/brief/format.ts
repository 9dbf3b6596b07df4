// How effects read on the public pages: on their display scale, with the 95% CI.
import type { Measure } from "../../server/nma/types";
import { formatEffect } from "../charts/scale";

export function formatInterval(measure: Measure, x: { estimate: number; lower: number; upper: number }, to: string): string {
  return `${formatEffect(measure, x.estimate)} (${formatEffect(measure, x.lower)} ${to} ${formatEffect(measure, x.upper)})`;
}

