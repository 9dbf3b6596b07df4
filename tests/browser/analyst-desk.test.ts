// The analyst's path in a real browser: sign in, create a brief, add an outcome, upload a file, see the results.
import path from "node:path";
import { expect, it } from "vitest";
import { en } from "../support/words";
import { demoPassword } from "#workflows/seed";
import { withServerAndBrowser } from "../support/browser";
import { draftBrief } from "../support/briefs";
import { demoClient } from "../support/client";

const hasselblad = path.resolve(__dirname, "../fixtures/reference/hasselblad1998.csv");

const setup = withServerAndBrowser();

it("goes from a CSV file to a forest plot and a certainty judgement, with a validation report for a broken file", async () => {
  const page = await (await setup.browser.newContext()).newPage();
  const errors: string[] = [];
  page.on("pageerror", (error) => errors.push(error.message));

  await page.goto(`${setup.server.url}/sign-in`);
  await page.fill("input[name=email]", "analyst@fairweigh.example");
  await page.fill("input[name=password]", demoPassword);
  await Promise.all([page.waitForURL(`${setup.server.url}/desk`), page.click("button[type=submit]")]);

  const briefForm = page.getByRole("form", { name: en.desk.newBrief });
  await briefForm.getByLabel(en.desk.field.title).fill("Support to stop smoking (browser test)");
  await briefForm.getByLabel(en.desk.field.topic).fill("Smoking");
  await briefForm.getByLabel(en.desk.field.condition).fill("Tobacco dependence");
  await briefForm.getByLabel(en.desk.field.population).fill("Adults who smoke");
  await Promise.all([page.waitForURL(/\/desk\/briefs\/[0-9a-f-]+$/), briefForm.getByRole("button", { name: en.desk.create }).click()]);
  // The desk navigates without reloading: wait for the brief's own heading.
  await page.locator("h1", { hasText: "Support to stop smoking (browser test)" }).waitFor();

  const outcomeForm = page.getByRole("form", { name: en.desk.addOutcome });
  await outcomeForm.getByLabel(en.desk.field.name).fill("Quit smoking");
  await outcomeForm.getByLabel(en.desk.field.reference).fill("no_contact");
  await outcomeForm.getByRole("button", { name: en.desk.addOutcome }).click();
  const panel = page.getByRole("region", { name: "Quit smoking" });
  await expect(panel.getByTestId("analysis-state").textContent()).resolves.toContain(en.desk.analysis["no-data"]);

  const broken = { name: "broken.csv", mimeType: "text/csv", buffer: Buffer.from("study,treatment,events,total\nS1,a,12,10\nS1,b,1,10\n") };
  await panel.locator("input[type=file]").setInputFiles(broken);
  await panel.getByRole("button", { name: en.desk.uploadSubmit }).click();
  await expect(panel.getByTestId("validation-report").textContent()).resolves.toContain("Line 2, column events: The events (12) exceed the total (10).");

  await panel.locator("input[type=file]").setInputFiles(hasselblad);
  await panel.getByRole("button", { name: en.desk.uploadSubmit }).click();
  await expect(panel.getByRole("status").textContent()).resolves.toContain("24 studies, 4 treatments");

  await panel.getByRole("link", { name: en.desk.results }).click();
  await page.getByTestId("forest-plot").waitFor();
  const forest = await page.getByTestId("forest-plot").textContent();
  for (const treatment of ["grp_counseling", "ind_counseling", "self_help"]) expect(forest).toContain(treatment);
  expect(await page.textContent("main")).toContain("Heterogeneity is substantial");

  await page.getByRole("link", { name: en.desk.certainty }).click();
  await expect(page.getByTestId("pending-count").textContent()).resolves.toBe("6 comparisons still need a judgement.");
  const row = page.getByRole("row", { name: /grp_counseling vs ind_counseling/ });
  await row.getByRole("button", { name: en.desk.judge }).click();
  const form = page.getByRole("form", { name: `${en.desk.judge}: grp_counseling vs ind_counseling` });
  await form.getByLabel(en.desk.domain.riskOfBias, { exact: true }).selectOption("1");
  await form.getByLabel(`${en.desk.domain.riskOfBias}: ${en.desk.reason}`).fill("Allocation was not concealed in most trials");
  await form.getByRole("button", { name: en.desk.saveJudgement }).click();
  await form.getByRole("status").waitFor();
  // The table refreshes after the save; wait for the new rating rather than reading it at once.
  await row.locator("td").filter({ hasText: en.certainty.rating.moderate }).first().waitFor();
  expect(errors).toEqual([]);
});

it("lets an editor write the lay summary with a sanitised preview", async () => {
  // A brief of its own, made through the API as an analyst would: this test needs no other before it.
  await draftBrief(await demoClient(setup.server.url, "analyst"), "Texts to preview (browser test)");
  const context = await setup.browser.newContext();
  const page = await context.newPage();
  await page.goto(`${setup.server.url}/sign-in`);
  await page.fill("input[name=email]", "editor@fairweigh.example");
  await page.fill("input[name=password]", demoPassword);
  await Promise.all([page.waitForURL(`${setup.server.url}/desk`), page.click("button[type=submit]")]);
  await page.getByRole("link", { name: "Texts to preview (browser test)" }).click();
  const form = page.getByRole("form", { name: en.desk.texts });
  await form.getByLabel(en.desk.laySummary).fill("Group counselling **probably** helps. <script>window.hacked = 1</script>");
  await form.getByRole("button", { name: en.desk.preview }).click();
  const preview = page.getByTestId("texts-preview");
  await preview.locator("strong", { hasText: "probably" }).waitFor();
  expect(await preview.innerHTML()).not.toContain("<script");
  await form.getByRole("button", { name: en.desk.saveTexts }).click();
  await form.getByRole("status").waitFor();
  await context.close();
});
