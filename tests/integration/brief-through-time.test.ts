// A brief through time, against the production build and the test cluster: version 1, its Spanish
// translation, a correction that rewrites one text (carried translation, "what changed" on the page,
// in changes.json, the feed and the e-mails), then withdrawal on every channel; and a version under
// embargo that translators translate before its release. docs/brief-lifecycle.md tells the same story.
import { Cite } from "@citation-js/core";
import "@citation-js/plugin-bibtex";
import "@citation-js/plugin-ris";
import { describe, expect, it } from "vitest";
import type { Translation, TranslationQueueEntry } from "#web/api/contract";
import { withTestDatabase } from "../support/app";
import { approve, draftBrief, publishedBrief } from "../support/briefs";
import { withProductionServer } from "../support/production-server";

const { server, clients } = withProductionServer(["analyst", "editor", "translator", "press"]);
const database = withTestDatabase();

const get = (address: string, headers: Record<string, string> = {}) => fetch(`${server.url}${address}`, { headers, redirect: "manual" });
const title = "Counselling through time";

/** The text of the e-mails of a kind about this brief, to one recipient, newest first. */
async function mails(kind: string, recipient: string, about: string): Promise<string[]> {
  const rows = await database.query("select text from messages where kind = $1 and recipient = $2 and text like $3 order by created_at desc", [kind, recipient, `%${about}%`]);
  return rows.rows.map((row: { text: string }) => row.text);
}

async function versionId(briefId: string, number: number): Promise<string> {
  return (await database.query("select id from brief_versions where brief_id = $1 and number = $2", [briefId, number])).rows[0].id as string;
}

async function queueEntry(versionIdOf: string): Promise<TranslationQueueEntry | undefined> {
  const queue = await clients.translator!.request("GET", "/api/translations");
  return (queue.body.versions as TranslationQueueEntry[]).find((entry) => entry.versionId === versionIdOf);
}

