import path from "node:path";
import { fileURLToPath } from "node:url";
import { migrate } from "drizzle-orm/node-postgres/migrator";
import type { Database } from "./client";

export const migrationsFolder = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../../drizzle");

/** Applies the committed SQL migrations in drizzle/ (or another folder, for a test of one migration) that the database has not seen yet. */
export async function migrateDatabase(db: Database, folder = migrationsFolder): Promise<void> {
  await migrate(db, { migrationsFolder: folder });
}
