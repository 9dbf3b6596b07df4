// Uploaded data sets and engine results of outcomes. A stored result carries the engine version and a
// checksum of everything it was computed from, so a stale result shows as stale.
import { readStoredResult } from "#core/nma/stored-result";
import { createHash } from "node:crypto";
import { and, desc, eq, sql } from "drizzle-orm";
import { engineVersion, type AnalysisResult } from "#core/nma/analyse";
import type { AnalysisOptions, DatasetIssue, Format, ParsedDataset } from "#core/nma/types";
import type { Executor } from "./client";
import { analysisResults, datasets, pendingUploads } from "./schema";
import type { OutcomeRow } from "./outcomes";

export function analysisSettings(outcome: OutcomeRow): AnalysisOptions {
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

/** Keeps an uploaded file with its bytes, SHA-256 and parsed rows; earlier uploads stay in the history. */
export async function insertDataset(
  db: Executor,
  values: { outcomeId: string; format: Format; fileName: string; original: Buffer; sha256: string; parsed: ParsedDataset; uploadedBy: string; uploadedAt?: Date },
) {
  const [dataset] = await db.insert(datasets).values(values).returning({ id: datasets.id, sha256: datasets.sha256, uploadedAt: datasets.uploadedAt });
  return dataset!;
}

/** Stores one engine run with what it was computed from: the engine version and the input checksum. */
export async function recordResult(
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

/** The outcome's latest result, if this engine version wrote it (server/core/nma/stored-result.ts). */
export async function latestResult(db: Executor, outcomeId: string) {
  const row = await db.query.analysisResults.findFirst({
    where: eq(analysisResults.outcomeId, outcomeId),
    orderBy: desc(analysisResults.createdAt),
  });
  const result = row ? readStoredResult(row) : null;
  return row && result ? { ...row, result } : null;
}

/** The treatment labels of the outcome's latest result, without loading the whole result. */
export async function latestTreatments(db: Executor, outcomeId: string): Promise<string[]> {
  const [row] = await db
    .select({ treatments: sql<string[]>`${analysisResults.result}->'treatments'` })
    .from(analysisResults)
    .where(eq(analysisResults.outcomeId, outcomeId))
    .orderBy(desc(analysisResults.createdAt))
    .limit(1);
  return row?.treatments ?? [];
}

/** Whether the outcome has data and a result, and whether that result still matches the data and settings. */
/** A large upload newer than the outcome's data: still analysing, or refused with its problems. */
async function pendingSince(db: Executor, outcomeId: string, since: Date | null) {
  const pending = await latestPendingUpload(db, outcomeId);
  if (!pending || (since && pending.uploadedAt <= since)) return null;
  return { fileName: pending.fileName, state: pending.state, issues: pending.issues ?? [] };
}

export async function analysisStatus(db: Executor, outcome: OutcomeRow) {
  // Only the small columns: the file's bytes, its parsed rows and the result stay in the database.
  const [dataset] = await db
    .select({ id: datasets.id, fileName: datasets.fileName, sha256: datasets.sha256, uploadedAt: datasets.uploadedAt })
    .from(datasets)
    .where(eq(datasets.outcomeId, outcome.id))
    .orderBy(desc(datasets.uploadedAt))
    .limit(1);
  if (!dataset) return { state: "no-data" as const, pending: await pendingSince(db, outcome.id, null) };
  const [result] = await db
    .select({ id: analysisResults.id, inputChecksum: analysisResults.inputChecksum, engineVersion: analysisResults.engineVersion })
    .from(analysisResults)
    .where(and(eq(analysisResults.outcomeId, outcome.id), eq(analysisResults.datasetId, dataset.id)))
    .orderBy(desc(analysisResults.createdAt))
    .limit(1);
  const expected = inputChecksum(dataset.sha256, analysisSettings(outcome));
  return {
    state: result && result.inputChecksum === expected ? ("current" as const) : ("stale" as const),
    pending: await pendingSince(db, outcome.id, dataset.uploadedAt),
    datasetId: dataset.id,
    fileName: dataset.fileName,
    sha256: dataset.sha256,
    uploadedAt: dataset.uploadedAt,
    resultId: result?.id ?? null,
    engineVersion: result?.engineVersion ?? null,
  };
}

/** A large upload waiting for the queue's analysis (table pending_uploads). */
export async function insertPendingUpload(db: Executor, values: { outcomeId: string; format: Format; fileName: string; original: Buffer; uploadedBy: string }) {
  const [row] = await db.insert(pendingUploads).values({ ...values, state: "analysing" }).returning({ id: pendingUploads.id, uploadedAt: pendingUploads.uploadedAt });
  return row!;
}

export async function findPendingUpload(db: Executor, id: string) {
  return (await db.query.pendingUploads.findFirst({ where: eq(pendingUploads.id, id) })) ?? null;
}

export async function deletePendingUpload(db: Executor, id: string): Promise<void> {
  await db.delete(pendingUploads).where(eq(pendingUploads.id, id));
}

/** The engine refused it: its problems are kept for the desk, and nothing else changes. */
export async function refusePendingUpload(db: Executor, id: string, issues: DatasetIssue[]): Promise<void> {
  await db.update(pendingUploads).set({ state: "refused", issues }).where(eq(pendingUploads.id, id));
}

/** The outcome's newest large upload that is still analysing or was refused, without its bytes. */
export async function latestPendingUpload(db: Executor, outcomeId: string) {
  const [row] = await db
    .select({ id: pendingUploads.id, fileName: pendingUploads.fileName, state: pendingUploads.state, issues: pendingUploads.issues, uploadedAt: pendingUploads.uploadedAt })
    .from(pendingUploads)
    .where(eq(pendingUploads.outcomeId, outcomeId))
    .orderBy(desc(pendingUploads.uploadedAt))
    .limit(1);
  return row ?? null;
}
