// Readers' topic subscriptions (double opt-in, one-click unsubscribe).
import { and, eq, gt, isNotNull, isNull, sql } from "drizzle-orm";
import type { Database, Executor } from "./client";
import { subscriptions } from "./schema";
import { hashToken, newToken } from "#core/access/tokens";

/** How long a confirmation link works (common practice). */
const confirmLifetimeMs = 7 * 24 * 3600 * 1000;

/**
 * Starts or restarts a subscription: a new confirmation token unless it is already confirmed and
 * active, in which case nothing changes and null comes back (and no e-mail goes out).
 */
export async function requestSubscription(db: Database, email: string, topicSlug: string, locale: string) {
  const { token, tokenHash } = newToken();
  const confirmBy = new Date(Date.now() + confirmLifetimeMs);
  const [row] = await db
    .insert(subscriptions)
    .values({ email, topicSlug, locale, confirmTokenHash: tokenHash, confirmBy, unsubscribeToken: newToken().token })
    .onConflictDoUpdate({
      target: [subscriptions.email, subscriptions.topicSlug],
      set: { confirmTokenHash: tokenHash, confirmBy, locale },
      // An active subscription stays as it is.
      setWhere: sql`${subscriptions.confirmedAt} is null or ${subscriptions.unsubscribedAt} is not null`,
    })
    .returning({ id: subscriptions.id });
  return row ? { token, confirmBy } : null;
}

/** Confirms by the link's token, once and before it expires: the topic, or null. */
export async function confirmSubscription(db: Database, token: string): Promise<string | null> {
  const [row] = await db
    .update(subscriptions)
    .set({ confirmedAt: sql`now()`, unsubscribedAt: null, confirmTokenHash: null, confirmBy: null })
    .where(and(eq(subscriptions.confirmTokenHash, hashToken(token)), gt(subscriptions.confirmBy, sql`now()`)))
    .returning({ topicSlug: subscriptions.topicSlug });
  return row?.topicSlug ?? null;
}

/** Ends a subscription by its unsubscribe token; true when one was active. */
export async function unsubscribe(db: Database, token: string): Promise<boolean> {
  const rows = await db
    .update(subscriptions)
    .set({ unsubscribedAt: sql`now()` })
    .where(and(eq(subscriptions.unsubscribeToken, token), isNull(subscriptions.unsubscribedAt)))
    .returning({ id: subscriptions.id });
  return rows.length > 0;
}

/** The confirmed, active subscribers of a topic. */
export async function subscribersOf(db: Executor, topicSlug: string) {
  return db
    .select({ email: subscriptions.email, locale: subscriptions.locale, unsubscribeToken: subscriptions.unsubscribeToken })
    .from(subscriptions)
    .where(and(eq(subscriptions.topicSlug, topicSlug), isNotNull(subscriptions.confirmedAt), isNull(subscriptions.unsubscribedAt)));
}
