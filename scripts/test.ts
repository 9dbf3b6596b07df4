// npm test: type check and lint, then a throw-away PostgreSQL cluster, a production build, and the
// test suites (unit, integration against the real database, browser in Debian's Chromium). The
// cluster is removed afterwards, also when a step fails. Extra arguments go to vitest; `npm run
// test:faults` passes `--project faults` (kills, outages, the fuzz: they run alone, after npm test in
// .ci/run, docs/decisions/0036).
import { spawnSync } from "node:child_process";
import { chmodSync, existsSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { ensureCluster, freePort, type Cluster } from "./lib/postgres";
import { build, log, migrateAndSeed, runBin } from "./lib/steps";

const chromiumPath = "/usr/bin/chromium";

function ensureChromium(): void {
  if (existsSync(chromiumPath)) return;
  log("Chromium is not installed: installing Debian's chromium package (apt-get, non-interactive)…");
  const asRoot = process.getuid?.() === 0 ? [] : ["sudo"];
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  for (const args of [["update", "-qq"], ["install", "-y", "-qq", "chromium"]]) {
    const [file, ...rest] = [...asRoot, "apt-get", ...args];
    const result = spawnSync(file!, rest, { stdio: "inherit", env });
    if (result.status !== 0) throw new Error(`apt-get ${args.join(" ")} failed`);
  }
}

const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-test-"));
// The `postgres` user (when running as root) must be able to reach its data folder inside.
chmodSync(folder, 0o755);
let cluster: Cluster | null = null;

function cleanUp(): void {
  cluster?.stop();
  cluster = null;
  rmSync(folder, { recursive: true, force: true });
}
process.on("SIGINT", () => {
  cleanUp();
  process.exit(130);
});

let exitCode = 0;
try {
  log("Type check (tsc)");
  runBin("tsc", ["--noEmit"]);
  log("Lint (eslint)");
  runBin("eslint", [".", "--max-warnings", "0"]);
  ensureChromium();
  cluster = await ensureCluster({ dataDir: path.join(folder, "postgres"), port: await freePort(), log });
  await migrateAndSeed(cluster.url, true);
  build();
  log("Running the tests (vitest)");
  const args = process.argv.slice(2);
  const projects = args.includes("--project") ? [] : ["--project", "unit", "--project", "integration", "--project", "browser"];
  runBin("vitest", ["run", ...projects, ...args], {
    ...process.env,
    TEST_DATABASE_URL: cluster.url,
    CHROMIUM_PATH: chromiumPath,
  });
} catch (error) {
  console.error(error instanceof Error ? error.message : error);
  exitCode = 1;
} finally {
  cleanUp();
}
process.exit(exitCode);
