// Outcomes of a brief: what was measured, how it is analysed and what counts as a small, moderate or large effect.
import { eq, sql } from "drizzle-orm";
import { z } from "zod";
import { recordAudit } from "../audit";
import type { Database } from "../db/client";
import { outcomes } from "../db/schema";

export type OutcomeRow = typeof outcomes.$inferSelect;

export const outcomeInput = z
  .object({
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
  })
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

export async function findOutcome(db: Database, id: string): Promise<OutcomeRow | null> {
  return (await db.query.outcomes.findFirst({ where: eq(outcomes.id, id) })) ?? null;
}
