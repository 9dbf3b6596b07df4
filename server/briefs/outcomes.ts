// Outcomes of a brief: what was measured, how it is analysed and what counts as a small, moderate or large effect.
import { and, eq, sql } from "drizzle-orm";
import { z } from "zod";
import { recordAudit } from "../audit";
import type { Database, Executor } from "../db/client";
import { outcomes } from "../db/schema";

export type OutcomeRow = typeof outcomes.$inferSelect;

const outcomeFields = z.object({
    name: z.string().trim().min(1).max(200),
    kind: z.enum(["binary", "continuous"]),
    measure: z.enum(["OR", "RR", "RD", "MD"]),
    model: z.enum(["fixed", "random"]),
    referenceTreatment: z.string().trim().min(1).max(200),
    direction: z.enum(["higher", "lower"]),
    baselineRisk: z.number().gt(0).lt(1).nullish(),
    unit: z.string().trim().max(50).nullish(),
    thresholdSmall: z.number().positive().nullish(),
    thresholdModerate: z.number().positive().nullish(),
    thresholdLarge: z.number().positive().nullish(),
});

export const outcomeInput = outcomeFields
  .refine((o) => (o.kind === "binary" ? o.measure !== "MD" : o.measure === "MD"), {
    message: "binary outcomes take OR, RR or RD; continuous outcomes take MD",
    path: ["measure"],
  })
  .refine(
    (o) => {
      const given = [o.thresholdSmall, o.thresholdModerate, o.thresholdLarge].filter((t): t is number => t != null);
      return given.every((t, i) => i === 0 || t > given[i - 1]!);
    },
    { message: "thresholds must grow from small to moderate to large", path: ["thresholdModerate"] },
  );

export type OutcomeInput = z.infer<typeof outcomeInput>;

/** A PATCH names the row version it read and any fields to change; the merged outcome is checked whole. */
export const outcomePatch = outcomeFields.partial().extend({ rowVersion: z.number().int().positive() }).strict();

export async function createOutcome(db: Database, briefId: string, input: OutcomeInput, actorId: string): Promise<OutcomeRow> {
  return db.transaction(async (tx) => {
    const [{ next }] = (await tx
      .select({ next: sql<number>`coalesce(max(${outcomes.position}), 0) + 1` })
      .from(outcomes)
      .where(eq(outcomes.briefId, briefId))) as [{ next: number }];
    const [row] = await tx.insert(outcomes).values({ ...input, briefId, position: Number(next) }).returning();
    await recordAudit(tx, { actorId, action: "create", entity: "outcome", entityId: row!.id, before: null, after: row });
    return row!;
  });
}

export type OutcomeUpdate =
  | { ok: true; outcome: OutcomeRow }
  | { ok: false; reason: "not-found" }
  | { ok: false; reason: "conflict"; current: OutcomeRow }
  | { ok: false; reason: "invalid"; error: z.ZodError };

/**
 * Changes an outcome's settings if nobody changed it since `rowVersion`, and re-runs the analysis
 * of its current data with the new settings in the same transaction (`rerun` throws DatasetError
 * when the data cannot be analysed that way; then nothing changes).
 */
export async function updateOutcome(
  db: Database,
  id: string,
  rowVersion: number,
  changes: Partial<OutcomeInput>,
  actorId: string,
  rerun: (tx: Executor, outcome: OutcomeRow) => Promise<void>,
): Promise<OutcomeUpdate> {
  return db.transaction(async (tx) => {
    const before = await tx.query.outcomes.findFirst({ where: eq(outcomes.id, id) });
    if (!before) return { ok: false, reason: "not-found" };
    if (before.rowVersion !== rowVersion) return { ok: false, reason: "conflict", current: before };
    const merged = outcomeInput.safeParse({ ...pickInput(before), ...changes });
    if (!merged.success) return { ok: false, reason: "invalid", error: merged.error };
    const [row] = await tx
      .update(outcomes)
      .set({ ...merged.data, rowVersion: rowVersion + 1 })
      .where(and(eq(outcomes.id, id), eq(outcomes.rowVersion, rowVersion)))
      .returning();
    if (!row) return { ok: false, reason: "conflict", current: (await tx.query.outcomes.findFirst({ where: eq(outcomes.id, id) }))! };
    await rerun(tx, row);
    await recordAudit(tx, { actorId, action: "update", entity: "outcome", entityId: id, before, after: row });
    return { ok: true, outcome: row };
  });
}

function pickInput(row: OutcomeRow): OutcomeInput {
  const { name, kind, measure, model, referenceTreatment, direction, baselineRisk, unit, thresholdSmall, thresholdModerate, thresholdLarge } = row;
  return { name, kind, measure, model, referenceTreatment, direction, baselineRisk, unit, thresholdSmall, thresholdModerate, thresholdLarge };
}

export async function findOutcome(db: Database, id: string): Promise<OutcomeRow | null> {
  return (await db.query.outcomes.findFirst({ where: eq(outcomes.id, id) })) ?? null;
}
