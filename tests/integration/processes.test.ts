// Two server processes on one database, as a deployment runs them behind a load balancer: what one
// changes, the other shows at once; what must be counted across them is counted in PostgreSQL.
import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { publishedBrief } from "../support/briefs";
import { ApiClient, demoClient } from "../support/client";
import { startProductionServer, type RunningServer } from "../support/production-server";

let first: RunningServer;
let second: RunningServer;
let analyst: ApiClient;
let editor: ApiClient;
beforeAll(async () => {
  // One deployment: the same rate-limit namespace for both.
  const env = { RATE_LIMIT_NAMESPACE: `test-${randomUUID()}:` };
  [first, second] = await Promise.all([startProductionServer({ env }), startProductionServer({ env })]);
  // Signed in before the failed sign-ins below make this address wait a minute.
  analyst = await demoClient(first.url, "analyst");
  editor = await demoClient(first.url, "editor");
}, 60_000);
afterAll(async () => {
  await Promise.all([first?.stop(), second?.stop()]);
});

/** Polls until `check` holds or `ms` pass; the milliseconds it took, or null. */
async function within(ms: number, check: () => Promise<boolean>): Promise<number | null> {
  const start = Date.now();
  while (Date.now() - start <= ms) {
    if (await check()) return Date.now() - start;
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
  return null;
}

describe("two processes on one database", () => {
  it("a withdrawal on one is 410 on the other within one second, though the other had the page in memory", async () => {
    const { briefId, slug } = await publishedBrief(analyst, editor, "Withdrawn across processes");
    const page = `${second.url}/briefs/${slug}/v/1`;
    // Read twice on the second process: rendered, then answered from its memory.
    expect((await fetch(page)).status).toBe(200);
    expect((await fetch(page)).status).toBe(200);
    expect((await editor.request("POST", `/api/briefs/${briefId}/withdrawal`, { json: { reason: "A trial in the data was retracted." } })).status).toBe(200);
    const took = await within(1000, async () => (await fetch(page)).status === 410);
    expect(took, "the second process still answered 200 after one second").not.toBeNull();
  });

  it("counts failed sign-ins across both: three on one and two on the other make the sixth a 429", async () => {
    const email = `nobody-${randomUUID()}@fairweigh.example`;
    const attempt = async (server: RunningServer) => (await new ApiClient(server.url).signIn(email, "not the password")).status;
    const statuses = [await attempt(first), await attempt(first), await attempt(first), await attempt(second), await attempt(second)];
    expect(statuses).toEqual([401, 401, 401, 401, 401]);
    expect(await attempt(second)).toBe(429);
    expect(await attempt(first)).toBe(429);
  });

  it("a scheduled release becomes public on both at its time", async () => {
    const releaseAt = new Date(Date.now() + 4000);
    const { slug } = await publishedBrief(analyst, editor, "Released across processes", releaseAt.toISOString());
    const address = (server: RunningServer) => `${server.url}/briefs/${slug}/v/1`;
    expect((await fetch(address(first))).status).toBe(404);
    expect((await fetch(address(second))).status).toBe(404);
    for (const server of [first, second]) {
      const took = await within(10_000, async () => (await fetch(address(server))).status === 200);
      expect(took, server.url).not.toBeNull();
    }
    expect(Date.now()).toBeGreaterThanOrEqual(releaseAt.getTime());
  });
});

describe("WORKERS", () => {
  it("runs that many processes behind one port (node:cluster), and stopping the server stops them all", async () => {
    const server = await startProductionServer({ env: { WORKERS: "2" } });
    const children = readFileSync(`/proc/${server.pid}/task/${server.pid}/children`, "utf8").trim().split(/\s+/).map(Number);
    expect(children).toHaveLength(2);
    const answers = await Promise.all(Array.from({ length: 8 }, async () => (await fetch(`${server.url}/api/health`)).status));
    expect(answers).toEqual(Array.from({ length: 8 }, () => 200));
    await server.stop();
    const alive = (pid: number) => {
      try {
        process.kill(pid, 0);
        return true;
      } catch {
        return false;
      }
    };
    expect(children.filter(alive)).toEqual([]);
  }, 60_000);
});

describe("behind a CDN", () => {
  it("files public answers under the brief's surrogate keys, and asks the purge hook to drop the brief when it is withdrawn", async () => {
    const received: unknown[] = [];
    const hook = createServer((req, res) => {
      let body = "";
      req.on("data", (chunk: Buffer) => (body += chunk.toString()));
      req.on("end", () => {
        received.push(JSON.parse(body));
        res.end("ok");
      });
    });
    await new Promise<void>((resolve) => hook.listen(0, "127.0.0.1", resolve));
    const server = await startProductionServer({ env: { PURGE_URL: `http://127.0.0.1:${(hook.address() as AddressInfo).port}/purge` } });
    try {
      const { briefId, slug } = await publishedBrief(analyst, editor, "Kept by a CDN");
      const keys = `brief:${slug} brief:${slug}:v1`;
      const version = `/briefs/${slug}/v/1`;
      for (const path of [version, `${version}/compare/grp_counseling/no_contact`, `/es${version}`, `${version}/cite.ris`, `${version}/downloads/results.csv`, `/embed${version}`, `${version}/share.png`]) {
        const answer = await fetch(`${server.url}${path}`);
        expect(answer.status, path).toBe(200);
        expect(answer.headers.get("surrogate-key"), path).toBe(keys);
        expect(answer.headers.get("cache-control"), path).toMatch(/^public/);
      }
      expect((await fetch(`${server.url}/briefs/${slug}`)).headers.get("surrogate-key")).toBe(`brief:${slug}`);
      // An answer that depends on who reads it is never filed for a shared cache.
      const press = await demoClient(server.url, "press");
      const personal = await press.request("GET", version);
      expect(personal.headers.get("surrogate-key")).toBeNull();

      const before = received.length;
      expect((await editor.request("POST", `/api/briefs/${briefId}/withdrawal`, { json: { reason: "A trial in the data was retracted." } })).status).toBe(200);
      const took = await within(10_000, async () => received.length > before);
      expect(took, "no purge request within ten seconds").not.toBeNull();
      expect(received.at(-1)).toEqual({ surrogateKeys: [`brief:${slug}`] });
    } finally {
      await server.stop();
      await new Promise<void>((resolve) => hook.close(() => resolve()));
    }
  }, 60_000);
});
