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
