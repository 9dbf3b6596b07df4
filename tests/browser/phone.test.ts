// Every public page type on a phone (390 px) in the four languages: the document is no wider than the
// screen, and every mark of every chart shown lies inside its chart. Screenshots are kept.
import { describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { keepScreenshot, withServerAndBrowser } from "../support/browser";

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
};
const width = 390;

describe.each(["en", "es", "fr", "ar"])("on a phone, in %s", (locale) => {
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
    await keepScreenshot(page, `phone-${locale}-${kind.replace(" ", "-")}`);
    await context.close();
  });
});
