// Uploading data and running the engine for an outcome: the file is parsed and analysed by the pure
// engine, and only a file the engine can analyse is stored, with its result, in one transaction.
import { createHash } from "node:crypto";
import type { AnalysisResult } from "#core/nma/analyse";
import { DatasetError, type Format, type ParsedDataset } from "#core/nma/types";
import { analysisSettings, deletePendingUpload, findPendingUpload, insertDataset, insertPendingUpload, latestDataset, recordResult, refusePendingUpload } from "#db/analyses";
import { recordAudit } from "#db/audit";
import type { Database, Executor } from "#db/client";
import { findOutcome, type OutcomeRow } from "#db/outcomes";
import type { Queue } from "./queue";
import { analyseParsed, checkFile, parseAndAnalyse } from "./engine-thread";

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
  return keepAnalysed(db, outcome, { ...file, format, actorId }, parsed, result);
}

/** An analysed file and its result, stored together with the audit row (`uploadedAt`: when it was sent, for a queued one). */
async function keepAnalysed(
  db: Database,
  outcome: OutcomeRow,
  file: { name: string; bytes: Buffer; format: Format; actorId: string; uploadedAt?: Date; pendingId?: string },
  parsed: ParsedDataset,
  result: AnalysisResult,
) {
  const settings = analysisSettings(outcome);
  const { format, actorId } = file;
  const sha256 = createHash("sha256").update(file.bytes).digest("hex");
  return db.transaction(async (tx) => {
    const dataset = await insertDataset(tx, { outcomeId: outcome.id, format, fileName: file.name, original: file.bytes, sha256, parsed, uploadedBy: actorId, uploadedAt: file.uploadedAt });
    const stored = await recordResult(tx, outcome.id, dataset, settings, result);
    await recordAudit(tx, {
      actorId,
      action: "upload",
      entity: "outcome",
      entityId: outcome.id,
      before: null,
      after: { datasetId: dataset.id, fileName: file.name, sha256, format, resultId: stored.id },
    });
    // A queued upload leaves the queue's waiting room in the same transaction: a retried job finds it gone.
    if (file.pendingId) await deletePendingUpload(tx, file.pendingId);
    return { dataset, resultId: stored.id, result, parsed };
  });
}

/**
 * Files of more than this many lines are analysed as a job on the queue (any process may take it),
 * so that the request answers at once; smaller ones, which the engine analyses in well under a
 * second, answer with their result (common practice: the 27 × 300 network of the benchmark is
 * about 650 lines and takes 0.1 s).
 */
export const queuedUploadLines = 1000;
export const analysisJob = "analyse-upload";

export function isLargeUpload(bytes: Buffer): boolean {
  // Line ends found by the buffer's own search, stopping at the limit: a multi-megabyte file costs microseconds.
  let at = -1;
  for (let lines = 0; lines <= queuedUploadLines; lines++) {
    at = bytes.indexOf(0x0a, at + 1);
    if (at < 0) return false;
  }
  return true;
}

/**
 * Checks a large upload against the input formats' rules (in the engine's thread; throws DatasetError,
 * storing nothing, as a small upload does), keeps it aside and asks the queue to analyse it; the desk
 * shows it as analysing.
 */
export async function queueUpload(db: Database, queue: Queue, outcome: OutcomeRow, file: { name: string; bytes: Buffer }, format: Format, actorId: string) {
  await checkFile(file.bytes, format);
  // The upload and its job commit together: none waits "analysing" with no job to analyse it.
  return db.transaction(async (tx) => {
    const pending = await insertPendingUpload(tx, { outcomeId: outcome.id, format, fileName: file.name, original: file.bytes, uploadedBy: actorId });
    await queue.send(analysisJob, { uploadId: pending.id }, { in: tx });
    return pending;
  });
}

/**
 * The queue's worker for large uploads: the engine (in this process's engine thread) accepts the
 * file, and it becomes the outcome's data with its result exactly as a small upload does, or refuses
 * it, and its problems wait for the analyst beside the data stored before, which nothing changes.
 */
export async function startAnalysisWorker(db: Database, queue: Queue): Promise<void> {
  await queue.work<{ uploadId: string }>(analysisJob, async ({ data }) => {
    const upload = await findPendingUpload(db, data.uploadId);
    if (!upload || upload.state !== "analysing") return;
    const outcome = await findOutcome(db, upload.outcomeId);
    if (!outcome) return deletePendingUpload(db, upload.id);
    try {
      const { parsed, result } = await parseAndAnalyse(upload.original, upload.format, analysisSettings(outcome));
      await keepAnalysed(db, outcome, { name: upload.fileName, bytes: upload.original, format: upload.format, actorId: upload.uploadedBy!, uploadedAt: upload.uploadedAt, pendingId: upload.id }, parsed, result);
    } catch (error) {
      if (!(error instanceof DatasetError)) throw error;
      await refusePendingUpload(db, upload.id, error.issues);
    }
  });
}

/** Analyses the outcome's current data again with its current settings (after the settings changed). */
export async function rerunLatest(db: Executor, outcome: OutcomeRow): Promise<{ resultId: string } | null> {
  const dataset = await latestDataset(db, outcome.id);
  if (!dataset) return null;
  const settings = analysisSettings(outcome);
  const stored = await recordResult(db, outcome.id, dataset, settings, await analyseParsed(dataset.parsed, settings));
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
