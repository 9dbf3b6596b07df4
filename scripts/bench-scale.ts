// npm run bench:scale: a catalogue of a thousand invented briefs (copies of the large demo brief,
// 22 treatments, under new titles and slugs, three released versions each) in a throw-away cluster,
// and what that does to the production server: p99 of the list and search pages under 50
// connections, a new search one at a time, the time to render a version page that is not in memory
// (read from its stored parts) and one that nobody read before,
// the start-up time, and the page cache's bytes per page against its bound. Prints a table; asserts nothing.
import { chmodSync, mkdtempSync, rmSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import autocannon from "autocannon";
import pg from "pg";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { ensureCluster, freePort, type Cluster } from "./lib/postgres";
import { residentMiB, startProductionServer, type RunningServer } from "./lib/production-server";
import { build, log, migrateAndSeed } from "./lib/steps";

const briefCount = Number(process.env.BRIEFS ?? 1000);
const versionsEach = 3;
const connections = 50;
const duration = 10;

const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-scale-"));
chmodSync(folder, 0o755);
let cluster: Cluster | null = null;
let server: RunningServer | null = null;

/** Words for invented titles and conditions, so that searches match some briefs and not others. */
const words = ["amber", "birch", "cedar", "delta", "ember", "fjord", "garnet", "harbor", "indigo", "juniper"];

/** Copies the large demo brief `count` times with three versions each, in SQL (seconds, not the hours of the desk's way). */
async function catalogue(url: string, count: number): Promise<void> {
  const client = new pg.Client({ connectionString: url });
  await client.connect();
  const source = slugify(demoBriefs()[1]!.title);
  await client.query("begin");
  await client.query(
    `insert into briefs (id, slug, title, topic, condition, population, status, row_version, created_by, created_at, updated_at, demo, lay_summary, short_take, author_team)
     select gen_random_uuid(), 'scale-' || i, 'Invented brief ' || i || ' ' || ($2::text[])[1 + i % 10], 'Scale topic ' || (i % 25), 'Invented condition ' || ($2::text[])[1 + (i / 10) % 10], population,
            status, row_version, created_by, now(), now(), true, lay_summary, short_take, author_team
     from briefs, generate_series(1, $1) as i where slug = $3`,
    [count, words, source],
  );
  await client.query(
    // The copies' versions hold the same findings: what changed between them is nothing (server/core/snapshot/changes.ts).
    `insert into brief_versions (id, brief_id, number, release_at, note, changes, snapshot, created_by, created_at)
     select gen_random_uuid(), b.id, n, now() - interval '1 day' * (4 - n), case when n > 1 then 'An invented correction.' end,
            case when n > 1 then jsonb_build_object('from', n - 1, 'to', n, 'tolerance', 0.1, 'texts', '[]'::jsonb, 'outcomes', '[]'::jsonb) end,
            jsonb_set(jsonb_set(jsonb_set(jsonb_set(jsonb_set(v.snapshot, '{brief,slug}', to_jsonb(b.slug)), '{brief,title}', to_jsonb(b.title)),
              '{brief,condition}', to_jsonb(b.condition)), '{brief,topic}', to_jsonb(b.topic)), '{version}', to_jsonb(n)),
            v.created_by, now()
     from briefs b, brief_versions v join briefs s on s.id = v.brief_id and s.slug = $2, generate_series(1, $1) as n
     where b.slug like 'scale-%' and v.number = 1`,
    [versionsEach, source],
  );
  await client.query("commit");
  await client.end();
}

/** Load on one address; with `fresh`, every request a new search, so that none is answered from memory. */
async function p99(url: string, fresh = false) {
  let n = 0;
  const requests = fresh ? [{ setupRequest: (request: autocannon.Request) => ({ ...request, path: `${new URL(url).pathname}?q=${words[n % 10]}%20${++n}` }) }] : undefined;
  const result = await autocannon({ url, connections, duration, headers: { "accept-encoding": "br, gzip" }, requests });
  return { rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, errors: result.errors + result.timeouts + result.non2xx };
}

try {
  cluster = await ensureCluster({ dataDir: path.join(folder, "postgres"), port: await freePort(), log });
  await migrateAndSeed(cluster.url, true);
  build();
  log(`Adding ${briefCount} invented briefs with ${versionsEach} versions each`);
  const started = performance.now();
  await catalogue(cluster.url, briefCount);
  log(`… in ${((performance.now() - started) / 1000).toFixed(1)} s`);
  const starting = performance.now();
  server = await startProductionServer({ databaseUrl: cluster.url, sessionSecret: "a-session-secret-used-only-by-the-benchmark-0123" });
  const startUp = performance.now() - starting;
  const residentAtStart = residentMiB(server.pid);

  // Version pages (corrections, which also read the version before) answered one after another, twenty
  // at a time: first as nobody has read them yet, rendered whole and their parts stored
  // (stored-brief.ts); then, after a restart, by a process that holds none of them in memory and reads
  // the stored parts: its first twenty answers (its code not yet compiled), then twenty more.
  const versionPages = async (from: number) => {
    const times: number[] = [];
    for (let i = from; i < from + 20; i++) {
      const t0 = performance.now();
      const answer = await fetch(`${server!.url}/briefs/scale-${i}/v/2`);
      if (answer.status !== 200) throw new Error(`scale-${i}: ${answer.status}`);
      await answer.arrayBuffer();
      times.push(performance.now() - t0);
    }
    return times.sort((a, b) => a - b);
  };
  const firstRender = await versionPages(1);
  await versionPages(21);
  await server.stop();
  server = await startProductionServer({ databaseUrl: cluster.url, sessionSecret: "a-session-secret-used-only-by-the-benchmark-0123" });
  const restarted = await versionPages(21);
  const cold = await versionPages(1);
  // Resident memory as more version pages are kept: it should level off once the cache is full.
  const resident = [residentMiB(server.pid)];
  for (let i = 21; i <= 420; i++) {
    await (await fetch(`${server.url}/briefs/scale-${i}/v/1`)).arrayBuffer();
    if ((i - 20) % 100 === 0) resident.push(residentMiB(server.pid));
  }
  const pageBytes = (await (await fetch(`${server.url}/briefs/scale-21/v/1`, { headers: { "accept-encoding": "identity" } })).arrayBuffer()).byteLength;

  // Searches nobody asked before, one at a time: what one reader waits for a search of their own.
  const coldSearch: number[] = [];
  for (let i = 1; i <= 100; i++) {
    const t0 = performance.now();
    await (await fetch(`${server.url}/briefs?q=${words[i % 10]}%20cold${i}`)).arrayBuffer();
    coldSearch.push(performance.now() - t0);
  }
  coldSearch.sort((a, b) => a - b);

  log(`autocannon: ${connections} connections, ${duration} s per address`);
  const loads = {
    "list of every brief (/briefs)": `${server.url}/briefs`,
    "search, many matches (?q=invented)": `${server.url}/briefs?q=invented`,
    "search, few matches (?q=cedar juniper)": `${server.url}/briefs?q=cedar%20juniper`,
    "search in Spanish (/es/briefs?q=sueno)": `${server.url}/es/briefs?q=sueno`,
    "a topic (/topics/scale-topic-7)": `${server.url}/topics/scale-topic-7`,
    "a new search each time, none in memory (?q=cedar 1, cedar 2, …)": `${server.url}/briefs`,
  };
  const rows: string[] = [];
  for (const [name, url] of Object.entries(loads)) {
    const fresh = name.startsWith("a new search");
    if (!fresh) await autocannon({ url, connections, duration: 3 }); // warm-up
    const m = await p99(url, fresh);
    rows.push(`| ${name} | ${m.rps.toFixed(0)} | ${m.p50} | ${m.p99} | ${m.errors} |`);
  }
  console.log(`\nCatalogue: ${briefCount + 2} released briefs, ${briefCount * versionsEach + 2} versions (each of 22 treatments, the large demo brief's data)\n`);
  console.log("| load | requests/s | p50 ms | p99 ms | errors or non-2xx |\n|---|---:|---:|---:|---:|");
  console.log(rows.join("\n"));
  console.log(`\nA search nobody asked before, one at a time (100 of them): median ${coldSearch[50]!.toFixed(0)} ms, p99 ${coldSearch[98]!.toFixed(0)} ms.`);
  console.log(`\nStart-up, from spawning the process to its "serving" line: ${(startUp / 1000).toFixed(1)} s; resident memory then ${residentAtStart.toFixed(0)} MiB.`);
  const figures = (times: number[]) => `median ${times[10]!.toFixed(0)} ms, slowest of 20 ${times[19]!.toFixed(0)} ms`;
  console.log(`\nA version page not in memory, its parts stored: ${figures(cold)} (a restarted process's answers 21 to 40; rendered around the parts, then kept).`);
  console.log(`The same, the restarted process's first twenty answers: ${figures(restarted)}.`);
  console.log(`A version page nobody read before in its language (rendered whole, its parts stored): ${figures(firstRender)}.`);
  console.log(`Resident memory after 0, 100, 200, 300 and 400 more version pages: ${resident.map((m) => m.toFixed(0)).join(", ")} MiB (a page is ${(pageBytes / 1024).toFixed(0)} KiB of HTML; the cache holds at most 64 MiB of pages and their compressions per process).`);
} finally {
  await server?.stop();
  cluster?.stop();
  rmSync(folder, { recursive: true, force: true });
}
// Two pipes stay referenced after the runs (process.getActiveResourcesInfo() lists them; whose, not
// yet found), so the process would not end by itself: the figures are out, stop.
process.exit(0);
