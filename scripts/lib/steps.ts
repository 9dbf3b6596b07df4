// Steps that `npm start` and `npm test` share.
import { spawnSync } from "node:child_process";
import { randomBytes } from "node:crypto";
import { existsSync, readFileSync, writeFileSync } from "node:fs";
import path from "node:path";
import { fileURLToPath } from "node:url";
import { connectDatabase } from "#db/client";
import { migrateDatabase } from "#db/migrate";
import { seedDemo } from "#workflows/seed";

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

export function log(line: string): void {
  console.log(`» ${line}`);
}

/** Runs a command from node_modules/.bin in the project folder; throws when it fails. */
export function runBin(name: string, args: string[], env: NodeJS.ProcessEnv = process.env): void {
  const result = spawnSync(path.join(projectRoot, "node_modules", ".bin", name), args, {
    cwd: projectRoot,
    stdio: "inherit",
    env,
  });
  if (result.status !== 0) throw new Error(`${name} ${args.join(" ")} failed (exit code ${result.status})`);
}

export async function migrateAndSeed(databaseUrl: string, seed: boolean): Promise<void> {
  const connection = connectDatabase(databaseUrl);
  try {
    log("Applying database migrations");
    await migrateDatabase(connection);
    if (seed) {
      log("Seeding the demo content (skipped where it exists)");
      await seedDemo(connection.db);
    }
  } finally {
    await connection.close();
  }
}

/** A secret kept in a file beside the local cluster, so sessions survive a restart. */
export function localSecret(file: string): string {
  if (!existsSync(file)) writeFileSync(file, randomBytes(32).toString("base64url"), { mode: 0o600 });
  return readFileSync(file, "utf8").trim();
}

export function build(): void {
  log("Building the site (vite build)");
  runBin("vite", ["build", "--logLevel", "warn"], { ...process.env, NODE_ENV: "production" });
  log("Building the command line (dist/cli/nma.cjs)");
  const cli = spawnSync(process.execPath, [path.join(projectRoot, "scripts/lib/cli-bundle.mjs")], { cwd: projectRoot, stdio: "inherit" });
  if (cli.status !== 0) throw new Error(`building the command line failed (exit code ${cli.status})`);
}
