// The pictograph beyond a comparison's page, against the production build: on a brief's page, each
// option of a binary outcome as 100 people beside the reference's (folded, up to 8 options), and in
// the embed card of a comparison, with the numbers per 1000 said in words in each language.
import { describe, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { withProductionServer } from "../support/production-server";

const { server } = withProductionServer();
const [small, large] = demoBriefs().map((brief) => slugify(brief.title)) as [string, string];
const get = async (path: string) => (await fetch(`${server.url}${path}`)).text();

// Written out by hand from the demo brief's results (the same figures as the comparison page's test).
const english =
  "Good sleep on most days at 4 weeks, out of 1000 people: 300 with Usual care, and 419 with Timed bright-light sessions (95% confidence interval 353 to 488). Drawn as 100 people, each dot standing for 10 of 1000.";
const arabic =
  "نوم جيد في معظم الأيام بعد 4 أسابيع، من كل 1000 شخص: 300 مع الرعاية المعتادة، و419 مع جلسات ضوء ساطع في مواعيد محددة (فترة الثقة 95٪ من 353 إلى 488). مرسوم على هيئة 100 شخص، كل نقطة تمثل 10 من 1000.";

describe("each option as 100 people on a brief's page", () => {
  it("offers the binary outcome's options beside the reference, each saying its numbers", async () => {
    const html = await get(`/briefs/${small}/v/1`);
    const set = html.slice(html.indexOf('data-testid="as-people"'), html.indexOf("</details>", html.indexOf('data-testid="as-people"')));
    expect(set).toContain("<summary");
    expect(set).toContain(">Each option as 100 people</summary>");
    // The reference once, then the five options, each a picture with its sentence.
    expect(set.match(/<figcaption/g)).toHaveLength(6);
    expect(set.match(/role="img"/g)).toHaveLength(5);
    expect(set).toContain(`aria-label="${english}"`);
    expect(await get(`/ar/briefs/${small}/v/1`)).toContain(`aria-label="${arabic}"`);
  });

  it("leaves it out where a wall of grids would not help: the outcome with 22 options", async () => {
    expect(await get(`/briefs/${large}/v/1`)).not.toContain('data-testid="as-people"');
  });
});

describe("the embed card of a comparison", () => {
  it("holds the pictograph with its sentence, shown when the card is wide enough", async () => {
    const card = await get(`/embed/briefs/${small}/v/1/compare/light/usual_care`);
    expect(card).toContain(`<div class="people" role="img" aria-label="${english}" data-testid="embed-pictograph">`);
    expect(card).toContain("@media (min-width:480px){.people{display:block}}");
    expect(await get(`/ar/embed/briefs/${small}/v/1/compare/light/usual_care`)).toContain(`aria-label="${arabic}"`);
  });
});