describe("a brief through time", () => {
  let briefId = "";
  let slug = "";

  it("version 1 is translated into Spanish and published in it", async () => {
    ({ briefId, slug } = await publishedBrief(clients.analyst!, clients.editor!, title));
    const v1 = await versionId(briefId, 1);
    const source = ((await clients.translator!.request("GET", `/api/translations/${v1}/es`)).body.translation as Translation).fields;
    const targets = Object.fromEntries(source.map((field) => [field.name, field.kind === "grammar" ? "" : field.name === "summary" ? "Resumen: el asesoramiento podría ayudar a dejar de fumar." : `ES ${field.text}`]));
    expect((await clients.translator!.request("PUT", `/api/translations/${v1}/es`, { json: { fields: targets } })).status).toBe(200);
    expect((await clients.translator!.request("POST", `/api/translations/${v1}/es/ready`)).status).toBe(200);
    expect((await clients.editor!.request("POST", `/api/translations/${v1}/es/publish`)).status).toBe(200);
    const page = await (await get(`/es/briefs/${slug}/v/1`)).text();
    expect(page).toContain(`ES ${title}`);
    expect(page).toContain("Resumen: el asesoramiento podría ayudar a dejar de fumar.");
    expect((await queueEntry(v1))?.states.es).toBe("published");
  });

  it("a correction of one text keeps every other Spanish passage, marks the changed one, and asks for an update of just those fields", async () => {
    const current = await clients.editor!.request("GET", `/api/briefs/${briefId}`);
    const rowVersion = (current.body.brief as { rowVersion: number }).rowVersion;
    expect((await clients.editor!.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion, laySummary: "Test summary: group counselling may help people stop smoking." } })).status).toBe(200);
    await approve(clients.analyst!, clients.editor!, briefId);
    // Before publishing, the editor reads what the correction would change.
    const preview = await clients.editor!.request("GET", `/api/briefs/${briefId}/changes`);
    expect(preview.status).toBe(200);
    expect(preview.body.changes).toMatchObject({ from: 1, to: 2, texts: [{ field: "summary", name: null }], outcomes: [] });
    expect((await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: { note: "The summary names group counselling." } })).status).toBe(201);
    const v2 = await versionId(briefId, 2);

    // Spanish readers keep the title, the short take and the names; the new summary and note are in English, each marked.
    const page = await (await get(`/es/briefs/${slug}/v/2`)).text();
    expect(page).toContain(`ES ${title}`);
    expect(page).toContain("ES Test short take.");
    expect(page).not.toContain("Resumen: el asesoramiento podría ayudar");
    expect(page).toMatch(/<div lang="en" class="prose-brief[^"]*"><p>Test summary: group counselling may help people stop smoking\.<\/p>\s*<\/div>/);
    expect(page.match(/data-testid="not-translated"/g)).toHaveLength(2);
    expect(page).toContain("Algunos pasajes de esta versión cambiaron y aún no están traducidos al español");
    // Version 1 in Spanish is untouched.
    expect(await (await get(`/es/briefs/${slug}/v/1`)).text()).toContain("Resumen: el asesoramiento podría ayudar a dejar de fumar.");

    // The queue says "needs an update", with how many fields: the summary and the new correction note.
    expect(await queueEntry(v2)).toMatchObject({ states: { es: "draft", fr: "missing" }, updates: { es: 2 }, embargoed: false });
    const view = (await clients.translator!.request("GET", `/api/translations/${v2}/es`)).body.translation as Translation;
    expect(view.carriedFrom).toBe(false);
    expect(view.fields.filter((field) => field.stale).map((field) => field.name)).toEqual(["summary"]);
    expect(view.fields.find((field) => field.name === "summary")!.diff?.filter((part) => part.change === "added").map((part) => part.text.trim())).toEqual(["group"]);

    // The translator hears of it by e-mail: an update in Spanish, a new translation in French.
    const [request] = await mails("translation-request", "translator@fairweigh.example", `Version 2 of “${title}”`);
    expect(request).toContain(`Version 2 of “${title}” is released. It is waiting for your translation into French.`);
    expect(request).toContain("In Spanish, 2 passages changed and need an update. Every other passage was carried over from the last published translation, and readers see it already.");
    expect(request).toContain("What changed: 1 text rewritten.");

    // Once the translator updates the two fields and an editor publishes, the page is whole again.
    expect((await clients.translator!.request("PUT", `/api/translations/${v2}/es`, { json: { fields: { summary: "Resumen: el asesoramiento en grupo podría ayudar a dejar de fumar.", note: "El resumen nombra el asesoramiento en grupo." } } })).status).toBe(200);
    expect((await clients.translator!.request("POST", `/api/translations/${v2}/es/ready`)).status).toBe(200);
    expect((await clients.editor!.request("POST", `/api/translations/${v2}/es/publish`)).status).toBe(200);
    const whole = await (await get(`/es/briefs/${slug}/v/2`)).text();
    expect(whole).toContain("Resumen: el asesoramiento en grupo podría ayudar a dejar de fumar.");
    expect(whole).not.toContain('data-testid="not-translated"');
  });

  it("says what changed on the version page, in changes.json, in the feed and in the press alert", async () => {
    const page = await (await get(`/briefs/${slug}/v/2`)).text();
    expect(page).toContain("What changed since version 1");
    expect(page).toContain("Texts rewritten: the “What this means” passage.");
    expect(await (await get(`/es/briefs/${slug}/v/2`)).text()).toContain("Textos reescritos: el apartado «Qué significa».");

    const changes = await get(`/briefs/${slug}/v/2/changes.json`);
    expect(changes.status).toBe(200);
    expect(await changes.json()).toEqual({
      slug,
      from: 1,
      to: 2,
      tolerance: 0.1,
      texts: [{ field: "summary", before: "Test summary: counselling may help people stop smoking.", after: "Test summary: group counselling may help people stop smoking." }],
      outcomes: [],
    });
    expect((await get(`/briefs/${slug}/v/1/changes.json`)).status).toBe(404);

    const feed = await (await get("/feed.xml")).text();
    expect(feed).toContain("Correction note: The summary names group counselling. What changed: 1 text rewritten.");
    const [alert] = await mails("release-alert", "press@fairweigh.example", `“${title}” (version 2)`);
    expect(alert).toContain("What changed: 1 text rewritten.");
  });

  it("withdrawal reaches every channel: citation files, data files, lists, the sitemap, the card, oEmbed, the share image and the page", async () => {
    expect((await clients.editor!.request("POST", `/api/briefs/${briefId}/withdrawal`, { json: { reason: "A trial in the data was retracted." } })).status).toBe(200);
    const today = new Date().toISOString().slice(0, 10);

    for (const number of [1, 2]) {
      const ris = await (await get(`/briefs/${slug}/v/${number}/cite.ris`)).text();
      expect(ris).toMatch(new RegExp(`^TI {2}- WITHDRAWN: ${title}$`, "m"));
      expect(ris).toContain(`N1  - Withdrawn on ${today}. Reason: A trial in the data was retracted.`);
      const bib = await (await get(`/briefs/${slug}/v/${number}/cite.bib`)).text();
      expect(bib).toContain(`note = {Withdrawn on ${today}. Reason: A trial in the data was retracted.}`);
      const csl = (await (await get(`/briefs/${slug}/v/${number}/cite.json`)).json()) as { status: string; note: string }[];
      expect(csl[0]).toMatchObject({ status: "withdrawn", note: `Withdrawn on ${today}. Reason: A trial in the data was retracted.` });
      expect((new Cite(bib).data[0] as { title: string }).title).toBe(title);
    }
    // In the reader's language; the title cited is the version's own.
    expect(await (await get(`/es/briefs/${slug}/v/1/cite.ris`)).text()).toContain(`TI  - RETIRADO: ${title}`);

    // Data files: 410 with the reason to readers; the editors still fetch them.
    const csv = await get(`/briefs/${slug}/v/2/downloads/inputs.csv`);
    expect(csv.status).toBe(410);
    expect(await csv.text()).toContain("Reason: A trial in the data was retracted.");
    expect((await get(`/briefs/${slug}/v/2/changes.json`)).status).toBe(410);
    expect((await clients.editor!.request("GET", `/briefs/${slug}/v/2/downloads/inputs.csv`)).status).toBe(200);

    // Lists: gone from the home and topic pages and the list; a search that names it finds it, marked.
    expect(await (await get("/")).text()).not.toContain(title);
    expect(await (await get("/topics/smoking")).text()).not.toContain(title);
    expect(await (await get("/briefs")).text()).not.toContain(title);
    const search = await (await get(`/briefs?q=${encodeURIComponent("Counselling through")}`)).text();
    expect(search).toContain(title);
    expect(search).toMatch(/Withdrawn<\/span>/);
    expect(await (await get("/sitemap.xml")).text()).not.toContain(slug);

    // Card, oEmbed and share image show the withdrawal instead of the finding.
    const card = await get(`/embed/briefs/${slug}/v/2`);
    expect(card.status).toBe(410);
    expect(await card.text()).toContain("A trial in the data was retracted.");
    const oembed = await get(`/oembed?url=${encodeURIComponent(`${server.url}/briefs/${slug}/v/2`)}&format=json`);
    expect(oembed.status).toBe(200);
    expect(((await oembed.json()) as { title: string }).title).toBe(`Withdrawn: ${title}`);
    const image = await get(`/briefs/${slug}/v/2/share.png`);
    expect(image.status).toBe(200);
    expect(image.headers.get("content-type")).toBe("image/png");

    // The page: 410, the reason on top, the findings below it marked as withdrawn.
    const page = await get(`/briefs/${slug}/v/2`);
    expect(page.status).toBe(410);
    const html = await page.text();
    expect(html).toContain('data-testid="withdrawn-findings"');
    expect(html).toContain("Withdrawn: the findings below are kept as they were published, for the record. Do not rely on them.");
    expect(html).toContain("The data of a withdrawn brief are no longer offered.");
    // The reader's side-by-side says so too.
    const sideBySide = await get(`/briefs/${slug}/v/2/side-by-side?options=grp_counseling,no_contact`);
    expect(sideBySide.status).toBe(410);
    expect(await sideBySide.text()).toContain('data-testid="withdrawn-findings"');
  });
});

