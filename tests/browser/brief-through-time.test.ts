// A corrected brief in a real browser: the reader sees "What changed since version 1" on the new
// version, in English and Arabic; the translator's queue says the Spanish translation needs an update
// and the editor opens on just those fields, with what changed; a signed-in reader's header does not
// offer to sign in. The brief is made through the API, as tests/integration/brief-through-time.test.ts does.
import { expect, it } from "vitest";
import type { Translation } from "#web/api/contract";
import { approve, publishedBrief } from "../support/briefs";
import { keepScreenshot, signedIn, withServerAndBrowser } from "../support/browser";
import { demoClient } from "../support/client";
import { en } from "../support/words";

const setup = withServerAndBrowser();
const title = `Counselling corrected (browser test ${Date.now().toString(36)})`;

it("shows what changed, the translation that needs an update, and a header that knows its reader is signed in", async () => {
  const base = setup.server.url;
  const [analyst, editor, translator] = await Promise.all(["analyst", "editor", "translator"].map((account) => demoClient(base, account)));
  const { briefId, slug } = await publishedBrief(analyst!, editor!, title);
  const v1 = (await editor!.request("GET", `/api/translations`)).body.versions as { versionId: string; slug: string }[];
  const first = v1.find((entry) => entry.slug === slug)!.versionId;
  const fields = ((await translator!.request("GET", `/api/translations/${first}/es`)).body.translation as Translation).fields;
  const targets = Object.fromEntries(fields.map((field) => [field.name, field.kind === "grammar" ? "" : `ES ${field.text}`]));
  expect((await translator!.request("PUT", `/api/translations/${first}/es`, { json: { fields: targets } })).status).toBe(200);
  expect((await translator!.request("POST", `/api/translations/${first}/es/ready`)).status).toBe(200);
  expect((await editor!.request("POST", `/api/translations/${first}/es/publish`)).status).toBe(200);
  const rowVersion = ((await editor!.request("GET", `/api/briefs/${briefId}`)).body.brief as { rowVersion: number }).rowVersion;
  expect((await editor!.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion, laySummary: "Test summary: group counselling may help people stop smoking." } })).status).toBe(200);
  await approve(analyst!, editor!, briefId);
  expect((await editor!.request("POST", `/api/briefs/${briefId}/versions`, { json: { note: "The summary names group counselling." } })).status).toBe(201);

  // The reader of version 2.
  const context = await setup.browser.newContext({ viewport: { width: 390, height: 844 } });
  const page = await context.newPage();
  await page.goto(`${base}/briefs/${slug}/v/2`);
  const changes = page.getByTestId("version-changes");
  await expect(changes.getByRole("heading").first().textContent()).resolves.toBe("What changed since version 1");
  await expect(changes.textContent()).resolves.toContain("Texts rewritten: the “What this means” passage.");
  await keepScreenshot(page, "what-changed-390-en");
  await page.goto(`${base}/ar/briefs/${slug}/v/2`);
  await expect(page.getByTestId("version-changes").getByRole("heading").first().textContent()).resolves.toBe("ما الذي تغيّر منذ الإصدار 1");
  await keepScreenshot(page, "what-changed-390-ar");
  // In Spanish the changed summary is shown in English, marked, beside the carried translation.
  await page.goto(`${base}/es/briefs/${slug}/v/2`);
  await expect(page.getByTestId("not-translated").first().textContent()).resolves.toBe("aún sin traducir");
  await keepScreenshot(page, "carried-translation-390-es");
  await context.close();

  // The translator's queue and editor.
  const desk = await signedIn(setup.browser, base, "translator@fairweigh.example");
  await desk.page.goto(`${base}/desk/translations`);
  const spanish = desk.page.getByTestId("queue-es").locator("li", { hasText: title });
  await expect(spanish.getByTestId("translation-state").textContent()).resolves.toBe("Needs an update (2 fields)");
  await spanish.getByRole("link").click();
  const needs = desk.page.getByTestId("needs-update");
  await expect(needs.locator("p").first().textContent()).resolves.toBe(
    "2 fields need an update: their source changed or they are new. Readers see every other field of this translation already.",
  );
  // Only those fields are shown at first, the summary with what changed in its source.
  await expect(desk.page.getByTestId("field-summary").isVisible()).resolves.toBe(true);
  await expect(desk.page.getByTestId("field-title").isVisible()).resolves.toBe(false);
  await expect(desk.page.getByTestId("field-summary").getByTestId("source-changed").locator("ins").textContent()).resolves.toBe("group ");
  await keepScreenshot(desk.page, "translation-needs-update");
  await needs.getByRole("button", { name: en.desk.translations.showAll }).click();
  await expect(desk.page.getByTestId("field-title").isVisible()).resolves.toBe(true);

  // A public page read by someone signed in: no "Sign in" in its header.
  // The page is the same for everyone; once it runs in the browser it reads the signed-in flag.
  await desk.page.goto(`${base}/briefs/${slug}`);
  await desk.page.locator("header nav[aria-label=Main] a", { hasText: en.site.nav.signIn }).waitFor({ state: "detached" });
  await expect(desk.page.locator("header nav[aria-label=Main]").textContent()).resolves.toBe(en.site.nav.desk);
  expect(desk.errors).toEqual([]);
  await desk.close();
}, 120_000);
