// npm run bench:http: the production build on loopback, against a throw-away cluster with the demo
// seed, measured with autocannon (50 connections, asking for compressed answers as browsers do):
// 1. single addresses side by side, after a warm-up: a cached brief page, a comparison page, the
//    search page, a static asset, and the peer of a cached page — a bare node:http server in a
//    process of its own answering the same compressed bytes from memory with the five headers a
//    minimal server would send (type and encoding, length, ETag, Cache-Control, Vary), the limit of
//    Node on this machine; beside it the same peer sending every header our answer carries, to show
//    what those headers cost (10 s each);
// 2. a mixed load for 30 s: nine public reads in ten (brief pages, versions, comparisons, search,
//    topics, the feed) and one signed-in desk read, with the server's memory before, at its peak and
//    after. Any error or 5xx is reported.
// The server runs as `npm start` runs it, with its default number of processes (one per core), and is
// measured from outside, as a reader's requests reach it: this is "the outside way" of
// docs/operations.md. It prints requests per second and p50/p99 latency against the targets, and
// asserts nothing: a slow machine reports rather than fails. autocannon runs on the same machine and
// takes a core of its own: on two cores its share shows in every latency, the static asset's included.
import { spawn, type ChildProcess } from "node:child_process";
import { chmodSync, mkdtempSync, readdirSync, rmSync, writeFileSync } from "node:fs";
import { request } from "node:http";
import { availableParallelism, tmpdir } from "node:os";
import path from "node:path";
import autocannon from "autocannon";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { demoPassword } from "#workflows/seed";
import { ensureCluster, freePort, type Cluster } from "./lib/postgres";
import { residentTreeMiB, startProductionServer, type RunningServer } from "./lib/production-server";
import { build, log, migrateAndSeed, projectRoot } from "./lib/steps";

const connections = 50;
const single = 10;
const mixed = 30;

const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-bench-"));
chmodSync(folder, 0o755);
let cluster: Cluster | null = null;
let server: RunningServer | null = null;
let peer: { url: string; child: ChildProcess } | null = null;
let fullPeer: { url: string; child: ChildProcess } | null = null;

// As a browser asks: compressed if the server can.
const headers = { "accept-encoding": "br, gzip" };

interface Row {
  name: string;
  rps: number;
  p50: number;
  p99: number;
  errors: number;
  non2xx: number;
}

async function measure(name: string, options: autocannon.Options): Promise<Row> {
  const result = await autocannon({ connections, headers, ...options });
  return { name, rps: result.requests.average, p50: result.latency.p50, p99: result.latency.p99, errors: result.errors + result.timeouts, non2xx: result.non2xx };
}

/** A signed-in session's cookie, as the desk's browser holds it. */
async function signIn(baseUrl: string, email: string): Promise<string> {
  const csrf = await fetch(`${baseUrl}/api/csrf`);
  const cookies = csrf.headers.getSetCookie().map((c) => c.split(";")[0]);
  const { token } = (await csrf.json()) as { token: string };
  const answer = await fetch(`${baseUrl}/api/session`, {
    method: "POST",
    headers: { "content-type": "application/json", "x-csrf-token": token, cookie: cookies.join("; ") },
    body: JSON.stringify({ email, password: demoPassword }),
  });
  if (answer.status !== 200) throw new Error(`signing in as ${email}: ${answer.status}`);
  const session = answer.headers.getSetCookie().map((c) => c.split(";")[0]!);
  return [...cookies.filter((c) => !session.some((s) => s.split("=")[0] === c!.split("=")[0])), ...session].join("; ");
}

/** The page's bytes and headers exactly as the server sends them to a browser asking for brotli. */
function rawAnswer(url: string): Promise<{ headers: Record<string, string>; body: Buffer }> {
  return new Promise((resolve, reject) => {
    request(url, { headers }, (res) => {
      const chunks: Buffer[] = [];
      res.on("data", (chunk: Buffer) => chunks.push(chunk));
      res.on("end", () => resolve({ headers: Object.fromEntries(Object.entries(res.headers).filter(([name]) => !["date", "connection", "keep-alive"].includes(name))) as Record<string, string>, body: Buffer.concat(chunks) }));
    })
      .on("error", reject)
      .end();
  });
}

/** The headers a minimal server would send with a compressed page. */
const fiveHeaders = ["content-type", "content-encoding", "content-length", "etag", "cache-control", "vary"];
const onlyFive = (answer: { headers: Record<string, string>; body: Buffer }) => ({ ...answer, headers: Object.fromEntries(Object.entries(answer.headers).filter(([name]) => fiveHeaders.includes(name))) });

/** A bare node:http server in a process of its own, answering those bytes and headers to every request. */
async function startPeer(answer: { headers: Record<string, string>; body: Buffer }): Promise<{ url: string; child: ChildProcess }> {
  const port = await freePort();
  const body = path.join(folder, "peer-body");
  writeFileSync(body, answer.body);
  const script = `const http=require("node:http");const body=require("node:fs").readFileSync(${JSON.stringify(body)});const headers=${JSON.stringify(answer.headers)};http.createServer((req,res)=>{res.writeHead(200,headers);res.end(body)}).listen(${port},"127.0.0.1",()=>console.log("ready"));`;
  const child = spawn(process.execPath, ["-e", script], { stdio: ["ignore", "pipe", "inherit"] });
  await new Promise<void>((resolve) => child.stdout!.once("data", () => resolve()));
  return { url: `http://127.0.0.1:${port}/`, child };
}