describe("an embargoed version", () => {
  it("is in the translators' queue, asked of them by e-mail, and its translation goes public with the release", async () => {
    const embargoTitle = "Counselling under embargo";
    const releaseAt = new Date(Date.now() + 8000);
    const { briefId, slug } = await publishedBrief(clients.analyst!, clients.editor!, embargoTitle, releaseAt.toISOString());
    const v1 = await versionId(briefId, 1);
    expect(await queueEntry(v1)).toMatchObject({ embargoed: true, states: { es: "missing" } });
    const [request] = await mails("translation-request", "translator@fairweigh.example", embargoTitle);
    expect(request).toContain(`Version 1 of “${embargoTitle}” is scheduled for release on`);
    expect(request).toContain("It is under embargo until then: do not share it.");

    const source = ((await clients.translator!.request("GET", `/api/translations/${v1}/es`)).body.translation as Translation).fields;
    const targets = Object.fromEntries(source.map((field) => [field.name, field.kind === "grammar" ? "" : `ES ${field.text}`]));
    expect((await clients.translator!.request("PUT", `/api/translations/${v1}/es`, { json: { fields: targets } })).status).toBe(200);
    expect((await clients.translator!.request("POST", `/api/translations/${v1}/es/ready`)).status).toBe(200);
    expect((await clients.editor!.request("POST", `/api/translations/${v1}/es/publish`)).status).toBe(200);

    // The press read it under embargo, told when it is released; the public does not see it yet.
    const preview = await clients.press!.request("GET", `/briefs/${slug}/v/1`, { headers: { accept: "text/html" } });
    expect(String(preview.body)).toMatch(/Version 1, embargoed until \w+ \d+, \d{4} at \d+:\d+ [AP]M UTC/);
    expect((await get(`/es/briefs/${slug}/v/1`)).status).toBe(404);

    await new Promise((resolve) => setTimeout(resolve, Math.max(0, releaseAt.getTime() - Date.now() + 500)));
    const released = await get(`/es/briefs/${slug}/v/1`);
    expect(released.status).toBe(200);
    expect(await released.text()).toContain(`ES ${embargoTitle}`);
  }, 30_000);
});

describe("the API's errors", () => {
  it("are sentences in the caller's language, with the checklist's keys kept in details", async () => {
    const spanish = await get("/api/briefs", { "accept-language": "es-ES,es;q=0.9" });
    expect(spanish.status).toBe(401);
    expect(((await spanish.json()) as { error: { message: string } }).error.message).toBe("Su sesión ha terminado: vuelva a iniciar sesión.");

    const { briefId } = await draftBrief(clients.analyst!, "Not ready to publish");
    const refused = await clients.editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: {} });
    expect(refused.status).toBe(409);
    const error = refused.body.error as { message: string; details: { key: string }[] };
    expect(error.message).not.toMatch(/readiness\.\w+/);
    expect(error.message).toContain("The short take is empty; The plain-language summary is empty");
    expect(error.details.map((item) => item.key)).toContain("readiness.noShortTake");
  });
});
