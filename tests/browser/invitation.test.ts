// An administrator invites a translator from the desk; the invitation is opened from the fake mailbox
// (a real SMTP conversation), the translator chooses a password on the link's page and signs in.
import type { Browser } from "playwright-core";
import { afterAll, beforeAll, expect, it } from "vitest";
import { en } from "../support/words";
import { startMailbox, type Mailbox } from "../../scripts/lib/mailbox";
import { keepScreenshot, launchChromium, signedIn } from "../support/browser";
import { startProductionServer, type RunningServer } from "../support/production-server";

let mailbox: Mailbox;
let server: RunningServer;
let browser: Browser;
beforeAll(async () => {
  mailbox = await startMailbox();
  server = await startProductionServer({ env: { SMTP_URL: mailbox.url, MAIL_RETRY_DELAY_SECONDS: "1" } });
  browser = await launchChromium();
});
afterAll(async () => {
  await browser?.close();
  await server?.stop();
  await mailbox?.stop();
});

it("admin invites a translator → the e-mail's link → a password → the translator is signed in", async () => {
  const email = `tr-${Date.now().toString(36)}@example.org`;
  const admin = await signedIn(browser, server.url, "admin@fairweigh.example");
  await admin.page.getByRole("link", { name: en.desk.people.link }).click();
  const form = admin.page.getByRole("form", { name: en.desk.people.invite });
  await form.getByLabel(en.desk.people.email).fill(email);
  await form.getByLabel(en.desk.people.displayName).fill("Tomás Translator");
  await form.getByLabel(en.desk.role.translator).check();
  await form.getByLabel("es", { exact: true }).check();
  await form.getByRole("button", { name: en.desk.people.send }).click();
  await admin.page.getByTestId("people").getByText(email).waitFor();
  await admin.page.getByTestId("messages").getByText(`You are invited to Fairweigh → ${email}: sent`).waitFor({ timeout: 30_000 });
  // Roles change later too: French is added to the translator's locales.
  const row = admin.page.getByTestId("people").locator("tr", { hasText: email });
  await row.getByText("Change the roles of Tomás Translator").click();
  await row.getByRole("form").getByLabel("fr", { exact: true }).check();
  await row.getByRole("button", { name: en.desk.people.save }).click();
  await row.getByText(`${en.desk.role.translator} (es, fr)`).waitFor();
  await keepScreenshot(admin.page, "invitation-1-admin-people");
  // The invitation is in the audit log, found with the action filter.
  await admin.page.goto(`${server.url}/desk/audit`);
  await admin.page.getByLabel(en.desk.audit.action).selectOption("create");
  const entry = admin.page.getByTestId("audit").locator("li", { hasText: "create · Tomás Translator" }).first();
  await entry.getByText(en.desk.audit.beforeAfter).click();
  await entry.getByText(email).waitFor();
  await keepScreenshot(admin.page, "invitation-2-admin-audit");
  expect(admin.errors).toEqual([]);
  await admin.close();

  const mail = await mailbox.waitFor(email);
  const link = /https?:\/\/\S+\/invitation\/[A-Za-z0-9_-]+/.exec(mail.text)![0];
  const context = await browser.newContext();
  const page = await context.newPage();
  await page.goto(link);
  await page.getByRole("heading", { name: en.account.choose.invitationTitle }).waitFor();
  await keepScreenshot(page, "invitation-3-choose-password");
  await page.getByLabel(en.account.choose.password).fill("four words make a password");
  await Promise.all([page.waitForURL(/\/sign-in\?done=password$/), page.getByRole("button", { name: en.account.choose.submit }).click()]);
  await page.getByText(en.signIn.done.password).waitFor();
  await page.fill("input[name=email]", email);
  await page.fill("input[name=password]", "four words make a password");
  await Promise.all([page.waitForURL(`${server.url}/desk`), page.click("button[type=submit]")]);
  await page.getByTestId("desk-person").getByText("Tomás Translator").waitFor();
  await keepScreenshot(page, "invitation-4-translator-signed-in");
  // Their own account: the time zone of their e-mails.
  await page.getByRole("link", { name: en.desk.account.link }).click();
  const account = page.getByRole("form", { name: en.desk.account.title });
  await account.getByLabel(en.desk.account.timeZone).selectOption("America/Bogota");
  await account.getByRole("button", { name: en.desk.account.save }).click();
  await account.getByText(en.desk.account.saved).waitFor();
  await keepScreenshot(page, "invitation-5-translator-account");
  await context.close();
}, 90_000);
