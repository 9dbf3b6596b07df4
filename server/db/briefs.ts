// Briefs in the database: created by analysts, changed only with the row version the writer read.
import { and, asc, desc, eq, inArray, like } from "drizzle-orm";
import { recordAudit } from "./audit";
import { transactionLock, type Database, type Executor } from "./client";
import { briefs, briefVersions, outcomes, treatmentNames } from "./schema";
import { slugify } from "#core/publication/slug";
import { analysisStatus, latestTreatments } from "./analyses";

export type BriefRow = typeof briefs.$inferSelect;

export interface BriefFields {
  title: string;
  topic: string;
  condition: string;
  population: string;
  authorTeam?: string | null;
}

/** What the editor writes: Markdown, rendered and sanitised wherever it is shown. */
export interface EditorialFields {
  laySummary: string;
  shortTake: string;
}

export async function createBrief(db: Database, fields: BriefFields & { demo?: boolean }, actorId: string): Promise<BriefRow> {
  return db.transaction(async (tx) => {
    const base = slugify(fields.title);
    // Briefs of the same title created at once take their addresses one after another (a lock on the
    // base address for this transaction), so each finds the others' and none collides.
    await transactionLock(tx, `brief-slug:${base}`);
    const taken = new Set((await tx.select({ slug: briefs.slug }).from(briefs).where(like(briefs.slug, `${base}%`))).map((r) => r.slug));
    let slug = base;
    for (let n = 2; taken.has(slug); n++) slug = `${base}-${n}`;
    const [row] = await tx.insert(briefs).values({ ...fields, slug, createdBy: actorId }).returning();
    await recordAudit(tx, { actorId, action: "create", entity: "brief", entityId: row!.id, before: null, after: row });
    return row!;
  });
}

export async function findBrief(db: Database, id: string): Promise<BriefRow | null> {
  const row = await db.query.briefs.findFirst({ where: eq(briefs.id, id) });
  return row ? (await withReleasedStatus(db, [row]))[0]! : null;
}

export async function listBriefs(db: Database): Promise<BriefRow[]> {
  return withReleasedStatus(db, await db.select().from(briefs).orderBy(asc(briefs.createdAt)));
}

/**
 * A scheduled brief is published once its release time has passed; nothing runs at that moment,
 * so the status is read from the latest version's time rather than stored again.
 */
async function withReleasedStatus(db: Database, rows: BriefRow[]): Promise<BriefRow[]> {
  const scheduled = rows.filter((row) => row.status === "scheduled").map((row) => row.id);
  if (scheduled.length === 0) return rows;
  const latest = await db
    .selectDistinctOn([briefVersions.briefId], { briefId: briefVersions.briefId, number: briefVersions.number, releaseAt: briefVersions.releaseAt })
    .from(briefVersions)
    .where(inArray(briefVersions.briefId, scheduled))
    .orderBy(briefVersions.briefId, desc(briefVersions.number));
  const released = new Map(latest.filter((v) => v.releaseAt.getTime() <= Date.now()).map((v) => [v.briefId, v.number]));
  return rows.map((row) => (released.has(row.id) ? { ...row, status: released.get(row.id)! > 1 ? "corrected" : "published" } : row));
}

/**
 * The brief with its outcomes, whether each outcome's stored result is current, and the name shown
 * for every treatment label found in the outcomes' data (the label itself until one is given).
 */
export async function briefWithOutcomes(db: Database, id: string) {
  const brief = await findBrief(db, id);
  if (!brief) return null;
  const rows = await db.select().from(outcomes).where(eq(outcomes.briefId, id)).orderBy(asc(outcomes.position));
  const withStatus = await Promise.all(rows.map(async (outcome) => ({ ...outcome, analysis: await analysisStatus(db, outcome) })));
  const labels = new Set<string>();
  for (const outcome of rows) for (const label of await latestTreatments(db, outcome.id)) labels.add(label);
  const named = new Map((await db.select().from(treatmentNames).where(eq(treatmentNames.briefId, id))).map((r) => [r.label, r]));
  const treatments = [...labels].sort().map((label) => {
    const row = named.get(label);
    return { label, displayName: row?.displayName ?? label, named: row !== undefined, phrase: row?.phrase ?? null, number: row?.number ?? ("singular" as const) };
  });
  const [latest] = await db.select({ number: briefVersions.number, releaseAt: briefVersions.releaseAt }).from(briefVersions).where(eq(briefVersions.briefId, id)).orderBy(desc(briefVersions.number)).limit(1);
  // The newest version's release time while it is still embargoed: the desk shows it and may move it.
  const embargoedUntil = latest && latest.releaseAt.getTime() > Date.now() ? latest.releaseAt : null;
  return { ...brief, outcomes: withStatus, treatments, latestVersion: latest?.number ?? 0, embargoedUntil };
}

/** How a sentence names a treatment and its number (server/core/languages/grammar.ts); left out, they stay as they were. */
export type TreatmentGrammarInput = Record<string, { phrase?: string | null; number?: "singular" | "plural" }>;

/** Sets the names readers see for treatment labels of the data; an empty name falls back to the label. */
export async function nameTreatments(db: Database, briefId: string, names: Record<string, string>, actorId: string, grammar: TreatmentGrammarInput = {}): Promise<void> {
  await db.transaction(async (tx) => {
    const before = await tx.select().from(treatmentNames).where(eq(treatmentNames.briefId, briefId));
    for (const [label, displayName] of Object.entries(names)) {
      const given = grammar[label] ?? {};
      const set = { displayName, ...(given.phrase !== undefined ? { phrase: given.phrase?.trim() || null } : {}), ...(given.number ? { number: given.number } : {}) };
      await tx
        .insert(treatmentNames)
        .values({ briefId, label, ...set })
        .onConflictDoUpdate({ target: [treatmentNames.briefId, treatmentNames.label], set });
    }
    await recordAudit(tx, { actorId, action: "name-treatments", entity: "brief", entityId: briefId, before, after: { names, grammar } });
  });
}

export type UpdateResult = { ok: true; brief: BriefRow } | { ok: false; current: BriefRow | null };

/** Applies the change only if nobody changed the brief since `rowVersion` was read. */
export async function updateBrief(
  db: Database,
  id: string,
  rowVersion: number,
  changes: Partial<BriefFields & EditorialFields>,
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

/** The brief, locked until the transaction ends: review and publishing steps read and change it one at a time. */
export async function lockBrief(tx: Executor, id: string): Promise<BriefRow | null> {
  const [brief] = await tx.select().from(briefs).where(eq(briefs.id, id)).for("update");
  return brief ?? null;
}

/** A change of the brief's state (status, withdrawal) by a workflow step, with the row version and its audit row. */
export async function setBriefState(
  tx: Executor,
  brief: BriefRow,
  changes: Partial<Pick<BriefRow, "status" | "withdrawnAt" | "withdrawalReason">>,
  audit: { actorId: string; action: string; after: Record<string, unknown> },
): Promise<void> {
  await tx.update(briefs).set({ ...changes, rowVersion: brief.rowVersion + 1, updatedAt: new Date() }).where(eq(briefs.id, brief.id));
  await recordAudit(tx, { actorId: audit.actorId, action: audit.action, entity: "brief", entityId: brief.id, before: { status: brief.status }, after: audit.after });
}

/** A brief of the demo by its title, to seed it only once. */
export async function findBriefByTitle(db: Database, title: string): Promise<BriefRow | null> {
  return (await db.query.briefs.findFirst({ where: eq(briefs.title, title) })) ?? null;
}
