// One-time account links (invitations, password resets), stored as hashes (server/core/access/tokens.ts).
import { and, eq, gt, isNull, sql } from "drizzle-orm";
import type { Database } from "./client";
import { accountTokens } from "./schema";
import { hashToken, newToken, tokenLifetimeMs, type TokenPurpose } from "#core/access/tokens";

type Executor = Pick<Database, "insert" | "update">;

/** A new link for the person; earlier unused links of the same purpose stop working. */
export async function issueToken(tx: Executor, personId: string, purpose: TokenPurpose): Promise<{ token: string; expiresAt: Date }> {
  await tx
    .update(accountTokens)
    .set({ usedAt: sql`now()` })
    .where(and(eq(accountTokens.personId, personId), eq(accountTokens.purpose, purpose), isNull(accountTokens.usedAt)));
  const { token, tokenHash } = newToken();
  const expiresAt = new Date(Date.now() + tokenLifetimeMs[purpose]);
  await tx.insert(accountTokens).values({ personId, purpose, tokenHash, expiresAt });
  return { token, expiresAt };
}

/** Uses the link once: the person and the purpose, or null when it is unknown, used or expired. One statement, so two uses at once cannot both succeed. */
export async function consumeToken(tx: Executor, token: string): Promise<{ personId: string; purpose: TokenPurpose } | null> {
  const [row] = await tx
    .update(accountTokens)
    .set({ usedAt: sql`now()` })
    .where(and(eq(accountTokens.tokenHash, hashToken(token)), isNull(accountTokens.usedAt), gt(accountTokens.expiresAt, sql`now()`)))
    .returning({ personId: accountTokens.personId, purpose: accountTokens.purpose });
  return row ?? null;
}

/** Whether the link still works (known, unused, unexpired), without using it: its page says so before anyone types a password. */
export async function tokenIsUsable(db: Pick<Database, "select">, token: string): Promise<boolean> {
  const [row] = await db
    .select({ id: accountTokens.id })
    .from(accountTokens)
    .where(and(eq(accountTokens.tokenHash, hashToken(token)), isNull(accountTokens.usedAt), gt(accountTokens.expiresAt, sql`now()`)));
  return row !== undefined;
}
