// The languages in Debian's Chromium: the Arabic brief mirrored at phone and desktop widths (with
// screenshots in test-results/screenshots/ to look at), axe-core on the Arabic and Spanish pages, the
// language switcher, and a translator's whole path from the queue to a published Spanish summary.
import { describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { keepScreenshot, seriousViolations, signedIn, withServerAndBrowser } from "../support/browser";
import { publishedBrief } from "../support/briefs";
import { testDatabaseUrl } from "../support/app";
import { connectDatabase } from "#db/client";
import { ensurePerson } from "#db/people";
import { demoPassword } from "#workflows/seed";
import { demoClient } from "../support/client";

const setup = withServerAndBrowser();
const small = slugify(demoBriefs()[0]!.title);

describe("right to left", () => {
  it.each([
    ["phone", 390],
    ["desktop", 1280],
  ])("the Arabic brief at %s width (%i px) is mirrored, fits, and keeps its plot readable", async (name, width) => {
    const context = await setup.browser.newContext({ viewport: { width, height: 900 } });
    const page = await context.newPage();
    const errors: string[] = [];
    page.on("pageerror", (error) => errors.push(error.message));
    await page.goto(`${setup.server.url}/ar/briefs/${small}`);
    expect(await page.evaluate(() => getComputedStyle(document.body).direction)).toBe("rtl");
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
    // The title starts at the right: its right edge is at the content's right edge.
    const title = (await page.locator("h1").boundingBox())!;
    const main = (await page.locator("main").boundingBox())!;
    expect(main.x + main.width - (title.x + title.width)).toBeLessThan(40);
    // The forest plot's labels start from the right and do not overlap one another: on a desktop they
    // stand to the right of its axis; on a phone each stands above its interval, flush right.
    const phone = width < 640;
    const plot = page.getByTestId(phone ? "forest-plot-narrow" : "forest-plot").first();
    await plot.scrollIntoViewIfNeeded();
    const geometry = await plot.evaluate((svg) => {
      const labels = [...svg.querySelectorAll("g > g > text[font-size='13'], g > g > text[font-size='14']")].map((t) => t.getBoundingClientRect());
      const axis = svg.querySelector("line[stroke='#d9d1c5']")!.getBoundingClientRect();
      return { labels: labels.map((r) => ({ left: r.left, right: r.right, top: r.top, bottom: r.bottom })), axisRight: axis.right, svgRight: svg.getBoundingClientRect().right };
    });
    expect(geometry.labels.length).toBeGreaterThan(3);
    for (const label of geometry.labels) {
      if (phone) expect(geometry.axisRight - label.right).toBeLessThan(2);
      else expect(label.left).toBeGreaterThanOrEqual(geometry.axisRight - 1);
      expect(label.right).toBeLessThanOrEqual(geometry.svgRight + 1);
    }
    for (let i = 1; i < geometry.labels.length; i++) expect(geometry.labels[i]!.top).toBeGreaterThanOrEqual(geometry.labels[i - 1]!.bottom - 1);
    await keepScreenshot(page, `brief-ar-${name}`);
    expect(errors).toEqual([]);
    await context.close();
  });
});

describe("accessibility in other languages", () => {
  it.each([
    ["Arabic brief", `/ar/briefs/${small}`],
    ["Arabic comparison", `/ar/briefs/${small}/v/1/compare/combined/usual_care`],
    ["Spanish brief", `/es/briefs/${small}`],
  ])("axe-core finds no serious or critical violation on the %s", async (_kind, url) => {
    expect(await seriousViolations(setup.browser, setup.server.url + url)).toEqual([]);
  });
});

describe("the language switcher", () => {
  it("keeps the page, and the choice holds on the next visit", async () => {
    const context = await setup.browser.newContext({ locale: "en-GB" });
    const page = await context.newPage();
    await page.goto(`${setup.server.url}/briefs/${small}`);
    await Promise.all([page.waitForURL(`${setup.server.url}/fr/briefs/${small}`), page.getByRole("link", { name: "Français" }).click()]);
    expect(await page.locator("html").getAttribute("lang")).toBe("fr");
    await page.goto(`${setup.server.url}/`);
    expect(page.url()).toBe(`${setup.server.url}/fr`);
    await Promise.all([page.waitForURL(`${setup.server.url}/`), page.getByRole("link", { name: "English" }).click()]);
    expect(await page.locator("h1").textContent()).toContain("Network meta-analyses");
    await context.close();
  });
});

describe("a translator's path", () => {
  it("from the queue to a published Spanish summary", async () => {
    const analyst = await demoClient(setup.server.url, "analyst");
    const editorApi = await demoClient(setup.server.url, "editor");
    const title = `Brief for the translation desk ${Date.now()}`;
    const { slug } = await publishedBrief(analyst, editorApi, title);

    const translator = await signedIn(setup.browser, setup.server.url, "translator@fairweigh.example");
    const page = translator.page;
    await page.getByRole("link", { name: "Translation desk", exact: true }).click();
    const queue = page.getByTestId("queue-es");
    await queue.getByRole("link", { name: new RegExp(title) }).click();
    await page.getByTestId("field-title").locator("input").fill(`Resumen para el escritorio de traducción ${title.slice(-13)}`);
    for (const field of await page.locator("fieldset[data-testid^=field-]").all()) {
      // A treatment's gender and number is a choice, optional: left as it is.
      if ((await field.locator("input, textarea").count()) === 0) continue;
      const input = field.locator("input, textarea").first();
      if ((await input.inputValue()) === "") await input.fill(`ES ${(await field.locator("legend").textContent())?.trim()}`);
    }
    await page.getByTestId("field-summary").locator("textarea").fill("Resumen de prueba: el asesoramiento **podría** ayudar a dejar de fumar.");
    await page.getByTestId("field-summary").getByRole("button", { name: "Preview" }).click();
    await expect.poll(() => page.getByTestId("translation-preview").innerHTML()).toContain("<strong>podría</strong>");
    await page.getByRole("button", { name: "Save the draft" }).click();
    await expect.poll(() => page.getByTestId("translation-status").textContent()).toContain("Draft");
    await page.getByRole("button", { name: "Mark ready" }).click();
    await expect.poll(() => page.getByTestId("translation-status").textContent()).toContain("Ready for an editor");
    // A translator has no publish button; the server would refuse it too (tests/integration/languages.test.ts).
    expect(await page.getByRole("button", { name: "Publish this translation" }).count()).toBe(0);
    await keepScreenshot(page, "translation-desk-ready");
    expect(translator.errors).toEqual([]);
    const address = page.url();
    await translator.close();

    const editor = await signedIn(setup.browser, setup.server.url, "editor@fairweigh.example");
    await editor.page.goto(address);
    await editor.page.getByRole("button", { name: "Publish this translation" }).click();
    await expect.poll(() => editor.page.getByTestId("translation-status").textContent()).toContain("Published");
    await editor.close();

    const reader = await setup.browser.newContext();
    const spanish = await reader.newPage();
    await spanish.goto(`${setup.server.url}/es/briefs/${slug}`);
    expect(await spanish.locator("h1").textContent()).toContain("Resumen para el escritorio de traducción");
    expect(await spanish.getByTestId("translation-notice").textContent()).toMatch(/Esta traducción se publicó el/);
    expect(await spanish.locator("#summary + div").innerHTML()).toContain("<strong>podría</strong>");
    await keepScreenshot(spanish, "translated-brief-es");
    await reader.close();
  });
});

describe("the desk in the signed-in person's language", () => {
  it("switches to Arabic when the account asks for it, on every screen", async () => {
    // A person of this test's own: other files sign in as the demo accounts and read the desk in English.
    const email = `ar-${Date.now().toString(36)}@example.org`;
    const connection = connectDatabase(testDatabaseUrl());
    await ensurePerson(connection.db, { email, displayName: "Layla Haddad", password: demoPassword, roles: ["translator"], translationLocales: ["ar"] }, null);
    await connection.close();

    const translator = await signedIn(setup.browser, setup.server.url, email);
    const { page } = translator;
    await page.getByRole("link", { name: "Your account" }).click();
    const account = page.getByRole("form", { name: "Your account" });
    await account.getByLabel("Language of the desk").selectOption("ar");
    await account.getByRole("button", { name: "Save" }).click();
    // The words change, not only the direction: the account screen and the bar above it in Arabic.
    await page.getByRole("heading", { name: "حسابك" }).waitFor();
    expect(await page.evaluate(() => [document.documentElement.lang, document.documentElement.dir])).toEqual(["ar", "rtl"]);
    expect(await page.getByTestId("desk-person").textContent()).toContain("تسجيل الخروج");
    // Another screen, reached through the desk's own links, speaks Arabic too.
    await page.goto(`${setup.server.url}/desk`);
    await page.getByRole("link", { name: "مكتب الترجمة" }).click();
    await page.getByRole("heading", { name: "مكتب الترجمة" }).waitFor();
    await keepScreenshot(page, "desk-in-arabic");
    expect(translator.errors).toEqual([]);
    await translator.close();
  });
});
