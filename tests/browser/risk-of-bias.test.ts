// Risk of bias and the studies that matter (METHODS.md §13) in a real browser: the analyst sees the
// suggestion beside the risk-of-bias domain and confirms it; a reader finds a comparison's most
// important studies and an outcome's evidence by risk of bias. Screenshots in test-results/screenshots/.
import path from "node:path";
import { expect, it } from "vitest";
import { slugify } from "#core/publication/slug";
import { demoBriefs } from "#workflows/demo-briefs";
import { en } from "../support/words";
import { keepScreenshot, seriousViolations, signedIn, withServerAndBrowser } from "../support/browser";

const robFile = path.resolve(__dirname, "../fixtures/reference/hasselblad1998-rob.csv");
const setup = withServerAndBrowser();

it("the analyst sees the risk-of-bias shares and suggestion, and confirming it needs no reason", async () => {
  const { page, errors, close } = await signedIn(setup.browser, setup.server.url, "analyst@fairweigh.example");
  const briefForm = page.getByRole("form", { name: en.desk.newBrief });
  await briefForm.getByLabel(en.desk.field.title).fill("Judged trials, in the browser");
  await briefForm.getByLabel(en.desk.field.topic).fill("Smoking");
  await briefForm.getByLabel(en.desk.field.condition).fill("Tobacco dependence");
  await briefForm.getByLabel(en.desk.field.population).fill("Adults who smoke");
  await Promise.all([page.waitForURL(/\/desk\/briefs\/[0-9a-f-]+$/), briefForm.getByRole("button", { name: en.desk.create }).click()]);
  await page.locator("h1", { hasText: "Judged trials, in the browser" }).waitFor();
  const outcomeForm = page.getByRole("form", { name: en.desk.addOutcome });
  await outcomeForm.getByLabel(en.desk.field.name).fill("Quit smoking");
  await outcomeForm.getByLabel(en.desk.field.reference).fill("no_contact");
  await outcomeForm.getByRole("button", { name: en.desk.addOutcome }).click();
  const panel = page.getByRole("region", { name: "Quit smoking" });
  await panel.locator("input[type=file]").setInputFiles(robFile);
  await panel.getByRole("button", { name: en.desk.uploadSubmit }).click();
  await expect(panel.getByTestId("risk-of-bias-counts").textContent()).resolves.toBe("Risk of bias in the file: 12 low, 6 some concerns, 3 high, 3 not assessed.");

  await panel.getByRole("link", { name: en.desk.results }).click();
  await page.getByRole("link", { name: en.desk.certainty }).click();
  const row = page.getByRole("row", { name: /self_help vs no_contact/ });
  await row.getByRole("button", { name: en.desk.judge }).click();
  const form = page.getByRole("form", { name: `${en.desk.judge}: self_help vs no_contact` });
  // Random effects: 61.6% of the direct weight has some concerns (the reference values), so one level down is suggested and preselected.
  await expect(form.getByTestId("risk-of-bias-advice").textContent()).resolves.toContain("62% of the weight of the direct evidence comes from trials with some concerns about bias.");
  await expect(form.getByLabel(en.desk.domain.riskOfBias, { exact: true }).inputValue()).resolves.toBe("1");
  await keepScreenshot(page, "risk-of-bias-desk");
  await form.getByRole("button", { name: en.desk.saveJudgement }).click();
  await form.getByRole("status").waitFor();
  await row.locator("td").filter({ hasText: en.certainty.rating.moderate }).first().waitFor();
  expect(errors).toEqual([]);
  await close();
});

it("a reader finds a comparison's most important studies and an outcome's evidence by risk of bias, without serious accessibility violations", async () => {
  const slug = slugify(demoBriefs()[0]!.title);
  const page = await (await setup.browser.newContext()).newPage();
  const comparison = `${setup.server.url}/briefs/${slug}/v/1/compare/combined/usual_care`;
  await page.goto(comparison);
  const studies = page.getByTestId("important-studies").first();
  await expect(studies.getByRole("heading").textContent()).resolves.toBe(en.compare.studies.heading);
  expect(await studies.locator("tbody tr").count()).toBeGreaterThan(0);
  await studies.scrollIntoViewIfNeeded();
  await keepScreenshot(page, "important-studies");
  await page.goto(`${setup.server.url}/briefs/${slug}/v/1`);
  const bar = page.getByTestId("risk-of-bias").first().getByRole("img");
  await expect(bar.getAttribute("aria-label")).resolves.toMatch(/^Share of participants by risk of bias: Low risk of bias \d+%/);
  expect(await seriousViolations(setup.browser, comparison)).toEqual([]);
});
