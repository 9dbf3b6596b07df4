// Comparisons that travel, in Chromium: the card framed by another site's page at 320 and 720 px,
// sized by its own postMessage; and the editor's plain-language check answering as they write.
import { createServer, type Server } from "node:http";
import type { AddressInfo } from "node:net";
import { afterAll, beforeAll, expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { keepScreenshot, signedIn, withServerAndBrowser } from "../support/browser";
import { en } from "../support/words";

const setup = withServerAndBrowser();
const comparison = `/briefs/${slugify(demoBriefs()[0]!.title)}/v/1/compare/combined/usual_care`;

// Another site: its own origin, framing the card as the embed code on the comparison page does.
let host: Server;
let hostUrl = "";
beforeAll(async () => {
  host = createServer((_req, res) => {
    const card = `${setup.server.url}/embed${comparison}`;
    res.setHeader("Content-Type", "text/html; charset=utf-8");
    res.end(`<!doctype html><html><body style="margin:16px;display:flex;gap:24px;align-items:flex-start;background:#e8e8e8">
<iframe id="narrow" src="${card}" title="narrow" width="320" height="150" style="border:0"></iframe>
<iframe id="wide" src="${card}" title="wide" width="720" height="150" style="border:0"></iframe>
<script>addEventListener("message",function(e){if(e.origin!=="${setup.server.url}"||!e.data||e.data.type!=="fairweigh:embed-height")return;document.querySelectorAll("iframe").forEach(function(f){if(f.contentWindow===e.source)f.style.height=e.data.height+"px"})});</script>
</body></html>`);
  });
  await new Promise<void>((resolve) => host.listen(0, "127.0.0.1", resolve));
  hostUrl = `http://localhost:${(host.address() as AddressInfo).port}/`;
});
afterAll(() => new Promise<void>((resolve) => host.close(() => resolve())));

it("shows the card framed by another site at 320 and 720 px, each as tall as its content", async () => {
  const page = await (await setup.browser.newContext({ viewport: { width: 1140, height: 900 } })).newPage();
  const errors: string[] = [];
  page.on("pageerror", (error) => errors.push(error.message));
  await page.goto(hostUrl);
  for (const id of ["narrow", "wide"]) {
    const frame = page.frameLocator(`#${id}`);
    await expect(frame.getByTestId("embed-card").textContent()).resolves.toContain("The evidence is very uncertain");
    // The card told the page its height: more than the 150 px it started with, and nothing to scroll inside.
    await page.waitForFunction((which) => Number.parseFloat((document.getElementById(which) as HTMLIFrameElement).style.height) > 150, id);
  }
  const heights = await page.evaluate(() => ["narrow", "wide"].map((id) => Number.parseFloat((document.getElementById(id) as HTMLIFrameElement).style.height)));
  // The narrow card wraps into more lines than the wide one.
  expect(heights[0]!).toBeGreaterThan(heights[1]!);
  for (const [id, width] of [["narrow", 320], ["wide", 720]] as const) {
    const overflow = await page.frameLocator(`#${id}`).locator("html").evaluate((html) => html.scrollWidth - html.clientWidth);
    expect(overflow, `${id} (${width} px) scrolls sideways`).toBe(0);
  }
  // The people of the pictograph where the card has room for them (720 px), not at 320 px.
  await expect(page.frameLocator("#wide").getByTestId("embed-pictograph").first().isVisible()).resolves.toBe(true);
  await expect(page.frameLocator("#narrow").getByTestId("embed-pictograph").first().isVisible()).resolves.toBe(false);
  await keepScreenshot(page, "embed-320-720");
  expect(errors).toEqual([]);
});

it("the editor's reading-ease figure rises when a long sentence is shortened", async () => {
  const { page, errors, close } = await signedIn(setup.browser, setup.server.url, "editor@fairweigh.example");
  // The brief's screen in the desk, not the link to its public page that the desk also shows.
  await page.locator('a[href^="/desk/briefs/"]', { hasText: demoBriefs()[0]!.title }).first().click();
  const form = page.getByRole("form", { name: en.desk.texts });
  const summary = form.getByLabel(en.desk.laySummary);
  await summary.fill(
    "The network meta-analysis of the randomised controlled trials that were identified suggests that scheduled bright-light sessions combined with planned naps were statistically significant in improving the sleep of the participating night-shift workers.",
  );
  const score = form.getByTestId("readability-score").first();
  const before = Number(/-?\d+/.exec((await score.textContent()) ?? "")![0]);
  await expect(form.getByTestId("jargon").first().textContent()).resolves.toContain("statistically significant");
  await expect(form.getByTestId("readability").first().textContent()).resolves.toContain("Flesch Reading Ease");
  await keepScreenshot(page, "readability-long");
  await summary.fill("Light sessions and planned naps may help night workers sleep. The trials were small.");
  await expect.poll(async () => Number(/-?\d+/.exec((await score.textContent()) ?? "")![0])).toBeGreaterThan(before);
  await keepScreenshot(page, "readability-short");
  expect(errors).toEqual([]);
  await close();
});
