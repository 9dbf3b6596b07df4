// The rate limits' counters in PostgreSQL (table rate_limits), so that every server process on the
// database counts the same attempts: express-rate-limit's Store interface, one row per key and window.
import { and, eq, lt, sql } from "drizzle-orm";
import type { IncrementResponse, Options, Store } from "express-rate-limit";
import type { Database } from "./client";
import { rateLimits } from "./schema";

export class PostgresRateLimitStore implements Store {
  /** Keys counted here are seen by every process. */
  localKeys = false;
  private windowMs = 60_000;

  /** `prefix` keeps one limiter's keys apart from another's. */
  constructor(
    private readonly db: Database,
    readonly prefix: string,
  ) {}

  init(options: Options): void {
    this.windowMs = options.windowMs;
  }

  /** One statement: a window that has ended starts again at 1. */
  async increment(key: string): Promise<IncrementResponse> {
    const window = sql`now() + ${`${this.windowMs} milliseconds`}::interval`;
    const [row] = await this.db
      .insert(rateLimits)
      .values({ key: this.prefix + key, hits: 1, resetAt: sql`${window}` })
      .onConflictDoUpdate({
        target: rateLimits.key,
        set: {
          hits: sql`case when ${rateLimits.resetAt} <= now() then 1 else ${rateLimits.hits} + 1 end`,
          resetAt: sql`case when ${rateLimits.resetAt} <= now() then ${window} else ${rateLimits.resetAt} end`,
        },
      })
      .returning({ hits: rateLimits.hits, resetAt: rateLimits.resetAt });
    // Now and then, the windows that ended long ago go (about one increment in a hundred).
    if (Math.random() < 0.01) await this.db.delete(rateLimits).where(lt(rateLimits.resetAt, sql`now() - interval '1 hour'`));
    return { totalHits: row!.hits, resetTime: row!.resetAt };
  }

  async decrement(key: string): Promise<void> {
    await this.db
      .update(rateLimits)
      .set({ hits: sql`greatest(${rateLimits.hits} - 1, 0)` })
      .where(and(eq(rateLimits.key, this.prefix + key), sql`${rateLimits.resetAt} > now()`));
  }

  async resetKey(key: string): Promise<void> {
    await this.db.delete(rateLimits).where(eq(rateLimits.key, this.prefix + key));
  }
}
