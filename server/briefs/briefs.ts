// Briefs in the database: created by analysts, changed only with the row version the writer read.
import { and, asc, eq } from "drizzle-orm";
import { recordAudit } from "../audit";
import type { Database } from "../db/client";
import { briefs, outcomes } from "../db/schema";
import { analysisStatus } from "../analysis/run";

export type BriefRow = typeof briefs.$inferSelect;

export interface BriefFields {
  title: string;
  topic: string;
  condition: string;
  population: string;
}

/** Lower-case words joined by hyphens, from the title; a number is added when the slug is taken. */
export function slugify(title: string): string {
  const slug = title
    .normalize("NFKD")
    .replace(/[\u0300-\u036f]/g, "")
    .toLowerCase()
    .replace(/[^a-z0-9]+/g, "-")
    .replace(/^-+|-+$/g, "")
    .slice(0, 60)
    .replace(/-+$/, "");
  return slug || "brief";
}

export async function createBrief(db: Database, fields: BriefFields, actorId: string): Promise<BriefRow> {
  return db.transaction(async (tx) => {
    const base = slugify(fields.title);
    const taken = new Set((await tx.select({ slug: briefs.slug }).from(briefs)).map((r) => r.slug));
    let slug = base;
    for (let n = 2; taken.has(slug); n++) slug = `${base}-${n}`;
    const [row] = await tx.insert(briefs).values({ ...fields, slug, createdBy: actorId }).returning();
    await recordAudit(tx, { actorId, action: "create", entity: "brief", entityId: row!.id, before: null, after: row });
    return row!;
  });
}

export async function findBrief(db: Database, id: string): Promise<BriefRow | null> {
  return (await db.query.briefs.findFirst({ where: eq(briefs.id, id) })) ?? null;
}

export async function listBriefs(db: Database): Promise<BriefRow[]> {
  return db.select().from(briefs).orderBy(asc(briefs.createdAt));
}

/** The brief with its outcomes and, per outcome, whether its stored result is current. */
export async function briefWithOutcomes(db: Database, id: string) {
  const brief = await findBrief(db, id);
  if (!brief) return null;
  const rows = await db.select().from(outcomes).where(eq(outcomes.briefId, id)).orderBy(asc(outcomes.position));
  const withStatus = await Promise.all(rows.map(async (outcome) => ({ ...outcome, analysis: await analysisStatus(db, outcome) })));
  return { ...brief, outcomes: withStatus };
}

export type UpdateResult = { ok: true; brief: BriefRow } | { ok: false; current: BriefRow | null };

/** Applies the change only if nobody changed the brief since `rowVersion` was read. */
export async function updateBrief(
  db: Database,
  id: string,
  rowVersion: number,
  changes: Partial<BriefFields>,
  actorId: string,
): Promise<UpdateResult> {
  return db.transaction(async (tx) => {
    const before = await tx.query.briefs.findFirst({ where: eq(briefs.id, id) });
    if (!before) return { ok: false, current: null };
    const [row] = await tx
      .update(briefs)
      .set({ ...changes, rowVersion: rowVersion + 1, updatedAt: new Date() })
      .where(and(eq(briefs.id, id), eq(briefs.rowVersion, rowVersion)))
      .returning();
    if (!row) return { ok: false, current: (await tx.query.briefs.findFirst({ where: eq(briefs.id, id) })) ?? null };
    await recordAudit(tx, { actorId, action: "update", entity: "brief", entityId: id, before, after: row });
    return { ok: true, brief: row };
  });
}
