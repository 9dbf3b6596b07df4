// Certainty of an outcome's comparisons (METHODS.md §8): the rules of server/core/grade applied to
// its latest result and the judgements recorded so far, and recording a judgement, where a departure
// from a computed suggestion needs a reason. The desk and publishing read certainty from here alone.
import { assessCertainty, type ComparisonCertainty } from "#core/grade/assess";
import { unexplainedDepartures, type JudgementInput } from "#core/grade/judgement";
import type { AnalysisResult } from "#core/nma/analyse";
import { latestResult } from "#db/analyses";
import type { Database } from "#db/client";
import { loadJudgements, saveJudgement } from "#db/judgements";
import type { OutcomeRow } from "#db/outcomes";

export const thresholdsOf = (outcome: OutcomeRow) => ({ small: outcome.thresholdSmall, moderate: outcome.thresholdModerate, large: outcome.thresholdLarge });

/** Every comparison of the outcome's latest result with its ratings, suggestions and what is pending; null without a result. */
export async function outcomeCertainty(db: Database, outcome: OutcomeRow, result?: AnalysisResult): Promise<ComparisonCertainty[] | null> {
  const analysed = result ?? ((await latestResult(db, outcome.id))?.result as AnalysisResult | undefined);
  if (!analysed) return null;
  return assessCertainty(analysed, await loadJudgements(db, outcome.id), thresholdsOf(outcome), outcome.baselineRisk);
}

export type JudgementOutcome =
  | { ok: true; comparison: ComparisonCertainty }
  | { ok: false; reason: "no-result" }
  | { ok: false; reason: "no-comparison" }
  | { ok: false; reason: "unexplained"; domains: ("incoherence" | "imprecision")[] };

/** Records the analyst's judgement of "treatment vs comparator", named in the order the result lists the pair. */
export async function judgeComparison(db: Database, outcome: OutcomeRow, pair: { treatment: string; comparator: string }, judgement: JudgementInput, actorId: string): Promise<JudgementOutcome> {
  const matches = (c: ComparisonCertainty) => c.treatment === pair.treatment && c.comparator === pair.comparator;
  const before = await outcomeCertainty(db, outcome);
  if (!before) return { ok: false, reason: "no-result" };
  const current = before.find(matches);
  if (!current) return { ok: false, reason: "no-comparison" };
  const unexplained = unexplainedDepartures(judgement, current);
  if (unexplained.length > 0) return { ok: false, reason: "unexplained", domains: unexplained };
  await saveJudgement(db, { outcomeId: outcome.id, ...pair }, judgement, actorId);
  return { ok: true, comparison: (await outcomeCertainty(db, outcome))!.find(matches)! };
}
