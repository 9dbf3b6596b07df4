// Which measures go with which input format, checked before any data is read.
import type { Format, Measure } from "./types";

export const measuresByFormat: Record<Format, readonly Measure[]> = {
  "arm-binary": ["OR", "RR", "RD"],
  "arm-continuous": ["MD"],
  // Contrasts arrive on the analysis scale already; the measure only names that scale.
  contrast: ["OR", "RR", "RD", "MD"],
};
