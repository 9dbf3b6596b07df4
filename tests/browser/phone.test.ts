// Every public page type on a phone (390 px, and the narrowest in use, 320 px) in the four languages:
// the document is no wider than the screen, and every mark of every chart shown lies inside its chart.
// Screenshots are kept.
import { describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { keepScreenshot, violations, withServerAndBrowser } from "../support/browser";

const setup = withServerAndBrowser();
const [small, large] = demoBriefs().map((brief) => slugify(brief.title)) as [string, string];
const pages = {
  home: "/",
  list: "/briefs",
  search: "/briefs?q=sleep",
  topic: `/topics/${slugify(demoBriefs()[0]!.topic)}`,
  brief: `/briefs/${small}`,
  "large brief": `/briefs/${large}/v/1`,
  comparison: `/briefs/${small}/v/1/compare/light/usual_care`,
  "side by side": `/briefs/${small}/v/1/side-by-side?options=light,nap_plan,drug_k`,
  glossary: "/glossary",
};
const width = 390;

describe.each(["en", "es", "fr", "ar"].flatMap((locale) => [390, 320].map((screen) => [locale, screen] as const)))("on a phone, in %s at %i px", (locale, width) => {
  it.each(Object.entries(pages))("the %s page fits the screen, and its charts hold their marks", async (kind, address) => {
    const context = await setup.browser.newContext({ viewport: { width, height: 844 } });
    const page = await context.newPage();
    // The Spanish home page is /es; every other address takes the prefix before it.
    const prefix = locale === "en" ? "" : `/${locale}`;
    await page.goto(`${setup.server.url}${prefix && address === "/" ? prefix : prefix + address}`);
    expect(await page.evaluate(() => document.documentElement.scrollWidth), "document width").toBeLessThanOrEqual(width);
    // Each visible chart: every shape and word inside the drawing's box (a pixel of rounding aside).
    const outside = await page.evaluate(() =>
      [...document.querySelectorAll<SVGSVGElement>("svg[role=img]")]
        .filter((svg) => svg.getBoundingClientRect().width > 0)
        .flatMap((svg) => {
          const box = svg.getBoundingClientRect();
          return [...svg.querySelectorAll<SVGGraphicsElement>("line, rect, circle, text")]
            .map((mark) => ({ mark, r: mark.getBoundingClientRect() }))
            .filter(({ r }) => r.width > 0 || r.height > 0)
            .filter(({ r }) => r.left < box.left - 1 || r.right > box.right + 1 || r.top < box.top - 1 || r.bottom > box.bottom + 1)
            .map(({ mark }) => `${svg.dataset.testid ?? "chart"}: ${mark.tagName} ${mark.textContent?.slice(0, 40) ?? ""}`);
        }),
    );
    expect(outside).toEqual([]);
    await keepScreenshot(page, `phone-${width}-${locale}-${kind.replaceAll(" ", "-")}`);
    await context.close();
  });
});

describe("the pictograph of a comparison", () => {
  it.each([
    [
      "en",
      "",
      "Good sleep on most days at 4 weeks, out of 1000 people: 300 with Usual care, and 419 with Timed bright-light sessions (95% confidence interval 353 to 488). Drawn as 100 people, each dot standing for 10 of 1000.",
    ],
    [
      "ar",
      "/ar",
      "نوم جيد في معظم الأيام بعد 4 أسابيع، من كل 1000 شخص: 300 مع الرعاية المعتادة، و419 مع جلسات ضوء ساطع في مواعيد محددة (فترة الثقة 95٪ من 353 إلى 488). مرسوم على هيئة 100 شخص، كل نقطة تمثل 10 من 1000.",
    ],
  ])("shows 100 people with each option and says the numbers per 1000 in words (%s)", async (locale, prefix, sentence) => {
    const context = await setup.browser.newContext({ viewport: { width, height: 844 } });
    const page = await context.newPage();
    await page.goto(`${setup.server.url}${prefix}/briefs/${small}/v/1/compare/light/usual_care`);
    const pictograph = page.getByTestId("pictograph").first();
    await expect(pictograph.getAttribute("aria-label")).resolves.toBe(sentence);
    // 30 of 100 with usual care; with the option 35 filled and 14 in the band (42 ± the interval, per 100).
    const grids = pictograph.locator("svg.w-36");
    await expect(grids.nth(0).locator("circle[fill='#1d1a17']").count()).resolves.toBe(30);
    await expect(grids.nth(1).locator("circle[fill='#1d1a17']").count()).resolves.toBe(35);
    await expect(grids.nth(1).locator("path").count()).resolves.toBe(14);
    // Filled from the side reading starts: the first dot is top left in English, top right in Arabic.
    const first = (await grids.nth(0).locator("circle").first().boundingBox())!;
    const box = (await grids.nth(0).boundingBox())!;
    expect(locale === "ar" ? box.x + box.width - (first.x + first.width) : first.x - box.x).toBeLessThan(6);
    await pictograph.screenshot({ path: `test-results/screenshots/pictograph-${locale}.png` });
    await context.close();
  });
});

describe("print", () => {
  it.each([
    ["en", ""],
    ["ar", "/ar"],
  ])("prints a comparison on at most two A4 pages, with its citation and the health caution, without navigation (%s)", async (_locale, prefix) => {
    const context = await setup.browser.newContext();
    const page = await context.newPage();
    await page.goto(`${setup.server.url}${prefix}/briefs/${small}/v/1/compare/light/usual_care`);
    await page.emulateMedia({ media: "print" });
    expect(await page.locator("header[data-site-header]").isVisible()).toBe(false);
    expect(await page.getByTestId("citation").isVisible()).toBe(true);
    expect(await page.locator("main aside").first().isVisible()).toBe(true);
    const pdf = await page.pdf({ format: "A4", printBackground: true });
    const pages = pdf.toString("latin1").match(/\/Type\s*\/Page(?![s\w])/g) ?? [];
    expect(pages.length).toBeLessThanOrEqual(2);
    await context.close();
  });
});

describe("print of a brief and of a side-by-side", () => {
  it.each([
    ["en", "", `/briefs/${small}/v/1`],
    ["ar", "/ar", `/briefs/${small}/v/1`],
    ["en", "", `/briefs/${small}/v/1/side-by-side?options=light,nap_plan,drug_k`],
    ["ar", "/ar", `/briefs/${small}/v/1/side-by-side?options=light,nap_plan,drug_k`],
  ])("prints with its citation and the health caution, without navigation or forms (%s, %s)", async (_locale, prefix, address) => {
    const context = await setup.browser.newContext();
    const page = await context.newPage();
    await page.goto(`${setup.server.url}${prefix}${address}`);
    await page.emulateMedia({ media: "print" });
    expect(await page.locator("header[data-site-header]").isVisible()).toBe(false);
    expect(await page.locator("footer[data-site-footer]").isVisible()).toBe(false);
    expect(await page.getByTestId("citation").isVisible()).toBe(true);
    expect(await page.locator("main aside").first().isVisible()).toBe(true);
    for (const form of await page.locator("main form").all()) expect(await form.isVisible()).toBe(false);
    // What is folded on the page is left off the paper; what a reader opened prints.
    const league = page.getByTestId("league");
    if (await league.count()) {
      expect(await league.first().isVisible()).toBe(false);
      await league.first().evaluate((details) => details.setAttribute("open", ""));
      expect(await league.first().isVisible()).toBe(true);
    }
    const pdf = await page.pdf({ format: "A4", printBackground: true });
    expect((pdf.toString("latin1").match(/\/Type\s*\/Page(?![s\w])/g) ?? []).length).toBeGreaterThan(0);
    await context.close();
  });
});

describe("the side-by-side form", () => {
  it("works by keyboard alone, in Arabic too, and opens the chosen options in their order", async () => {
    for (const prefix of ["", "/ar"]) {
      const context = await setup.browser.newContext({ viewport: { width, height: 844 } });
      const page = await context.newPage();
      await page.goto(`${setup.server.url}${prefix}/briefs/${small}`);
      const form = page.getByTestId("side-by-side-form");
      await form.locator("input[value=nap_plan]").focus();
      await page.keyboard.press("Space");
      await form.locator("input[value=light]").focus();
      await page.keyboard.press("Space");
      // From the last box, Tab reaches the button; Enter sends the form.
      await form.locator("input[type=checkbox]").last().focus();
      await page.keyboard.press("Tab");
      await Promise.all([page.waitForURL(/side-by-side\?options=/), page.keyboard.press("Enter")]);
      // The form sends the boxes in the page's order; the address names both, and the page shows both.
      expect(new URL(page.url()).searchParams.get("options")?.split(",").sort()).toEqual(["light", "nap_plan"]);
      await expect(page.getByTestId("side-by-side-outcome").count()).resolves.toBe(2);
      expect(await page.evaluate(() => document.documentElement.scrollWidth)).toBeLessThanOrEqual(width);
      await keepScreenshot(page, `side-by-side${prefix.replace("/", "-")}`);
      await context.close();
    }
  });
});

describe.each([1280, 390])("accessibility at %i px", (viewport) => {
  it.each(["en", "es", "fr", "ar"])("axe-core finds no WCAG 2.1 A/AA violation on any public page type in %s", async (locale) => {
    const prefix = locale === "en" ? "" : `/${locale}`;
    const found: string[] = [];
    for (const [kind, address] of Object.entries(pages)) {
      for (const line of await violations(setup.browser, `${setup.server.url}${prefix && address === "/" ? prefix : prefix + address}`, { width: viewport })) found.push(`${kind}: ${line}`);
    }
    expect(found).toEqual([]);
  }, 120_000);
});
