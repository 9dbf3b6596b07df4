// Participants behind a direct comparison: the people in the arms of a and b of every study that
// compares them, counted as the engine counts participants for the network diagram — only studies
// the analysis used (METHODS.md §2: a study without information is left out), and only where the
// format has arm sizes (contrast data has none, so the count is unknown).
import type { ParsedStudy } from "./types";

export function directParticipants(studies: readonly ParsedStudy[], excludedStudies: readonly string[], a: string, b: string): number | null {
  const excluded = new Set(excludedStudies);
  let total = 0;
  for (const study of studies) {
    if (study.format === "contrast") return null;
    if (excluded.has(study.study)) continue;
    const arms = (study.arms as { treatment: string; total?: number; n?: number }[]).filter((arm) => arm.treatment === a || arm.treatment === b);
    if (arms.length < 2) continue;
    total += arms.reduce((sum, arm) => sum + (arm.total ?? arm.n ?? 0), 0);
  }
  return total;
}
