// The audit log for administrators: every change with who, when, what and the record before and
// after, filtered by person, action and brief, and paged in SQL (newest first, by a cursor).
import { afterAll, beforeAll, expect, it } from "vitest";
import { draftBrief } from "../support/briefs";
import { type ApiClient, demoClient } from "../support/client";
import { startTestApp, type TestApp } from "../support/app";

let app: TestApp;
const clients: Record<string, ApiClient> = {};
beforeAll(async () => {
  app = await startTestApp();
  for (const role of ["admin", "analyst"]) {
    clients[role] = await demoClient(app.url, role);
  }
});
afterAll(async () => {
  await app.close();
});

type Entry = { id: number; actorId: string | null; actorName: string | null; action: string; entity: string; entityId: string; before: unknown; after: unknown };

it("filters by brief (the brief and its outcomes), person and action, newest first", async () => {
  const { briefId, outcomeId } = await draftBrief(clients.analyst!, "Audited brief");
  const analyst = (await clients.analyst!.request("GET", "/api/session")).body.person as { id: string };
  const { body } = await clients.admin!.request("GET", `/api/audit?brief=${briefId}`);
  const entries = body.entries as Entry[];
  expect(entries.map((e) => `${e.entity}:${e.action}`)).toEqual(["outcome:upload", "outcome:create", "brief:create"]);
  expect(entries.every((e) => e.actorName === "Demo analyst")).toBe(true);
  expect(entries[1]!.entityId).toBe(outcomeId);
  expect(entries[2]!.after).toMatchObject({ title: "Audited brief" });
  expect(body.actions).toEqual(expect.arrayContaining(["create", "sign-in", "upload"]));

  const byPerson = (await clients.admin!.request("GET", `/api/audit?person=${analyst.id}&action=create&limit=200`)).body.entries as Entry[];
  expect(byPerson.length).toBeGreaterThanOrEqual(2);
  expect(byPerson.every((e) => e.actorId === analyst.id && e.action === "create")).toBe(true);
});

it("pages by a cursor: each page older than the last, none repeated", async () => {
  const first = (await clients.admin!.request("GET", "/api/audit?limit=3")).body as { entries: Entry[]; next: number };
  expect(first.entries).toHaveLength(3);
  const second = (await clients.admin!.request("GET", `/api/audit?limit=3&before=${first.next}`)).body as { entries: Entry[] };
  expect(second.entries[0]!.id).toBeLessThan(first.entries[2]!.id);
  expect(new Set([...first.entries, ...second.entries].map((e) => e.id)).size).toBe(6);
});

it("a filter that is not an id is a 400 naming it", async () => {
  const answer = await clients.admin!.request("GET", "/api/audit?brief=nope");
  expect(answer.status).toBe(400);
  expect(answer.body.error?.message).toContain("brief");
});
