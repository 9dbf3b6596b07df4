// A version's page stored once per language (server/web/pages/stored-brief.ts), against two production
// processes on the test cluster: rendered ahead of its readers; what one renders the other reads back;
// another build's rendering or one made before a translation was published is rendered again; the
// browser gets the sections once.
import { randomUUID } from "node:crypto";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import type { Translation } from "#web/api/contract";
import { withTestDatabase } from "../support/app";
import { publishedBrief } from "../support/briefs";
import { demoClient, type ApiClient } from "../support/client";
import { startProductionServer, type RunningServer } from "../support/production-server";

let first: RunningServer;
let second: RunningServer;
const clients: Record<string, ApiClient> = {};
const database = withTestDatabase();
beforeAll(async () => {
  const env = { RATE_LIMIT_NAMESPACE: `test-${randomUUID()}:` };
  [first, second] = await Promise.all([startProductionServer({ env }), startProductionServer({ env })]);
  for (const role of ["analyst", "editor", "translator"]) clients[role] = await demoClient(first.url, role);
}, 60_000);
afterAll(async () => {
  await Promise.all([first?.stop(), second?.stop()]);
});

const page = async (server: RunningServer, address: string) => {
  const answer = await fetch(`${server.url}${address}`);
  expect(answer.status, address).toBe(200);
  return answer.text();
};

async function stored(briefId: string, locale: string) {
  const rows = await database.query(
    "select r.build, r.state, r.outcomes_html from version_renderings r join brief_versions v on v.id = r.version_id where v.brief_id = $1 and v.number = 1 and r.locale = $2",
    [briefId, locale],
  );
  return rows.rows[0] as { build: string; state: string; outcomes_html: string } | undefined;
}

/** Adds a paragraph to the stored sections: a page that shows it was read from the store, not rendered. */
const markStored = (briefId: string, locale: string, build?: string) =>
  database.query(
    "update version_renderings r set outcomes_html = outcomes_html || '<p>Read from the store.</p>', build = coalesce($3, build) from brief_versions v where v.id = r.version_id and v.brief_id = $1 and v.number = 1 and r.locale = $2",
    [briefId, locale, build ?? null],
  );

describe("a version's page, stored once per language", () => {
  let briefId = "";
  let slug = "";

  it("is rendered ahead in every language once released, before anyone reads it", async () => {
    ({ briefId, slug } = await publishedBrief(clients.analyst!, clients.editor!, "Stored once, read twice"));
    const locales = async () =>
      (await database.query("select r.locale from version_renderings r join brief_versions v on v.id = r.version_id where v.brief_id = $1 order by r.locale", [briefId])).rows.map((row: { locale: string }) => row.locale);
    const start = Date.now();
    while ((await locales()).length < 4 && Date.now() - start < 15_000) await new Promise((resolve) => setTimeout(resolve, 100));
    expect(await locales()).toEqual(["ar", "en", "es", "fr"]);
  });

  it("is read back by a process that never rendered it", async () => {
    const rendered = await page(first, `/briefs/${slug}/v/1`);
    const row = await stored(briefId, "en");
    expect(row?.build).toMatch(/^[\w-]{16}$/);
    // The invented network of the test brief has one outcome: one section, on the page as stored.
    expect(row!.outcomes_html.match(/data-testid="outcome"/g)).toHaveLength(1);
    expect(rendered).toContain(row!.outcomes_html);
    await markStored(briefId, "en");
    expect(await page(second, `/briefs/${slug}/v/1`)).toContain("<p>Read from the store.</p>");
  });

  it("is rendered again where another build stored it, and replaced", async () => {
    await page(first, `/es/briefs/${slug}/v/1`);
    await markStored(briefId, "es", "an-earlier-build");
    const again = await page(second, `/es/briefs/${slug}/v/1`);
    expect(again).not.toContain("Read from the store.");
    expect(again).toContain('data-testid="outcome"');
    expect((await stored(briefId, "es"))?.build).toBe((await stored(briefId, "en"))?.build);
  });

  it("is rendered again once a translation of the brief is published: its sections name the outcome in French", async () => {
    await page(second, `/fr/briefs/${slug}/v/1`);
    const before = await stored(briefId, "fr");
    await markStored(briefId, "fr");
    expect(await page(first, `/fr/briefs/${slug}/v/1`)).toContain("Read from the store.");
    const v1 = (await database.query("select id from brief_versions where brief_id = $1 and number = 1", [briefId])).rows[0].id as string;
    const source = ((await clients.translator!.request("GET", `/api/translations/${v1}/fr`)).body.translation as Translation).fields;
    const outcome = source.find((field) => field.name === "outcome:0")!;
    const targets = Object.fromEntries(source.map((field) => [field.name, field.kind === "grammar" ? "" : `FR ${field.text}`]));
    expect((await clients.translator!.request("PUT", `/api/translations/${v1}/fr`, { json: { fields: targets } })).status).toBe(200);
    expect((await clients.translator!.request("POST", `/api/translations/${v1}/fr/ready`)).status).toBe(200);
    expect((await clients.editor!.request("POST", `/api/translations/${v1}/fr/publish`)).status).toBe(200);
    // The other process never had this page in memory; the first did, and hears of the change.
    for (const server of [second, first]) {
      const translated = await page(server, `/fr/briefs/${slug}/v/1`);
      expect(translated).not.toContain("Read from the store.");
      expect(/<section[^>]*data-testid="outcome"[\s\S]*?<\/h2>/.exec(translated)?.[0]).toContain(`FR ${outcome.text}`);
    }
    expect((await stored(briefId, "fr"))?.state).not.toBe(before?.state);
  });

  it("sends the browser its sections once: in the page, and with the data only on a client-side navigation", async () => {
    const html = await page(first, `/briefs/${slug}/v/1`);
    const data = /<script id="vike_pageContext"[^>]*>([\s\S]*?)<\/script>/.exec(html)![1]!;
    expect(data).not.toContain("outcomesHtml");
    expect(data).not.toContain("data-testid");
    const navigation = await fetch(`${first.url}/briefs/${slug}/v/1/index.pageContext.json`);
    expect(navigation.status).toBe(200);
    const json = await navigation.text();
    expect(json).toContain("outcomesHtml");
    expect(json).toContain('data-testid=\\"outcome\\"');
  });
});
