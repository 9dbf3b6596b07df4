// npm run bench:http: the production build on loopback, against a throw-away cluster with the demo
// seed, measured with autocannon: a cached brief page, a comparison page and a static asset side by
// side (50 connections, 10 s each, after a warm-up, asking for compressed answers as browsers do). Prints requests per second and p50/p99 latency,
// and how they compare with the targets; asserts nothing, so a slow machine reports rather than fails.
// autocannon runs on the same machine and takes a core of its own: on two cores its share shows in
// every latency, the static asset's included.
import { chmodSync, mkdtempSync, readdirSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import autocannon from "autocannon";
import { slugify } from "#core/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { ensureCluster, freePort, type Cluster } from "./lib/postgres";
import { startProductionServer, type RunningServer } from "./lib/production-server";
import { build, log, migrateAndSeed, projectRoot } from "./lib/steps";

const connections = 50;
const duration = 10;

const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-bench-"));
chmodSync(folder, 0o755);
let cluster: Cluster | null = null;
let server: RunningServer | null = null;

// As a browser asks: compressed if the server can.
const headers = { "accept-encoding": "br, gzip" };

async function measure(url: string) {
  const result = await autocannon({ url, connections, duration, headers });
  if (result.non2xx > 0 || result.errors > 0) throw new Error(`${url}: ${result.non2xx} non-2xx answers and ${result.errors} errors`);
  return { rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99 };
}

try {
  cluster = await ensureCluster({ dataDir: path.join(folder, "postgres"), port: await freePort(), log });
  await migrateAndSeed(cluster.url, true);
  build();
  server = await startProductionServer({ databaseUrl: cluster.url, sessionSecret: "a-session-secret-used-only-by-the-benchmark-0123" });
  const slug = slugify(demoBriefs()[0]!.title);
  const css = readdirSync(path.join(projectRoot, "dist/client/assets/static")).find((f) => f.endsWith(".css"))!;
  const targets = {
    "brief page (released version, cached)": `${server.url}/briefs/${slug}/v/1`,
    "comparison page (cached)": `${server.url}/briefs/${slug}/v/1/compare/combined/usual_care`,
    "static asset (CSS)": `${server.url}/assets/static/${css}`,
  };
  log(`autocannon: ${connections} connections, ${duration} s per address`);
  // Warm-up of every address first (the page cache, the JIT, the pool), so that order does not matter.
  for (const url of Object.values(targets)) await autocannon({ url, connections, duration: 5, headers });
  const rows: { name: string; rps: number; p50: number; p99: number }[] = [];
  for (const [name, url] of Object.entries(targets)) rows.push({ name, ...(await measure(url)) });

  console.log(`\n| address | requests/s | p50 ms | p99 ms |\n|---|---:|---:|---:|`);
  for (const row of rows) console.log(`| ${row.name} | ${row.rps.toFixed(0)} | ${row.p50} | ${row.p99} |`);
  const [brief, , asset] = rows as [(typeof rows)[0], (typeof rows)[0], (typeof rows)[0]];
  const share = brief.rps / asset.rps;
  console.log(`\nBrief page at ${(share * 100).toFixed(0)}% of the static asset's rate (target ≥ 50%): ${share >= 0.5 ? "met" : "NOT met"}.`);
  console.log(`Brief page p99 ${brief.p99} ms at ${connections} connections (target < 50 ms): ${brief.p99 < 50 ? "met" : "NOT met"}.`);
} finally {
  await server?.stop();
  cluster?.stop();
  rmSync(folder, { recursive: true, force: true });
}
