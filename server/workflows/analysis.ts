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
export async function rerunLatest(db: Executor, outcome: OutcomeRow): Promise<void> {
  const dataset = await latestDataset(db, outcome.id);
  if (!dataset) return;
  const settings = analysisSettings(outcome);
  await recordResult(db, outcome.id, dataset, settings, await analyseParsed(dataset.parsed as ParsedDataset, settings));
}
