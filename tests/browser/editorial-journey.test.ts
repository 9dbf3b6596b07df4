// The whole editorial path in a real browser, through the desk only: the analyst uploads, names the
// options and rates every comparison with the bulk actions and submits; the editor writes the texts,
// reads the checklist, approves and publishes; a correction goes out with its public note; then the
// brief is withdrawn. The public pages follow each step.
import path from "node:path";
import type { Browser, Page } from "playwright-core";
import { expect, it } from "vitest";
import { en } from "../support/words";
import { keepScreenshot, signedIn as signedInAt, withServerAndBrowser } from "../support/browser";

const hasselblad = path.resolve(__dirname, "../fixtures/reference/hasselblad1998.csv");
// One title per run, so that a database reused across runs holds one brief of this name.
const title = `Editorial journey (browser test ${Date.now().toString(36)})`;
const setup = withServerAndBrowser();
const signedIn = (browser: Browser, email: string) => signedInAt(browser, setup.server.url, email);

const openBrief = async (page: Page) => {
  // The brief's screen in the desk, not its public page, which the press room on the same screen links once it is released.
  await page.locator('a[href^="/desk/briefs/"]', { hasText: title }).first().click();
  await page.locator("h1", { hasText: title }).waitFor();
};

it("goes upload → bulk rating → approval → publication → correction with a note → withdrawal", async () => {
  const analyst = await signedIn(setup.browser, "analyst@fairweigh.example");
  const { page } = analyst;
  const briefForm = page.getByRole("form", { name: en.desk.newBrief });
  await briefForm.getByLabel(en.desk.field.title).fill(title);
  await briefForm.getByLabel(en.desk.field.topic).fill("Smoking");
  await briefForm.getByLabel(en.desk.field.condition).fill("Tobacco dependence");
  await briefForm.getByLabel(en.desk.field.population).fill("Adults who smoke");
  await Promise.all([page.waitForURL(/\/desk\/briefs\/[0-9a-f-]+$/), briefForm.getByRole("button", { name: en.desk.create }).click()]);
  const briefUrl = page.url();
  const outcomeForm = page.getByRole("form", { name: en.desk.addOutcome });
  await outcomeForm.getByLabel(en.desk.field.name).fill("Quit smoking");
  await outcomeForm.getByLabel(en.desk.field.reference).fill("no_contact");
  await outcomeForm.getByLabel(en.desk.field.baselineRisk).fill("0.07");
  await outcomeForm.getByRole("button", { name: en.desk.addOutcome }).click();
  const panel = page.getByRole("region", { name: "Quit smoking" });
  await panel.locator("input[type=file]").setInputFiles(hasselblad);
  await panel.getByRole("button", { name: en.desk.uploadSubmit }).click();
  await panel.getByRole("status").waitFor();
  // Names for readers: the labels as they are are accepted as names here.
  const names = page.getByRole("form", { name: en.desk.treatmentNames });
  await names.getByLabel(`${en.desk.displayName}: no_contact`).fill("No contact");
  await names.getByRole("button", { name: en.desk.saveNames }).click();
  await names.getByRole("status").waitFor();

  // Every comparison rated with two bulk actions: the direct evidence, then the suggestions.
  await panel.getByRole("link", { name: en.desk.results }).click();
  await page.getByRole("link", { name: en.desk.certainty }).click();
  const bulk = page.getByTestId("bulk");
  await bulk.getByRole("button", { name: en.desk.bulk.selectAll }).click();
  await bulk.getByRole("button", { name: /^Apply to \d+ pairs? with direct evidence$/ }).click();
  await bulk.getByRole("status").waitFor();
  await bulk.getByRole("button", { name: en.desk.bulk.selectAll }).click();
  await bulk.getByRole("button", { name: /^Accept the suggestions/ }).click();
  await page.getByTestId("pending-count").filter({ hasText: en.desk.allJudged }).waitFor();
  await keepScreenshot(page, "editorial-1-analyst-rated");

  await page.goto(briefUrl);
  const release = page.getByTestId("release");
  await release.getByRole("button", { name: en.desk.release.submit }).click();
  await release.getByTestId("review-history").getByText("Submitted by Demo analyst").waitFor();

  const editor = await signedIn(setup.browser, "editor@fairweigh.example");
  await openBrief(editor.page);
  const texts = editor.page.getByRole("form", { name: en.desk.texts });
  await texts.getByLabel(en.desk.shortTake).fill("Counselling probably helps people stop smoking (test data).");
  await texts.getByLabel(en.desk.laySummary).fill("A test summary in plain words.");
  await texts.getByRole("button", { name: en.desk.saveTexts }).click();
  await texts.getByRole("status").waitFor();
  // The texts changed the draft after its submission: the analyst submits it again.
  await analyst.page.reload();
  await analyst.page.getByTestId("release").getByRole("button", { name: en.desk.release.recall }).click();
  await analyst.page.getByTestId("release").getByRole("button", { name: en.desk.release.submit }).click();
  await analyst.page.getByTestId("release").getByTestId("review-history").getByText("Recalled by Demo analyst").waitFor();
  // The recall shows before the new submission is saved: wait for the second submission itself.
  const submissions = analyst.page.getByTestId("release").getByTestId("review-history").getByText("Submitted by Demo analyst");
  await expect.poll(() => submissions.count(), { timeout: 15_000 }).toBe(2);

  await editor.page.reload();
  const panelOfEditor = editor.page.getByTestId("release");
  await panelOfEditor.getByTestId("readiness").getByText(en.readiness.ready).waitFor();
  await panelOfEditor.getByLabel(en.readiness.acknowledge).check();
  await panelOfEditor.getByRole("button", { name: en.desk.release.approve }).click();
  await panelOfEditor.getByText(en.desk.release.approval.current).waitFor();
  await panelOfEditor.getByRole("button", { name: en.desk.release.publish }).click();
  const published = panelOfEditor.getByRole("link", { name: /\/briefs\/.+\/v\/1$/ });
  await published.waitFor();
  await keepScreenshot(editor.page, "editorial-2-editor-published");
  const versionPath = (await published.getAttribute("href"))!;
  expect((await fetch(`${setup.server.url}${versionPath}`)).status).toBe(200);

  // A correction: the editor changes the short take, the analyst submits, the editor approves and publishes with a note.
  await texts.getByLabel(en.desk.shortTake).fill("Counselling probably helps people stop smoking (test data, corrected).");
  await texts.getByRole("button", { name: en.desk.saveTexts }).click();
  await texts.getByRole("status").waitFor();
  await analyst.page.reload();
  await analyst.page.getByTestId("release").getByRole("button", { name: en.desk.release.submit }).click();
  await expect.poll(() => submissions.count(), { timeout: 15_000 }).toBe(3);
  await editor.page.reload();
  await panelOfEditor.getByLabel(en.readiness.acknowledge).check();
  await panelOfEditor.getByRole("button", { name: en.desk.release.approve }).click();
  await panelOfEditor.getByText(en.desk.release.approval.current).waitFor();
  await panelOfEditor.getByLabel(en.desk.release.note).fill("The short take now says the data are test data.");
  await panelOfEditor.getByRole("button", { name: en.desk.release.correct }).click();
  await panelOfEditor.getByRole("link", { name: /\/v\/2$/ }).waitFor();
  await keepScreenshot(editor.page, "editorial-3-editor-corrected");
  const oldVersion = await (await fetch(`${setup.server.url}${versionPath}`)).text();
  expect(oldVersion).toContain("The short take now says the data are test data.");

  // Withdrawal, with its public reason.
  await panelOfEditor.getByText(en.desk.release.withdraw).click();
  await panelOfEditor.getByLabel(en.desk.release.withdrawReason).fill("A trial in the test data was retracted.");
  await panelOfEditor.getByRole("button", { name: en.desk.release.withdrawButton }).click();
  await editor.page.getByText(en.desk.status.withdrawn, { exact: false }).first().waitFor();
  await keepScreenshot(editor.page, "editorial-4-editor-withdrawn");
  // A cached page learns of the withdrawal within the two seconds its state is remembered (decision record 0010).
  await expect.poll(async () => (await fetch(`${setup.server.url}${versionPath}`)).status, { timeout: 5000 }).toBe(410);
  expect(await (await fetch(`${setup.server.url}${versionPath}`)).text()).toContain("A trial in the test data was retracted.");

  expect(analyst.errors).toEqual([]);
  expect(editor.errors).toEqual([]);
  await analyst.close();
  await editor.close();
});
