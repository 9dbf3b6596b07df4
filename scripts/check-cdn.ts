// npm run check:cdn: a real cache in front, checked. Installs Debian's varnish and varnish-modules when
// missing (as `npm start` does for PostgreSQL), then starts a throw-away PostgreSQL, two app processes
// and Varnish with deploy/varnish/fairweigh.vcl, all on loopback, and checks through the cache:
// a public page is kept (a hit on the second request); a correction, a published translation and a
// withdrawal reach a reader behind the cache within 2 s (the app's purge hook, by surrogate key);
// an embargoed version and a signed-in page are never kept, and a press reader with a session never
// gets a shared copy. Prints one line per check; exits 1 if any fails. docs/operations.md.
import { spawn, spawnSync, type ChildProcess } from "node:child_process";
import { chmodSync, copyFileSync, existsSync, mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import type { Translation } from "#web/api/contract";
import { demoClient, type ApiClient } from "../tests/support/client";
import { ensureCluster, freePort, type Cluster } from "./lib/postgres";
import { startProductionServer, type RunningServer } from "./lib/production-server";
import { build, log, migrateAndSeed, projectRoot } from "./lib/steps";

const xkeyModule = "/usr/lib/x86_64-linux-gnu/varnish/vmods/libvmod_xkey.so";
/** How long a change may take to reach a reader behind the cache. */
const withinMs = 2000;

function ensureVarnish(): void {
  const found = existsSync("/usr/sbin/varnishd") && existsSync(xkeyModule);
  if (found) return;
  log("Varnish is not installed: installing Debian's varnish and varnish-modules (apt-get, non-interactive)…");
  const asRoot = process.getuid?.() === 0 ? [] : ["sudo"];
  const env = { ...process.env, DEBIAN_FRONTEND: "noninteractive" };
  for (const command of [
    [...asRoot, "apt-get", "update", "-qq"],
    [...asRoot, "apt-get", "install", "-y", "-qq", "varnish", "varnish-modules"],
  ]) {
    const result = spawnSync(command[0]!, command.slice(1), { stdio: "inherit", env });
    if (result.status !== 0) throw new Error(`${command.join(" ")} failed with exit code ${result.status}`);
  }
}

/** Varnish in the foreground, with the shipped VCL beside a backends file naming the app processes. */
async function startVarnish(folder: string, port: number, backends: number[]): Promise<ChildProcess> {
  const vcl = path.join(folder, "fairweigh.vcl");
  copyFileSync(path.join(projectRoot, "deploy/varnish/fairweigh.vcl"), vcl);
  const names = backends.map((_, i) => `app${i + 1}`);
  writeFileSync(
    path.join(folder, "backends.vcl"),
    [
      ...backends.map((backendPort, i) => `backend ${names[i]} {\n  .host = "127.0.0.1";\n  .port = "${backendPort}";\n}\n`),
      `sub vcl_init {\n  new app = directors.round_robin();\n${names.map((name) => `  app.add_backend(${name});`).join("\n")}\n}\n`,
    ].join("\n"),
  );
  for (const file of ["fairweigh.vcl", "backends.vcl"]) chmodSync(path.join(folder, file), 0o644);
  // -j none: no privilege separation, so that it runs as whoever runs the check, on loopback only.
  const child = spawn("/usr/sbin/varnishd", ["-F", "-j", "none", "-a", `127.0.0.1:${port}`, "-f", vcl, "-n", path.join(folder, "varnish"), "-s", "malloc,64m"], { stdio: ["ignore", "ignore", "inherit"] });
  for (let attempt = 0; attempt < 100; attempt++) {
    if (child.exitCode !== null) throw new Error(`varnishd exited with code ${child.exitCode}`);
    const answer = await fetch(`http://127.0.0.1:${port}/api/health`).catch(() => null);
    if (answer) return child;
    await new Promise((resolve) => setTimeout(resolve, 100));
  }
  throw new Error("Varnish did not answer within 10 s");
}

const failures: string[] = [];
function report(what: string, ok: boolean, detail = ""): void {
  console.log(`${what}${detail ? ` ${detail}` : ""}: ${ok ? "ok" : "FAILED"}`);
  if (!ok) failures.push(what);
}

/** Polls an address through the cache until `done` holds of the answer; the milliseconds it took, or null after 10 s. */
async function timeUntil(url: string, done: (answer: { status: number; body: string }) => boolean): Promise<number | null> {
  const start = performance.now();
  while (performance.now() - start < 10_000) {
    const answer = await fetch(url);
    if (done({ status: answer.status, body: await answer.text() })) return Math.round(performance.now() - start);
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
  return null;
}

/** Two requests: whether the second was answered by the cache. */
async function secondIsHit(url: string, headers: Record<string, string> = {}): Promise<boolean> {
  await (await fetch(url, { headers })).arrayBuffer();
  const second = await fetch(url, { headers });
  await second.arrayBuffer();
  return second.headers.get("x-cache") === "hit";
}

/**
 * Whether the cache keeps `url` within `ms`: a purge the app sent for an earlier change (through its
 * queue, every half second) may still empty it between the two requests of secondIsHit.
 */
async function keptWithin(url: string, ms: number): Promise<boolean> {
  const deadline = Date.now() + ms;
  for (;;) {
    if (await secondIsHit(url)) return true;
    if (Date.now() > deadline) return false;
    await new Promise((resolve) => setTimeout(resolve, 250));
  }
}

async function approved(analyst: ApiClient, editor: ApiClient, briefId: string): Promise<void> {
  await analyst.request("POST", `/api/briefs/${briefId}/reviews`, { json: { decision: "submitted" } });
  const approval = await editor.request("POST", `/api/briefs/${briefId}/reviews`, { json: { decision: "approved", acknowledgeWarnings: true } });
  if (approval.status !== 201) throw new Error(`approval answered ${approval.status}: ${approval.body.error?.message}`);
}

const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-cdn-"));
chmodSync(folder, 0o755);
let cluster: Cluster | null = null;
const servers: RunningServer[] = [];
let varnish: ChildProcess | null = null;
try {
  ensureVarnish();
  cluster = await ensureCluster({ dataDir: path.join(folder, "postgres"), port: await freePort(), log });
  await migrateAndSeed(cluster.url, true);
  build();
  const cachePort = await freePort();
  const cache = `http://127.0.0.1:${cachePort}`;
  log("Starting two app processes and Varnish in front of them");
  for (let i = 0; i < 2; i++) servers.push(await startProductionServer({ databaseUrl: cluster.url, sessionSecret: "a-session-secret-for-the-cdn-check-0123456789", env: { PURGE_URL: `${cache}/.purge`, PUBLIC_URL: cache } }));
  varnish = await startVarnish(folder, cachePort, servers.map((server) => Number(new URL(server.url).port)));

  const [small, large] = demoBriefs().map((brief) => slugify(brief.title)) as [string, string];
  const app = servers[0]!.url;
  const [analyst, editor, translator, press] = await Promise.all(["analyst", "editor", "translator", "press"].map((account) => demoClient(app, account)));
  const briefs = (await editor!.request("GET", "/api/briefs")).body.briefs as { id: string; slug: string }[];
  const idOf = (slug: string) => briefs.find((brief) => brief.slug === slug)!.id;

  report("a public page is kept (the second request is a hit)", await secondIsHit(`${cache}/briefs/${small}/v/1`));

  // A correction: version 1's page, kept, says at once that a newer version exists.
  await approved(analyst!, editor!, idOf(small));
  if ((await editor!.request("POST", `/api/briefs/${idOf(small)}/versions`, { json: { note: "A correction for the cache check." } })).status !== 201) throw new Error("the correction was refused");
  const corrected = await timeUntil(`${cache}/briefs/${small}/v/1`, (answer) => answer.body.includes("A newer version (2) exists"));
  report("a correction", corrected !== null && corrected <= withinMs, `purged in ${corrected ?? "more than 10 000"} ms`);

  // A published translation: version 2 in Spanish, kept with its changed passages marked, is whole at once.
  await secondIsHit(`${cache}/es/briefs/${small}/v/2`);
  const v2 = ((await translator!.request("GET", "/api/translations")).body.versions as { versionId: string; slug: string }[]).find((entry) => entry.slug === small)!.versionId;
  const open = ((await translator!.request("GET", `/api/translations/${v2}/es`)).body.translation as Translation).fields.filter((field) => field.stale || (!field.optional && field.target === ""));
  await translator!.request("PUT", `/api/translations/${v2}/es`, { json: { fields: Object.fromEntries(open.map((field) => [field.name, `ES ${field.text}`])) } });
  await translator!.request("POST", `/api/translations/${v2}/es/ready`);
  if ((await editor!.request("POST", `/api/translations/${v2}/es/publish`)).status !== 200) throw new Error("the translation could not be published");
  const translated = await timeUntil(`${cache}/es/briefs/${small}/v/2`, (answer) => !answer.body.includes('data-testid="not-translated"'));
  report("a published translation", translated !== null && translated <= withinMs, `purged in ${translated ?? "more than 10 000"} ms`);

  // A withdrawal: every kept page of the brief answers 410 at once.
  await secondIsHit(`${cache}/briefs/${small}/v/2`);
  await editor!.request("POST", `/api/briefs/${idOf(small)}/withdrawal`, { json: { reason: "Withdrawn by the cache check." } });
  const withdrawn = await timeUntil(`${cache}/briefs/${small}/v/2`, (answer) => answer.status === 410);
  report("a withdrawal", withdrawn !== null && withdrawn <= withinMs, `purged in ${withdrawn ?? "more than 10 000"} ms`);

  // An embargoed version: the press read it through the cache, never kept; anonymous readers get 404
  // and the press never get that shared answer either.
  await approved(analyst!, editor!, idOf(large));
  const releaseAt = new Date(Date.now() + 3600_000).toISOString();
  if ((await editor!.request("POST", `/api/briefs/${idOf(large)}/versions`, { json: { note: "An embargoed correction for the cache check.", releaseAt } })).status !== 201) throw new Error("the embargoed version was refused");
  const pressHeaders = { cookie: press!.cookieHeader, accept: "text/html" };
  const embargoed = `${cache}/briefs/${large}/v/2`;
  const pressFirst = await fetch(embargoed, { headers: pressHeaders });
  await pressFirst.arrayBuffer();
  const anonymous = await fetch(embargoed);
  await anonymous.arrayBuffer();
  const pressAgain = await fetch(embargoed, { headers: pressHeaders });
  await pressAgain.arrayBuffer();
  report(
    "an embargoed version is never kept, and the public gets 404",
    pressFirst.status === 200 && pressAgain.status === 200 && pressAgain.headers.get("x-cache") === "miss" && anonymous.status === 404,
    `(press ${pressFirst.status} ${pressFirst.headers.get("x-cache")}, public ${anonymous.status}, press again ${pressAgain.status} ${pressAgain.headers.get("x-cache")})`,
  );

  // A page a press reader sees differently (its version history lists the embargoed version 2) is
  // kept for the public, and never handed to the press reader, whose own copy is private.
  // The embargoed version's purges of the brief's pages may still be on their way: wait for a kept copy.
  const publicCopy = await keptWithin(`${cache}/briefs/${large}/v/1`, 5000);
  const personal = await fetch(`${cache}/briefs/${large}/v/1`, { headers: pressHeaders });
  const personalPage = await personal.text();
  report(
    "a press reader with a session never gets the public copy",
    publicCopy && personal.headers.get("x-cache") === "miss" && /private/.test(personal.headers.get("cache-control") ?? "") && personalPage.includes(`/briefs/${large}/v/2`),
    `(public copy kept: ${publicCopy}; press: ${personal.headers.get("x-cache")}, ${personal.headers.get("cache-control")})`,
  );

  report("a signed-in page is never kept", !(await secondIsHit(`${cache}/desk`, { cookie: editor!.cookieHeader })) && !(await secondIsHit(`${cache}/api/session`, { cookie: editor!.cookieHeader })));
} finally {
  varnish?.kill("SIGTERM");
  for (const server of servers) await server.stop();
  cluster?.stop();
  rmSync(folder, { recursive: true, force: true });
}

if (failures.length > 0) {
  console.error(`check:cdn failed: ${failures.join("; ")}`);
  process.exit(1);
}
console.log("check:cdn passed");
// Keep-alive sockets of the checks' fetches would hold the process a while longer.
process.exit(0);
