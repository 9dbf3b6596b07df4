// The public site in Debian's Chromium: every page type without JavaScript, no serious or critical
// accessibility violation (axe-core), keyboard use, and screenshots of a brief at phone and desktop
// widths (written to test-results/screenshots/ to be looked at).
import { describe, expect, it } from "vitest";
import { en } from "../support/words";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { keepScreenshot, pageErrors, seriousViolations, withServerAndBrowser } from "../support/browser";

const setup = withServerAndBrowser();
const small = slugify(demoBriefs()[0]!.title);
const large = slugify(demoBriefs()[1]!.title);

const pages = {
  home: "/",
  search: "/briefs?q=sleep",
  topic: "/topics/sleep",
  latest: `/briefs/${small}`,
  version: `/briefs/${large}/v/1`,
  comparison: `/briefs/${small}/v/1/compare/combined/usual_care`,
};

describe("with JavaScript disabled", () => {
  it.each(Object.entries(pages))("the %s page is complete in the server's HTML", async (kind, url) => {
    const context = await setup.browser.newContext({ javaScriptEnabled: false });
    const page = await context.newPage();
    const response = await page.goto(setup.server.url + url);
    expect(response?.status()).toBe(200);
    await expect(page.locator("h1").count()).resolves.toBe(1);
    const text = (await page.textContent("main")) ?? "";
    if (kind === "latest" || kind === "version") {
      expect(text).toContain(en.brief.supports);
      expect(await page.getByTestId("groups").first().isVisible()).toBe(true);
      expect(await page.getByTestId("forest-plot").first().isVisible()).toBe(true);
      expect(await page.getByTestId("network-diagram").first().isVisible()).toBe(true);
      // The explainer opens without JavaScript: it is a <details>.
      await page.getByText(en.rankScores.title).first().click();
      expect(await page.getByText(en.rankScores.caution.chance).first().isVisible()).toBe(true);
    }
    if (kind === "comparison") expect(await page.getByTestId("statement").first().textContent()).toMatch(/compared with usual care\.$/);
    if (kind === "search" || kind === "topic") expect(text).toContain("Sleeping well after night shifts");
    await context.close();
  });
});

describe("accessibility", () => {
  it.each([
    ["home", pages.home],
    ["brief", pages.latest],
    ["large brief", pages.version],
    ["comparison", pages.comparison],
  ])("axe-core finds no serious or critical violation on the %s page", async (_kind, url) => {
    expect(await seriousViolations(setup.browser, setup.server.url + url)).toEqual([]);
  });

  it("the keyboard alone reaches and opens the rank-score explainer", async () => {
    const context = await setup.browser.newContext();
    const page = await context.newPage();
    await page.goto(setup.server.url + pages.latest);
    const summary = page.locator("[data-testid=rank-scores] > summary").first();
    for (let i = 0; i < 200 && !(await summary.evaluate((el) => el === document.activeElement)); i++) await page.keyboard.press("Tab");
    expect(await summary.evaluate((el) => el === document.activeElement)).toBe(true);
    await page.keyboard.press("Enter");
    expect(await page.locator("[data-testid=rank-scores]").first().getAttribute("open")).not.toBeNull();
    await context.close();
  });
});

describe("screenshots of a brief", () => {
  it.each([
    ["phone", 390],
    ["desktop", 1280],
  ])("at %s width (%i px) the page fits without sideways scrolling", async (name, width) => {
    const context = await setup.browser.newContext({ viewport: { width, height: 900 } });
    const page = await context.newPage();
    await page.goto(setup.server.url + pages.latest);
    // Wide tables scroll inside their own box; the page itself must not.
    expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
    await keepScreenshot(page, `brief-${name}`);
    await page.emulateMedia({ media: "print" });
    await keepScreenshot(page, `brief-${name}-print`);
    expect(await page.locator("header[data-site-header]").isVisible()).toBe(false);
    expect(await page.getByTestId("citation").isVisible()).toBe(true);
    await context.close();
  });
});

describe("with JavaScript", () => {
  // The outcome sections come rendered from the server (server/web/pages/stored-brief.ts): hydration
  // must keep them, and a page reached by client-side navigation must bring its own.
  it("a brief page keeps its outcome sections through hydration, and one reached by a client-side navigation shows its own", async () => {
    const context = await setup.browser.newContext();
    const page = await context.newPage();
    const errors = pageErrors(page);
    await page.goto(`${setup.server.url}/briefs/${large}/v/1`, { waitUntil: "networkidle" });
    await expect(page.getByTestId("outcome").count()).resolves.toBe(demoBriefs()[1]!.outcomes.length);
    await page.goto(`${setup.server.url}/briefs?q=night%20shifts`, { waitUntil: "networkidle" });
    const navigation = page.waitForResponse((answer) => answer.url().endsWith("/index.pageContext.json"));
    await page.getByRole("link", { name: demoBriefs()[0]!.title, exact: true }).first().click();
    expect((await navigation).status()).toBe(200);
    await page.waitForURL(`${setup.server.url}/briefs/${small}`);
    await page.getByTestId("outcome").first().waitFor();
    await expect(page.getByTestId("outcome").count()).resolves.toBe(demoBriefs()[0]!.outcomes.length);
    await expect(page.getByTestId("forest-plot").first().isVisible()).resolves.toBe(true);
    expect(errors).toEqual([]);
    await context.close();
  });
});
