// E-mails and their delivery state: written when a change asks for a message, updated by the queue.
import { desc, eq, sql } from "drizzle-orm";
import type { Database } from "./client";
import { messages } from "./schema";
import type { Message } from "#core/languages/mail";

type Executor = Pick<Database, "insert" | "update" | "select">;

export async function insertMessage(tx: Executor, message: Message): Promise<string> {
  const [row] = await tx.insert(messages).values({ ...message, headers: message.headers ?? {} }).returning({ id: messages.id });
  return row!.id;
}

export async function findMessage(db: Executor, id: string) {
  const [row] = await db.select().from(messages).where(eq(messages.id, id));
  return row ?? null;
}

export async function markSent(db: Executor, id: string): Promise<void> {
  await db.update(messages).set({ state: "sent", sentAt: sql`now()`, attempts: sql`${messages.attempts} + 1`, lastError: null }).where(eq(messages.id, id));
}

/** One failed attempt; `final` when the queue will not try again. */
export async function markAttemptFailed(db: Executor, id: string, error: string, final: boolean): Promise<void> {
  await db
    .update(messages)
    .set({ attempts: sql`${messages.attempts} + 1`, lastError: error.slice(0, 500), ...(final ? { state: "failed" as const } : {}) })
    .where(eq(messages.id, id));
}

/** The newest messages, for administrators: the state of each, never the body (it may hold a one-time link). */
export async function listMessages(db: Executor, limit = 100) {
  return db
    .select({ id: messages.id, kind: messages.kind, recipient: messages.recipient, subject: messages.subject, state: messages.state, attempts: messages.attempts, lastError: messages.lastError, createdAt: messages.createdAt, sentAt: messages.sentAt })
    .from(messages)
    .orderBy(desc(messages.createdAt))
    .limit(limit);
}

/**
 * Messages still queued that no job of the queue will deliver: stored by a process without a queue.
 * (The queue's jobs live in pg-boss's own table, `pgboss.job`; a job still to run is created, retry or active.)
 */
export async function unqueuedMessageIds(db: Pick<Database, "execute">, job: string): Promise<string[]> {
  const rows = await db.execute<{ id: string }>(sql`
    select m.id from messages m
    where m.state = 'queued'
      and not exists (select 1 from pgboss.job j where j.name = ${job} and j.data->>'messageId' = m.id::text and j.state in ('created', 'retry', 'active'))`);
  return rows.rows.map((row) => row.id);
}
