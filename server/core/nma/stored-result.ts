// An analysis result as the database keeps it: written by the engine of its `engineVersion`. Unlike a
// released version's snapshot, which is frozen and read through upgrades (server/core/snapshot/upgrade.ts),
// a result can always be computed again from the stored data and settings; so a result of another
// engine version is never read as this engine's shape: it counts as no result until analysed again.
import { engineVersion, type AnalysisResult } from "./analyse";

export interface StoredResult {
  engineVersion: string;
  result: unknown;
}

/** The stored result in this engine's shape, or null when another engine version wrote it. */
export function readStoredResult(stored: StoredResult): AnalysisResult | null {
  // Written by this very engine version, from the same type: the one place the stored JSON is taken as it.
  return stored.engineVersion === engineVersion ? (stored.result as AnalysisResult) : null;
}
