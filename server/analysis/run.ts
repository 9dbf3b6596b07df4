// Uploading data and running the engine for an outcome. The stored result carries the engine
// version and a checksum of everything it was computed from, so a stale result shows as stale.
import { createHash } from "node:crypto";
import { and, desc, eq, sql } from "drizzle-orm";
import { recordAudit } from "../audit";
import type { Database, Executor } from "../db/client";
import { analysisResults, datasets, type outcomes } from "../db/schema";
import { analyse, engineVersion, type AnalysisResult } from "../nma/analyse";
import { parseDataset } from "../nma/parse";
import type { AnalysisOptions, Format, ParsedDataset } from "../nma/types";

type Outcome = typeof outcomes.$inferSelect;

export function analysisSettings(outcome: Outcome): AnalysisOptions {
  return {
    measure: outcome.measure,
    model: outcome.model,
    reference: outcome.referenceTreatment,
    better: outcome.direction,
    draws: 10_000,
    seed: 1,
  };
}

export function inputChecksum(datasetSha256: string, settings: AnalysisOptions): string {
  return createHash("sha256").update(JSON.stringify({ datasetSha256, settings, engineVersion })).digest("hex");
}

/** Formats that fit an outcome's kind: contrasts carry any measure. */
export function formatFitsOutcome(format: Format, outcome: Outcome): boolean {
  return format === "contrast" || (outcome.kind === "binary" ? format === "arm-binary" : format === "arm-continuous");
}

/**
 * Validates the file by the engine's rules, analysing it with the outcome's settings: a file the
 * engine cannot analyse is not stored (throws DatasetError). A valid file is kept with its bytes,
 * SHA-256 and parsed rows, and its result is stored; earlier uploads stay in the history.
 */
export async function storeDataset(
  db: Database,
  outcome: Outcome,
  file: { name: string; bytes: Buffer },
  format: Format,
  actorId: string,
) {
  const parsed = parseDataset(file.bytes, format);
  const settings = analysisSettings(outcome);
  const result = analyse(parsed, settings);
  const sha256 = createHash("sha256").update(file.bytes).digest("hex");
  return db.transaction(async (tx) => {
    const [dataset] = await tx
      .insert(datasets)
      .values({ outcomeId: outcome.id, format, fileName: file.name, original: file.bytes, sha256, parsed, uploadedBy: actorId })
      .returning({ id: datasets.id, sha256: datasets.sha256, uploadedAt: datasets.uploadedAt });
    const stored = await recordResult(tx, outcome.id, dataset!, settings, result);
    await recordAudit(tx, {
      actorId,
      action: "upload",
      entity: "outcome",
      entityId: outcome.id,
      before: null,
      after: { datasetId: dataset!.id, fileName: file.name, sha256, format, resultId: stored!.id },
    });
    return { dataset: dataset!, resultId: stored!.id, result };
  });
}

/** Analyses the outcome's current data again with its current settings (after the settings changed). */
export async function rerunLatest(db: Executor, outcome: Outcome): Promise<void> {
  const dataset = await latestDataset(db, outcome.id);
  if (!dataset) return;
  const settings = analysisSettings(outcome);
  await recordResult(db, outcome.id, dataset, settings, analyse(dataset.parsed as ParsedDataset, settings));
}

/** Stores one engine run with what it was computed from: the engine version and the input checksum. */
async function recordResult(
  db: Executor,
  outcomeId: string,
  dataset: { id: string; sha256: string },
  settings: AnalysisOptions,
  result: AnalysisResult,
): Promise<{ id: string }> {
  const [row] = await db
    .insert(analysisResults)
    .values({ outcomeId, datasetId: dataset.id, engineVersion, inputChecksum: inputChecksum(dataset.sha256, settings), settings, result })
    .returning({ id: analysisResults.id });
  return row!;
}

export async function latestDataset(db: Executor, outcomeId: string) {
  return (await db.query.datasets.findFirst({ where: eq(datasets.outcomeId, outcomeId), orderBy: desc(datasets.uploadedAt) })) ?? null;
}

export async function latestResult(db: Database, outcomeId: string) {
  return (
    (await db.query.analysisResults.findFirst({
      where: eq(analysisResults.outcomeId, outcomeId),
      orderBy: desc(analysisResults.createdAt),
    })) ?? null
  );
}

/** The treatment labels of the outcome's latest result, without loading the whole result. */
export async function latestTreatments(db: Database, outcomeId: string): Promise<string[]> {
  const [row] = await db
    .select({ treatments: sql<string[]>`${analysisResults.result}->'treatments'` })
    .from(analysisResults)
    .where(eq(analysisResults.outcomeId, outcomeId))
    .orderBy(desc(analysisResults.createdAt))
    .limit(1);
  return row?.treatments ?? [];
}

/** Whether the outcome has data and a result, and whether that result still matches the data and settings. */
export async function analysisStatus(db: Database, outcome: Outcome) {
  // Only the small columns: the file's bytes, its parsed rows and the result stay in the database.
  const [dataset] = await db
    .select({ id: datasets.id, fileName: datasets.fileName, sha256: datasets.sha256, uploadedAt: datasets.uploadedAt })
    .from(datasets)
    .where(eq(datasets.outcomeId, outcome.id))
    .orderBy(desc(datasets.uploadedAt))
    .limit(1);
  if (!dataset) return { state: "no-data" as const };
  const [result] = await db
    .select({ id: analysisResults.id, inputChecksum: analysisResults.inputChecksum, engineVersion: analysisResults.engineVersion })
    .from(analysisResults)
    .where(and(eq(analysisResults.outcomeId, outcome.id), eq(analysisResults.datasetId, dataset.id)))
    .orderBy(desc(analysisResults.createdAt))
    .limit(1);
  const expected = inputChecksum(dataset.sha256, analysisSettings(outcome));
  return {
    state: result && result.inputChecksum === expected ? ("current" as const) : ("stale" as const),
    datasetId: dataset.id,
    fileName: dataset.fileName,
    sha256: dataset.sha256,
    uploadedAt: dataset.uploadedAt,
    resultId: result?.id ?? null,
    engineVersion: result?.engineVersion ?? null,
  };
}
