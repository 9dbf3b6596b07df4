// Faults: the database restarted under load, pages asked for while it is down, and a backup restored
// into a fresh cluster. They use a cluster of their own, so that stopping it and comparing its tables
// meet no other test. (The server killed during a publish: publish-kill.test.ts.)
import { execSync, spawn } from "node:child_process";
import { chmodSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { backupDatabase, restoreDatabase } from "../../scripts/lib/backup";
import { ensureCluster, freePort, type Cluster } from "../../scripts/lib/postgres";
import { startProductionServer as startServer } from "../../scripts/lib/production-server";
import { migrateAndSeed, projectRoot } from "../../scripts/lib/steps";
import { demoClient } from "../support/client";
import { startTestApp, testSessionSecret, type TestApp } from "../support/app";

const quiet = () => {};
const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-faults-"));
chmodSync(folder, 0o755);
let cluster: Cluster;
let port: number;

beforeAll(async () => {
  port = await freePort();
  cluster = await ensureCluster({ dataDir: path.join(folder, "main"), port, log: quiet });
  await migrateAndSeed(cluster.url, true);
}, 120_000);
afterAll(() => {
  cluster?.stop();
  rmSync(folder, { recursive: true, force: true });
});

describe("the database restarted while requests arrive", () => {
  let app: TestApp;
  afterAll(async () => {
    await app?.close();
  });

  it("answers 503 while it is down, and serves again once it is back, the session kept", async () => {
    app = await startTestApp(cluster.url);
    const analyst = await demoClient(app.url, "analyst");
    expect((await analyst.request("GET", "/api/briefs")).status).toBe(200);

    // Requests keep arriving while the database stops, from four clients at once, across the API
    // and the public files: each is answered, 200 (or 404 for a search nobody can match) or 503, never 500.
    const small = slugify(demoBriefs()[0]!.title);
    const addresses = ["/api/briefs", "/api/session", "/api/topics", "/api/health", `/api/briefs/${small}/versions/1`, `/briefs/${small}/v/1/cite.ris`, `/briefs/${small}/v/1/downloads/results.csv`, "/feed.xml", "/sitemap.xml"];
    const statuses = new Map<number, number>();
    let running = true;
    const load = Promise.all(
      [0, 1, 2, 3].map(async (offset) => {
        for (let i = offset; running; i++) {
          // 0: the connection closed with no answer at all (once, a rolling session's failed touch).
          const status = (await analyst.request("GET", addresses[i % addresses.length]!).catch(() => ({ status: 0 }))).status;
          statuses.set(status, (statuses.get(status) ?? 0) + 1);
        }
      }),
    );
    await new Promise((resolve) => setTimeout(resolve, 500));
    cluster.stop();
    const down = await analyst.request("GET", "/api/briefs");
    expect(down.status).toBe(503);
    expect(down.body.error?.key).toBe("errors.unavailable");
    expect((await fetch(`${app.url}/api/health`)).status).toBe(503);
    await new Promise((resolve) => setTimeout(resolve, 1000));

    cluster = await ensureCluster({ dataDir: path.join(folder, "main"), port, log: quiet });
    // The pool drops its broken connections and opens new ones: within a few tries all is well.
    let back = 0;
    for (let attempt = 0; attempt < 50 && back !== 200; attempt += 1) {
      back = (await analyst.request("GET", "/api/briefs")).status;
      if (back !== 200) await new Promise((resolve) => setTimeout(resolve, 100));
    }
    await new Promise((resolve) => setTimeout(resolve, 500));
    running = false;
    await load;
    expect(back).toBe(200);
    const seen = Object.fromEntries([...statuses].sort(([a], [b]) => a - b));
    expect(Object.keys(seen).filter((status) => status !== "200" && status !== "503"), JSON.stringify(seen)).toEqual([]);
    expect(seen[503]).toBeGreaterThan(0);
    expect(seen[200]).toBeGreaterThan(0);
    expect((await fetch(`${app.url}/api/health`)).status).toBe(200);
    console.log(`PostgreSQL restarted under load: ${[...statuses.values()].reduce((a, b) => a + b, 0)} requests, statuses ${JSON.stringify(seen)}, no restart of the app`);
  }, 60_000);
});

describe("pages while the database is down (hostile probe round 3, F8)", () => {
  it("answers 503, never 500, for pages not yet in memory: a search, a topic, a version and a comparison", async () => {
    const server = await startServer({ databaseUrl: cluster.url, sessionSecret: testSessionSecret });
    try {
      const small = slugify(demoBriefs()[0]!.title);
      expect((await fetch(`${server.url}/briefs/${small}/v/1`)).status).toBe(200);
      cluster.stop();
      for (const path of ["/briefs?q=never-searched-before", "/topics/sleep", `/es/briefs/${small}/v/1`, `/fr/briefs/${small}/v/1/compare/light/usual_care`]) {
        const answer = await fetch(`${server.url}${path}`);
        expect(answer.status, path).toBe(503);
      }
    } finally {
      cluster = await ensureCluster({ dataDir: path.join(folder, "main"), port, log: quiet });
      await server.stop();
    }
  }, 60_000);
});

describe("a server whose supervisor vanished", () => {
  it("ends, workers and all, once its output is gone, instead of spinning on failed writes", async () => {
    const server = spawn(process.execPath, ["--import", "tsx", "server/index.ts"], {
      cwd: projectRoot,
      env: { ...process.env, NODE_ENV: "production", DATABASE_URL: cluster.url, SESSION_SECRET: testSessionSecret, PORT: String(await freePort()), WORKERS: "2", LOG_LEVEL: "info" },
      stdio: ["ignore", "pipe", "pipe"],
    });
    const exited = new Promise<number | null>((resolve) => server.once("exit", (code) => resolve(code)));
    let output = "";
    server.stdout!.on("data", (chunk: Buffer) => (output += chunk.toString()));
    for (let i = 0; i < 300 && !output.includes("Fairweigh is serving"); i++) await new Promise((resolve) => setTimeout(resolve, 100));
    // The primary's children that are server processes (tsx may have started a helper of its own).
    const workers = execSync(`ps -o pid=,args= --ppid ${server.pid}`)
      .toString()
      .split("\n")
      .filter((line) => line.includes("server/index.ts"))
      .map((line) => Number(line.trim().split(/\s+/)[0]));
    expect(workers).toHaveLength(2);
    // The supervisor is killed outright: nobody reads the output any more. Readers keep coming, and
    // each request's log line meets the closed pipe once the log's buffer is written.
    server.stdout!.destroy();
    server.stderr!.destroy();
    const url = output.match(/http:\/\/[\d.:]+/)![0];
    let running = true;
    const readers = (async () => {
      while (running) await fetch(`${url}/api/health`).catch(() => null);
    })();
    try {
      const code = await Promise.race([exited, new Promise<"running">((resolve) => setTimeout(() => resolve("running"), 30_000))]);
      running = false;
      await readers;
      expect(code, "the primary still runs 30 s later").not.toBe("running");
      await new Promise((resolve) => setTimeout(resolve, 1000));
      const alive = workers.filter((pid) => {
        try {
          process.kill(pid, 0);
          return true;
        } catch {
          return false;
        }
      });
      expect(alive, "workers left running").toEqual([]);
    } finally {
      running = false;
      if (server.exitCode === null) server.kill("SIGKILL");
    }
  }, 90_000);
});

describe("backup and restore (npm run backup, npm run restore)", () => {
  it("a backup restored into a fresh cluster holds every table, row for row", async () => {
    const file = path.join(folder, "fairweigh.dump");
    backupDatabase(cluster.url, file, quiet);
    const fresh = await ensureCluster({ dataDir: path.join(folder, "restored"), port: await freePort(), log: quiet });
    try {
      restoreDatabase(fresh.url, file, quiet);
      const [before, after] = await Promise.all([tableDigests(cluster.url), tableDigests(fresh.url)]);
      expect(Object.keys(before).length).toBeGreaterThan(10);
      expect(before.briefs!.rows).toBeGreaterThan(0);
      expect(after).toEqual(before);
    } finally {
      fresh.stop();
    }
  }, 90_000);
});

/** Every table of the public schema (the migrations' journal included): its row count and an md5 of its rows in order. */
async function tableDigests(url: string): Promise<Record<string, { rows: number; md5: string }>> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  try {
    const tables = await client.query<{ schema: string; name: string }>(
      "select table_schema as schema, table_name as name from information_schema.tables where table_schema in ('public', 'drizzle') and table_type = 'BASE TABLE' order by 1, 2",
    );
    const digests: Record<string, { rows: number; md5: string }> = {};
    for (const { schema, name } of tables.rows) {
      const table = `"${schema}"."${name}"`;
      const { rows } = await client.query<{ rows: string; md5: string | null }>(`select count(*) as rows, md5(string_agg(t::text, '|' order by t::text)) as md5 from ${table} t`);
      digests[schema === "public" ? name : `${schema}.${name}`] = { rows: Number(rows[0]!.rows), md5: rows[0]!.md5 ?? "" };
    }
    return digests;
  } finally {
    await client.end();
  }
}