const table = (rows: Row[]) =>
  [`| load | requests/s | p50 ms | p99 ms | errors | non-2xx |`, `|---|---:|---:|---:|---:|---:|`, ...rows.map((r) => `| ${r.name} | ${r.rps.toFixed(0)} | ${r.p50} | ${r.p99} | ${r.errors} | ${r.non2xx} |`)].join("\n");

try {
  cluster = await ensureCluster({ dataDir: path.join(folder, "postgres"), port: await freePort(), log });
  await migrateAndSeed(cluster.url, true);
  build();
  // As `npm start` serves: one process per core (server/config.ts), not the tests' single process, and
  // a JSON line logged for every request (its default level), which the parent reads from a pipe.
  const processes = availableParallelism();
  server = await startProductionServer({ databaseUrl: cluster.url, sessionSecret: "a-session-secret-used-only-by-the-benchmark-0123", env: { WORKERS: String(processes), LOG_LEVEL: "info" } });
  const [small, large] = demoBriefs().map((brief) => slugify(brief.title)) as [string, string];
  const topic = slugify(demoBriefs()[0]!.topic);
  const css = readdirSync(path.join(projectRoot, "dist/client/assets/static")).find((f) => f.endsWith(".css"))!;

  // Each process renders and keeps the page, then answers it from memory once (the fast path's headers).
  for (let i = 0; i < 4 * processes; i++) await rawAnswer(`${server.url}/briefs/${small}/v/1`);
  const answer = await rawAnswer(`${server.url}/briefs/${small}/v/1`);
  log(`The brief page: ${(answer.body.length / 1024).toFixed(1)} KiB with brotli, ${Object.keys(answer.headers).length} headers.`);
  peer = await startPeer(onlyFive(answer));
  fullPeer = await startPeer(answer);
  const singles = {
    "brief page (released version, cached)": `${server.url}/briefs/${small}/v/1`,
    "bare node:http peer, same bytes, five headers": peer.url,
    "the same peer with every header of our answer": fullPeer.url,
    "comparison page (cached)": `${server.url}/briefs/${small}/v/1/compare/combined/usual_care`,
    "search page (?q=)": `${server.url}/briefs?q=sleep`,
    "static asset (CSS)": `${server.url}/assets/static/${css}`,
  };
  log(`autocannon: ${connections} connections; ${single} s per address, then ${mixed} s of mixed load`);
  // Warm-up of every address first (the page cache, the JIT, the pool), so that order does not matter.
  for (const url of Object.values(singles)) await autocannon({ url, connections, duration: 5, headers });
  const rows: Row[] = [];
  for (const [name, url] of Object.entries(singles)) rows.push(await measure(name, { url, duration: single }));

  // Nine public reads and one desk read per round: each connection walks the list in order.
  const cookie = await signIn(server.url, "editor@fairweigh.example");
  const briefList = (await (await fetch(`${server.url}/api/briefs`, { headers: { cookie } })).json()) as { briefs: { id: string }[] };
  const publicReads = [
    `/briefs/${small}/v/1`,
    `/briefs/${large}/v/1`,
    `/briefs/${small}`,
    `/briefs/${small}/v/1/compare/combined/usual_care`,
    `/briefs/${small}/v/1/compare/light/usual_care`,
    `/briefs?q=headache`,
    `/briefs?q=sleep%20usual`,
    `/topics/${topic}`,
    `/feed.xml`,
  ];
  const requests = [
    ...publicReads.map((address) => ({ method: "GET" as const, path: address })),
    { method: "GET" as const, path: `/api/briefs/${briefList.briefs[0]!.id}`, headers: { ...headers, cookie } },
  ];
  const before = residentTreeMiB(server.pid);
  let peak = before;
  const sampler = setInterval(() => (peak = Math.max(peak, residentTreeMiB(server!.pid))), 250);
  const mixedRow = await measure("mixed: 90% public reads, 10% desk reads", { url: server.url, duration: mixed, requests });
  clearInterval(sampler);
  const after = residentTreeMiB(server.pid);
  rows.push(mixedRow);

  console.log(`\n${table(rows)}`);
  const [brief, bare, full, , search] = rows as [Row, Row, Row, Row, Row];
  console.log(`\n${processes} server processes (npm start's default on ${availableParallelism()} cores); the peer is one process. Every header of our answer costs the peer ${((1 - full.rps / bare.rps) * 100).toFixed(0)}% of its rate.`);
  const share = brief.rps / bare.rps;
  console.log(`\nBrief page at ${(share * 100).toFixed(0)}% of the bare node:http peer's rate in this run (target ≥ 60%): ${share >= 0.6 ? "met" : "NOT met"}.`);
  console.log(`Brief page p99 ${brief.p99} ms at ${connections} connections (target < 50 ms): ${brief.p99 < 50 ? "met" : "NOT met"}.`);
  console.log(`Search p99 ${search.p99} ms at ${connections} connections.`);
  console.log(`Mixed load: ${mixedRow.errors} errors and ${mixedRow.non2xx} non-2xx answers (target: none): ${mixedRow.errors + mixedRow.non2xx === 0 ? "met" : "NOT met"}; p99 ${mixedRow.p99} ms.`);
  console.log(`Server memory (RSS, all ${processes + 1} processes): ${before.toFixed(0)} MiB before, ${peak.toFixed(0)} MiB at the peak, ${after.toFixed(0)} MiB after.`);
} finally {
  peer?.child.kill();
  fullPeer?.child.kill();
  await server?.stop();
  cluster?.stop();
  rmSync(folder, { recursive: true, force: true });
}
// As in bench-scale.ts: two pipes stay referenced after the runs, so end once the figures are out.
process.exit(0);
