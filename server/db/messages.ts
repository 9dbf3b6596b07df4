// E-mails and their delivery state: written when a change asks for a message, updated by the queue.
import { desc, eq, sql } from "drizzle-orm";
import type { Database } from "./client";
import { messages } from "./schema";
import type { Message } from "#core/mail";

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

/** Messages still queued, for the sweep at start-up (a crash between the change and the queue). */
export async function queuedMessageIds(db: Executor): Promise<string[]> {
  const rows = await db.select({ id: messages.id }).from(messages).where(eq(messages.state, "queued"));
  return rows.map((row) => row.id);
}
