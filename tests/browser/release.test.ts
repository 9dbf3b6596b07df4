// Review and release in a real browser: the analyst submits, the editor previews, approves and
// publishes; the public page exists; the press room lists the brief for a reporter.
import type { Browser } from "playwright-core";
import { expect, it } from "vitest";
import { en } from "../support/words";
import { signedIn as signedInAt, withServerAndBrowser } from "../support/browser";
import { analysedBrief } from "../support/briefs";
import { demoClient } from "../support/client";

const setup = withServerAndBrowser();
const signedIn = (browser: Browser, email: string) => signedInAt(browser, setup.server.url, email);

it("goes from a draft through review to a public page, and a reporter sees it in the press room", async () => {
  const api = await demoClient(setup.server.url, "analyst");
  const { briefId, slug } = await analysedBrief(api, "Released from the desk (browser test)");

  const analyst = await signedIn(setup.browser, "analyst@fairweigh.example");
  await analyst.page.goto(`${setup.server.url}/desk/briefs/${briefId}`);
  await analyst.page.getByRole("button", { name: en.desk.release.submit }).click();
  await analyst.page.getByTestId("review-history").getByText("Submitted by Demo analyst").waitFor();
  expect(analyst.errors).toEqual([]);
  await analyst.close();

  const editor = await signedIn(setup.browser, "editor@fairweigh.example");
  await editor.page.goto(`${setup.server.url}/preview/${briefId}`);
  await editor.page.getByTestId("preview-banner").waitFor();
  expect(await editor.page.locator("h1").textContent()).toBe("Released from the desk (browser test)");

  await editor.page.goto(`${setup.server.url}/desk/briefs/${briefId}`);
  const release = editor.page.getByTestId("release");
  await release.getByLabel(en.desk.release.comment).fill("Clear and correct.");
  // The reference data is heterogeneous: the checklist warns, and the editor acknowledges it.
  await release.getByTestId("readiness").getByText("substantial heterogeneity", { exact: false }).waitFor();
  await release.getByLabel(en.readiness.acknowledge).check();
  await release.getByRole("button", { name: en.desk.release.approve }).click();
  await release.getByText(en.desk.release.approval.current).waitFor();
  await release.getByRole("button", { name: en.desk.release.publish }).click();
  await release.getByRole("link", { name: `/briefs/${slug}/v/1` }).waitFor();
  expect(editor.errors).toEqual([]);
  await editor.close();

  const press = await signedIn(setup.browser, "press@fairweigh.example");
  await press.page.getByTestId("press-room").getByRole("link", { name: "Released from the desk (browser test)" }).waitFor();
  await press.close();

  const response = await fetch(`${setup.server.url}/briefs/${slug}/v/1`);
  expect(response.status).toBe(200);
});
