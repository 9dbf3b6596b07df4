// What a reader is told about the numbers, in Debian's Chromium: the comparison page's arithmetic of
// the certainty (METHODS.md §8 step 5) and the forest plot's axis, in English and Arabic; a negative
// number in Arabic reads with its minus sign before the digits. Sentences are written out by hand
// from the fictional demo brief's frozen findings.
import { describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { keepScreenshot, withServerAndBrowser } from "../support/browser";

const setup = withServerAndBrowser();
const small = slugify(demoBriefs()[0]!.title);

describe("the arithmetic of a comparison's certainty", () => {
  it("adds up on the page in English: direct, indirect through its loop, the start taken, the steps, the published rating", async () => {
    const page = await (await setup.browser.newContext({ viewport: { width: 1280, height: 1600 } })).newPage();
    await page.goto(`${setup.server.url}/briefs/${small}/v/1/compare/light/usual_care`);
    const path = page.getByTestId("certainty-path").first();
    expect((await path.getByTestId("path-direct").innerText()).split("\n").map((l) => l.trim())).toEqual(["Direct evidence", "Starts at high, as randomised trials do.", "Direct certainty: high."]);
    expect((await path.getByTestId("path-indirect").innerText()).split("\n").map((l) => l.trim())).toEqual([
      "Indirect evidence",
      "Through Light sessions with nap schedule: the lower of Timed bright-light sessions vs Light sessions with nap schedule (low) and Light sessions with nap schedule vs Usual care (low).",
      "Indirect certainty: low.",
    ]);
    expect((await path.getByTestId("path-network").innerText()).split("\n").map((l) => l.trim())).toEqual([
      "Network estimate",
      "Starts from the direct certainty: high.",
      "Imprecision: rated down 1 level.",
      "Published certainty: moderate.",
    ]);
    // The same rating stands beside the statement at the top.
    expect(await page.getByTestId("comparison-outcome").first().innerText()).toContain("Timed bright-light sessions probably increase good sleep on most days at 4 weeks compared with usual care.");
    await keepScreenshot(page, "comparison-arithmetic-en");
  });

  it("reads the same steps in Arabic", async () => {
    const page = await (await setup.browser.newContext({ viewport: { width: 1280, height: 1600 } })).newPage();
    await page.goto(`${setup.server.url}/ar/briefs/${small}/v/1/compare/light/usual_care`);
    const network = (await page.getByTestId("certainty-path").first().getByTestId("path-network").innerText()).split("\n").map((l) => l.trim());
    expect(network).toEqual(["تقدير الشبكة", "يبدأ من اليقين المباشر: مرتفع.", "عدم الدقة: خُفِّض مستوى واحدًا.", "اليقين المنشور: متوسط."]);
    await keepScreenshot(page, "comparison-arithmetic-ar");
  });
});

describe("the forest plot's axis", () => {
  it.each([
    ["en", "", ["Odds ratio (log scale)", "Favours Usual care", "Favours the option"], ["Mean difference (points)", "Favours the option", "Favours Usual care"]],
    ["ar", "/ar", ["نسبة الأرجحية (مقياس لوغاريتمي)", "لصالح الرعاية المعتادة", "لصالح الخيار"], ["فرق المتوسطات (نقاط)", "لصالح الخيار", "لصالح الرعاية المعتادة"]],
  ])("names the measure and which side favours whom, following each outcome's direction (%s)", async (locale, prefix, higherIsBetter, lowerIsBetter) => {
    const page = await (await setup.browser.newContext({ viewport: { width: 1280, height: 1600 } })).newPage();
    await page.goto(`${setup.server.url}${prefix}/briefs/${small}`);
    const axes = page.getByTestId("forest-plot");
    const axis = async (i: number) => [
      await axes.nth(i).getByTestId("forest-axis-title").textContent(),
      await axes.nth(i).getByTestId("forest-left-side").textContent(),
      await axes.nth(i).getByTestId("forest-right-side").textContent(),
    ];
    // Good sleep: higher is better, so the right side favours the option; daytime sleepiness: lower is better.
    expect(await axis(0)).toEqual(higherIsBetter);
    expect(await axis(1)).toEqual(lowerIsBetter);
    // The left-hand label stands left of the right-hand one, in Arabic too: the axis keeps its direction.
    const left = (await axes.nth(1).getByTestId("forest-left-side").boundingBox())!;
    const right = (await axes.nth(1).getByTestId("forest-right-side").boundingBox())!;
    expect(left.x + left.width).toBeLessThan(right.x);
    await keepScreenshot(page, `forest-axis-${locale}`);
  });

  it("writes a negative effect in Arabic with a true minus sign before its digits", async () => {
    const page = await (await setup.browser.newContext({ viewport: { width: 1280, height: 1600 } })).newPage();
    await page.goto(`${setup.server.url}/ar/briefs/${small}`);
    const order = await page.evaluate(() => {
      const cells = [...document.querySelectorAll("td")].filter((td) => td.textContent?.includes("\u2212"));
      for (const node of cells.flatMap((td) => [...td.childNodes].filter((n) => n.nodeType === Node.TEXT_NODE))) {
        const text = node.textContent ?? "";
        const at = text.indexOf("\u2212");
        if (at < 0 || !/\d/.test(text[at + 1] ?? "")) continue;
        const rect = (from: number) => {
          const range = document.createRange();
          range.setStart(node, from);
          range.setEnd(node, from + 1);
          return range.getBoundingClientRect();
        };
        return { text, minus: rect(at).left, digit: rect(at + 1).left, hyphen: /-\d/.test(text) };
      }
      return null;
    });
    expect(order, "a negative number in the table").not.toBeNull();
    expect(order!.hyphen).toBe(false);
    expect(order!.minus).toBeLessThan(order!.digit);
  });
});
