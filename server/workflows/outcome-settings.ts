// Changing an outcome's settings: checked whole (server/core/editorial/outcome.ts), written only if nobody
// changed the outcome since the writer read it, and the analysis of its current data re-run with the
// new settings in the same transaction. When the data cannot be analysed that way, nothing changes.
import { outcomeInput, type OutcomeInput } from "#core/editorial/outcome";
import type { z } from "zod";
import { recordAudit } from "#db/audit";
import type { Database } from "#db/client";
import { findOutcome, outcomeInputOf, updateOutcomeSettings, type OutcomeRow } from "#db/outcomes";
import { rerunLatest } from "./analysis";

export type OutcomeUpdate =
  | { ok: true; outcome: OutcomeRow }
  | { ok: false; reason: "not-found" }
  | { ok: false; reason: "conflict"; current: OutcomeRow }
  | { ok: false; reason: "invalid"; error: z.ZodError };

/** Throws DatasetError (and changes nothing) when the current data cannot be analysed with the new settings. */
export async function changeOutcomeSettings(db: Database, id: string, rowVersion: number, changes: Partial<OutcomeInput>, actorId: string): Promise<OutcomeUpdate> {
  return db.transaction(async (tx) => {
    const before = await findOutcome(tx, id);
    if (!before) return { ok: false, reason: "not-found" };
    if (before.rowVersion !== rowVersion) return { ok: false, reason: "conflict", current: before };
    const merged = outcomeInput.safeParse({ ...outcomeInputOf(before), ...changes });
    if (!merged.success) return { ok: false, reason: "invalid", error: merged.error };
    const row = await updateOutcomeSettings(tx, id, rowVersion, merged.data);
    if (!row) return { ok: false, reason: "conflict", current: (await findOutcome(tx, id))! };
    await rerunLatest(tx, row);
    await recordAudit(tx, { actorId, action: "update", entity: "outcome", entityId: id, before, after: row });
    return { ok: true, outcome: row };
  });
}
