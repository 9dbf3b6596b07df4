import { sql } from "drizzle-orm";
import { drizzle, type NodePgDatabase } from "drizzle-orm/node-postgres";
import pg from "pg";
import * as schema from "./schema";

export type Database = NodePgDatabase<typeof schema>;

export interface DatabaseConnection {
  pool: pg.Pool;
  db: Database;
  close(): Promise<void>;
}

export function connectDatabase(url: string): DatabaseConnection {
  const pool = new pg.Pool({ connectionString: url, max: 10 });
  // An idle client that loses its connection must not crash the server; the next query reconnects.
  pool.on("error", () => {});
  const db = drizzle(pool, { schema });
  return { pool, db, close: () => pool.end() };
}

/** The database or a transaction on it: code that reads and writes works inside either. */
export type Executor = Database | Parameters<Parameters<Database["transaction"]>[0]>[0];

/**
 * Makes the rest of the transaction wait for any other transaction holding the lock of this name (a
 * PostgreSQL advisory lock, released with the transaction): changes that read then write take turns.
 */
export async function transactionLock(tx: Executor, name: string): Promise<void> {
  await tx.execute(sql`select pg_advisory_xact_lock(hashtext(${name}))`);
}

/**
 * Runs a statement written with `$1`, `$2`… placeholders (another library's, such as the queue's)
 * on the database or inside a transaction: each placeholder becomes a bound value again.
 */
export function positionalSql(db: Executor) {
  return async (text: string, values: unknown[]): Promise<{ rows: Record<string, unknown>[] }> => {
    const parts = text.split(/\$(\d+)/);
    const chunks = parts.map((part, i) => (i % 2 === 0 ? sql.raw(part) : sql.param(values[Number(part) - 1] ?? null)));
    const result = await db.execute(sql.join(chunks, sql.raw("")));
    return { rows: result.rows };
  };
}
