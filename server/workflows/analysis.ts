// Uploading data and running the engine for an outcome: the file is parsed and analysed by the pure
// engine, and only a file the engine can analyse is stored, with its result, in one transaction.
import { createHash } from "node:crypto";
import type { Format, ParsedDataset } from "#core/nma/types";
import { analysisSettings, insertDataset, latestDataset, recordResult } from "#db/analyses";
import { recordAudit } from "#db/audit";
import type { Database, Executor } from "#db/client";
import type { OutcomeRow } from "#db/outcomes";
import { analyseParsed, parseAndAnalyse } from "./engine-thread";

/** Formats that fit an outcome's kind: contrasts carry any measure. */
export function formatFitsOutcome(format: Format, outcome: OutcomeRow): boolean {
  return format === "contrast" || (outcome.kind === "binary" ? format === "arm-binary" : format === "arm-continuous");
}

/**
 * Validates the file by the engine's rules, analysing it with the outcome's settings: a file the
 * engine cannot analyse is not stored (throws DatasetError). A valid file is kept with its bytes,
 * SHA-256 and parsed rows, and its result is stored; earlier uploads stay in the history.
 */
export async function storeDataset(db: Database, outcome: OutcomeRow, file: { name: string; bytes: Buffer }, format: Format, actorId: string) {
  const settings = analysisSettings(outcome);
  // In the engine's thread: a large or broken file must not hold up every other request.
  const { parsed, result } = await parseAndAnalyse(file.bytes, format, settings);
  const sha256 = createHash("sha256").update(file.bytes).digest("hex");
  return db.transaction(async (tx) => {
    const dataset = await insertDataset(tx, { outcomeId: outcome.id, format, fileName: file.name, original: file.bytes, sha256, parsed, uploadedBy: actorId });
    const stored = await recordResult(tx, outcome.id, dataset, settings, result);
    await recordAudit(tx, {
      actorId,
      action: "upload",
      entity: "outcome",
      entityId: outcome.id,
      before: null,
      after: { datasetId: dataset.id, fileName: file.name, sha256, format, resultId: stored.id },
    });
    return { dataset, resultId: stored.id, result, parsed };
  });
}

/** Analyses the outcome's current data again with its current settings (after the settings changed). */
export async function rerunLatest(db: Executor, outcome: OutcomeRow): Promise<{ resultId: string } | null> {
  const dataset = await latestDataset(db, outcome.id);
  if (!dataset) return null;
  const settings = analysisSettings(outcome);
  const stored = await recordResult(db, outcome.id, dataset, settings, await analyseParsed(dataset.parsed as ParsedDataset, settings));
  return { resultId: stored.id };
}

/**
 * The analyst's "run again": the stored data analysed by the engine as it is now (a result of an
 * earlier engine version shows as stale, docs/decisions/0006). Judgements are kept by pair, so they
 * stay. Throws DatasetError, changing nothing, when the engine now refuses the data.
 */
export async function analyseAgain(db: Database, outcome: OutcomeRow, actorId: string): Promise<{ resultId: string } | null> {
  return db.transaction(async (tx) => {
    const rerun = await rerunLatest(tx, outcome);
    if (rerun) await recordAudit(tx, { actorId, action: "analyse-again", entity: "outcome", entityId: outcome.id, before: null, after: rerun });
    return rerun;
  });
}
