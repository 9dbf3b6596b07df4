import path from "node:path";
import { fileURLToPath } from "node:url";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import { versionChanges } from "#core/snapshot/changes";
import type { DatabaseConnection } from "./client";
import { fillMissingChanges } from "./versions";

export const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../../drizzle");

/** The key of the session-level advisory lock that migrations run under (any number of ours). */
const migrationLock = 20_260_015;

/**
 * Applies the committed SQL migrations in drizzle/ (or another folder, for a test of one migration)
 * that the database has not seen yet. Machines that start at once take turns under an advisory lock:
 * one migrates, the others wait and then find nothing left to do.
 */
export async function migrateDatabase({ pool, db }: DatabaseConnection, folder = migrationsFolder): Promise<void> {
  const client = await pool.connect();
  try {
    await client.query("select pg_advisory_lock($1)", [migrationLock]);
    await migrate(db, { migrationsFolder: folder });
    // A data migration the SQL cannot do: what changed in versions frozen before it was computed.
    if (folder === migrationsFolder) await fillMissingChanges(db, versionChanges);
  } finally {
    await client.query("select pg_advisory_unlock($1)", [migrationLock]).catch(() => {});
    client.release();
  }
}
