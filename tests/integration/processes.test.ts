// Two server processes on one database, as a deployment runs them behind a load balancer: what one
// changes, the other shows at once; what must be counted across them is counted in PostgreSQL.
import { randomUUID } from "node:crypto";
import { readFileSync } from "node:fs";
import { createServer } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { publishedBrief } from "../support/briefs";
import { largeNetwork } from "../support/large-network";
import { ApiClient, demoClient } from "../support/client";
import { startProductionServer, type RunningServer } from "../support/production-server";

let first: RunningServer;
let second: RunningServer;
let analyst: ApiClient;
let editor: ApiClient;
beforeAll(async () => {
  // One deployment: the same rate-limit namespace and public address for both.
  const env = { RATE_LIMIT_NAMESPACE: `test-${randomUUID()}:`, PUBLIC_URL: "http://fairweigh.example" };
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

  it("a release and a withdrawal on one show in the other's list pages within one second, though it had them in memory", async () => {
    const word = `quillwort${randomUUID().slice(0, 8)}`;
    const search = `${second.url}/briefs?q=${word}`;
    /** The list entry of the brief the search finds, or null when it finds none. */
    const entry = async () => /<li[^>]*>(?:(?!<\/li>).)*<\/li>/s.exec(await (await fetch(search)).text())?.[0] ?? null;
    // Read twice on the second process: rendered, then answered from its memory.
    expect(await entry()).toBeNull();
    expect(await entry()).toBeNull();
    const { briefId } = await publishedBrief(analyst, editor, `Listed across processes ${word}`);
    expect(await within(1000, async () => (await entry()) !== null), "the second process's search did not find the release within one second").not.toBeNull();
    expect(await entry()).not.toContain("Withdrawn");
    expect((await editor.request("POST", `/api/briefs/${briefId}/withdrawal`, { json: { reason: "A trial in the data was retracted." } })).status).toBe(200);
    expect(await within(1000, async () => (await entry())?.includes("Withdrawn") ?? false), "the second process's list did not show the withdrawal within one second").not.toBeNull();
  });

  it("gives a kept page the same ETag in both, so that a reader revalidating with one's tag gets a 304 from the other", async () => {
    const { slug } = await publishedBrief(analyst, editor, "Tagged alike across processes");
    for (const path of [`/briefs/${slug}/v/1`, `/briefs/${slug}/v/1/compare/grp_counseling/no_contact`, "/briefs?q=tagged"]) {
      const [one, other] = [await fetch(`${first.url}${path}`), await fetch(`${second.url}${path}`)];
      expect(one.status, path).toBe(200);
      const tag = one.headers.get("etag");
      expect(tag, path).toBeTruthy();
      expect(other.headers.get("etag"), path).toBe(tag);
      // As a browser revalidates (fetch would add "no-cache" to a conditional request of its own).
      const revalidated = await fetch(`${second.url}${path}`, { headers: { "if-none-match": tag!, "cache-control": "max-age=0" } });
      expect(revalidated.status, path).toBe(304);
    }
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

describe("large uploads on the queue", () => {
  it("analyses a large network as a job while the pages keep answering; a refused one leaves the stored data as they were", async () => {
    const created = await analyst.request("POST", "/api/briefs", { json: { title: "A large invented network", topic: "Scale", condition: "Invented condition", population: "Invented people" } });
    const briefId = String(created.body.id);
    const outcome = await analyst.request("POST", `/api/briefs/${briefId}/outcomes`, {
      json: { name: "Invented events", kind: "binary", measure: "OR", model: "random", referenceTreatment: "t00", direction: "higher", baselineRisk: 0.2 },
    });
    const outcomeId = String((outcome.body.outcome as { id: string }).id);
    const state = async () => ((await analyst.request("GET", `/api/briefs/${briefId}`)).body.brief as { outcomes: { analysis: { state: string; pending: { state: string; issues: { rule: string }[] } | null } }[] }).outcomes[0]!.analysis;

    const upload = await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "large.csv", bytes: largeNetwork(40, 1200) }, { format: "arm-binary" });
    expect(upload.status).toBe(202);
    expect(upload.body).toMatchObject({ valid: true, analysing: true, fileName: "large.csv" });
    // The other process answers pages meanwhile (how fast: npm run bench).
    expect((await fetch(`${second.url}/briefs`)).status).toBe(200);
    const done = await within(60_000, async () => (await state()).state === "current");
    expect(done, "the large upload was not analysed within a minute").not.toBeNull();
    expect((await state()).pending).toBeNull();
    expect((await analyst.request("GET", `/api/outcomes/${outcomeId}/result`)).body.studies).toBe(1200);

    const refused = await analyst.upload(`/api/outcomes/${outcomeId}/dataset`, { name: "split.csv", bytes: largeNetwork(40, 1200, true) }, { format: "arm-binary" });
    expect(refused.status).toBe(202);
    const failed = await within(60_000, async () => (await state()).pending?.state === "refused");
    expect(failed, "the split network was not refused within a minute").not.toBeNull();
    expect((await state()).pending!.issues.map((issue) => issue.rule)).toEqual(["disconnected-network"]);
    expect((await state()).state).toBe("current");
    expect((await analyst.request("GET", `/api/outcomes/${outcomeId}/result`)).body.studies).toBe(1200);
  }, 150_000);
});
