// npm run backup -- <file>      the database into a file (pg_dump, custom format)
// npm run restore -- <file>     a backup into the database, replacing its content
// The database is DATABASE_URL when set, else npm start's own cluster under .data/ (started if need be).
// docs/operations.md: when to back up, where to keep the files, how to check a restore.
import path from "node:path";
import { backupDatabase, restoreDatabase } from "./lib/backup";
import { ensureCluster } from "./lib/postgres";
import { log, projectRoot } from "./lib/steps";

const [command, file] = process.argv.slice(2);
if ((command !== "backup" && command !== "restore") || !file) {
  console.error("Usage: npm run backup -- <file>  |  npm run restore -- <file>");
  process.exit(2);
}

const databaseUrl =
  process.env.DATABASE_URL ??
  (await ensureCluster({ dataDir: path.join(projectRoot, ".data", "postgres"), port: Number(process.env.PGPORT ?? 54329), log })).url;
const target = path.resolve(file);
if (command === "backup") {
  backupDatabase(databaseUrl, target, log);
  log(`Backed up to ${target}`);
} else {
  restoreDatabase(databaseUrl, target, log);
  log(`Restored from ${target}`);
}
