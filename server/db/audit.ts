// The audit log: one row per state change, written in the same transaction as the change.
import { and, desc, eq, lt, or, sql } from "drizzle-orm";
import type { Database } from "./client";
import { auditLog, outcomes, people } from "./schema";

type Executor = Pick<Database, "insert">;

export interface AuditEntry {
  actorId: string | null;
  action: string;
  entity: string;
  entityId: string;
  before: unknown;
  after: unknown;
}

export async function recordAudit(executor: Executor, entry: AuditEntry): Promise<void> {
  await executor.insert(auditLog).values(entry);
}

export interface AuditFilter {
  /** Changes made by this person. */
  actorId?: string;
  action?: string;
  /** Changes to this brief and to its outcomes. */
  briefId?: string;
  /** Keyset paging: entries older than this id. */
  before?: number;
  limit: number;
}

/** The newest entries first, filtered and paged in SQL; `next` is the cursor of the following page. */
/** What an entry is about, as the desk names it: a brief's title, an outcome's name, a person's, a version's brief and number. */
const entityName = sql<string | null>`case ${auditLog.entity}
  when 'brief' then (select b.title from briefs b where b.id::text = ${auditLog.entityId})
  when 'outcome' then (select o.name || ' (' || b.title || ')' from outcomes o join briefs b on b.id = o.brief_id where o.id::text = ${auditLog.entityId})
  when 'person' then (select p.display_name from people p where p.id::text = ${auditLog.entityId})
  when 'session' then (select p.display_name from people p where p.id::text = ${auditLog.entityId})
  when 'version' then (select b.title || ', v' || v.number from brief_versions v join briefs b on b.id = v.brief_id where v.id::text = ${auditLog.entityId})
end`;

export async function listAudit(db: Database, filter: AuditFilter) {
  const conditions = [
    filter.actorId ? eq(auditLog.actorId, filter.actorId) : undefined,
    filter.action ? eq(auditLog.action, filter.action) : undefined,
    filter.briefId
      ? or(
          and(eq(auditLog.entity, "brief"), eq(auditLog.entityId, filter.briefId)),
          and(eq(auditLog.entity, "outcome"), sql`${auditLog.entityId} in (select ${outcomes.id}::text from ${outcomes} where ${outcomes.briefId} = ${filter.briefId})`),
        )
      : undefined,
    filter.before ? lt(auditLog.id, filter.before) : undefined,
  ];
  const rows = await db
    .select({ id: auditLog.id, at: auditLog.at, actorId: auditLog.actorId, actorName: people.displayName, action: auditLog.action, entity: auditLog.entity, entityId: auditLog.entityId, entityName, before: auditLog.before, after: auditLog.after })
    .from(auditLog)
    .leftJoin(people, eq(people.id, auditLog.actorId))
    .where(and(...conditions))
    .orderBy(desc(auditLog.id))
    .limit(filter.limit + 1);
  const entries = rows.slice(0, filter.limit);
  return { entries, next: rows.length > filter.limit ? entries.at(-1)!.id : null };
}

/** The actions the log holds, for the desk's filter. */
export async function auditActions(db: Database): Promise<string[]> {
  const rows = await db.selectDistinct({ action: auditLog.action }).from(auditLog).orderBy(auditLog.action);
  return rows.map((row) => row.action);
}
