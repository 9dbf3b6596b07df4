// The release as its readers live it, in Debian's Chromium, with a screenshot at each step kept in
// test-results/screenshots/release-*.png to be looked at: the editor schedules a ready brief with an embargo from the
// desk; the reporter reads it in the press room before its release and, once it is out, cites one
// comparison; a member of the public finds it through search and downloads its data as CSV.
// (The analyst's upload and rating, and the editor's texts and approval, are walked through in
// editorial-journey.test.ts; here the draft is made ready through the API.)
import { readFileSync } from "node:fs";
import type { Browser } from "playwright-core";
import { expect, it } from "vitest";
import { en } from "../support/words";
import { keepScreenshot, launchChromium, signedIn as signedInAt, withServerAndBrowser } from "../support/browser";
import { analysedBrief, approve } from "../support/briefs";
import { demoClient } from "../support/client";

const setup = withServerAndBrowser();
const signedIn = (browser: Browser, email: string) => signedInAt(browser, setup.server.url, email);

// One title per run, so that a database reused across runs holds one brief of this name.
const run = Date.now().toString(36);
const title = `Counselling to stop smoking, embargoed (browser journey ${run})`;

it("editor schedules with an embargo → reporter reads it early, then cites a comparison → the public finds it and downloads the CSV", async () => {
  const analystApi = await demoClient(setup.server.url, "analyst");
  const editorApi = await demoClient(setup.server.url, "editor");
  const { briefId, slug } = await analysedBrief(analystApi, title);
  await approve(analystApi, editorApi, briefId);

  // The editor schedules the release for tomorrow, from the desk.
  const editor = await signedIn(setup.browser, "editor@fairweigh.example");
  await editor.page.goto(`${setup.server.url}/desk/briefs/${briefId}`);
  const release = editor.page.getByTestId("release");
  await release.getByLabel(en.desk.release.schedule).check();
  const tomorrow = new Date(Date.now() + 24 * 3600 * 1000);
  const local = new Date(tomorrow.getTime() - tomorrow.getTimezoneOffset() * 60_000).toISOString().slice(0, 16);
  await release.getByLabel(en.desk.release.releaseAt).fill(local);
  await release.getByRole("button", { name: en.desk.release.scheduleButton }).click();
  await release.getByLabel(en.desk.release.rescheduleTitle).waitFor();
  await keepScreenshot(editor.page, "release-1-editor-scheduled");
  expect(editor.errors).toEqual([]);
  await editor.close();

  // Before the release: the public gets nothing; the reporter finds it in the press room and reads it.
  expect((await fetch(`${setup.server.url}/briefs/${slug}/v/1`)).status).toBe(404);
  const reporter = await signedIn(setup.browser, "press@fairweigh.example");
  const entry = reporter.page.getByTestId("press-room").getByRole("link", { name: title });
  await entry.waitFor();
  await keepScreenshot(reporter.page, "release-2-reporter-press-room");
  await Promise.all([reporter.page.waitForURL(`${setup.server.url}/briefs/${slug}/v/1`), entry.click()]);
  await reporter.page.getByText("embargo", { exact: false }).first().waitFor();
  await keepScreenshot(reporter.page, "release-3-reporter-embargoed-brief");

  // The release time arrives (moved to a few seconds from now, as the editor may, rather than waiting a day).
  const soon = new Date(Date.now() + 3000).toISOString();
  expect((await editorApi.request("PUT", `/api/briefs/${briefId}/versions/1/release`, { json: { releaseAt: soon } })).status).toBe(200);
  await new Promise((resolve) => setTimeout(resolve, 3500));

  // After it: the reporter opens one comparison and takes its citation file.
  await reporter.page.goto(`${setup.server.url}/briefs/${slug}/v/1`);
  const comparison = reporter.page.getByRole("link", { name: en.brief.compareLabel.replace("{{treatment}}", "Group counselling").replace("{{comparator}}", "No contact") }).first();
  await Promise.all([reporter.page.waitForURL(/\/compare\/grp_counseling\/no_contact$/), comparison.click()]);
  await reporter.page.getByTestId("citation").waitFor();
  await keepScreenshot(reporter.page, "release-4-reporter-comparison");
  const [ris] = await Promise.all([reporter.page.waitForEvent("download"), reporter.page.getByTestId("cite").getByRole("link", { name: "RIS" }).click()]);
  const citation = readFileSync((await ris.path())!, "utf8");
  expect(citation).toContain(`Group counselling vs No contact: ${title}`);
  expect(citation).toContain(`/briefs/${slug}/v/1/compare/grp_counseling/no_contact`);
  expect(reporter.errors).toEqual([]);
  await reporter.close();

  // A member of the public, no account: search from the home page, open the brief, download the CSV.
  const browser = await launchChromium();
  try {
    const page = await (await browser.newContext({ acceptDownloads: true })).newPage();
    await page.goto(setup.server.url);
    await page.locator("#home-search").fill(`counselling embargoed ${run}`);
    await Promise.all([page.waitForURL(/\/briefs\?q=/), page.locator("#home-search").press("Enter")]);
    await keepScreenshot(page, "release-5-public-search");
    await Promise.all([page.waitForURL(`${setup.server.url}/briefs/${slug}`), page.getByRole("link", { name: title }).click()]);
    await keepScreenshot(page, "release-6-public-brief");
    const [csv] = await Promise.all([page.waitForEvent("download"), page.getByTestId("downloads").getByRole("link", { name: en.brief.download.inputs_csv }).click()]);
    const rows = readFileSync((await csv.path())!, "utf8").trim().split("\n");
    expect(rows[0]).toContain("study");
    expect(rows.length).toBeGreaterThan(20);
  } finally {
    await browser.close();
  }
}, 120_000);
