// Backup and restore with PostgreSQL's own tools: pg_dump's custom format (compressed, restorable
// table by table) and pg_restore. docs/operations.md says when and how to use them.
import { execFileSync } from "node:child_process";
import path from "node:path";
import { postgresBinaries } from "./postgres";

const binary = (name: string, log: (line: string) => void) => path.join(postgresBinaries(log), name);

/** The whole database at `databaseUrl` into `file` (pg_dump --format=custom). */
export function backupDatabase(databaseUrl: string, file: string, log: (line: string) => void): void {
  execFileSync(binary("pg_dump", log), ["--format=custom", "--no-owner", "--no-privileges", "--file", file, "--dbname", databaseUrl], { stdio: ["ignore", "inherit", "inherit"] });
}

/**
 * `file` into the database at `databaseUrl`, replacing what is there (objects of the backup are
 * dropped first), in one transaction: a restore that fails leaves the database as it was.
 */
export function restoreDatabase(databaseUrl: string, file: string, log: (line: string) => void): void {
  execFileSync(binary("pg_restore", log), ["--clean", "--if-exists", "--no-owner", "--no-privileges", "--single-transaction", "--exit-on-error", "--dbname", databaseUrl, file], { stdio: ["ignore", "inherit", "inherit"] });
}
