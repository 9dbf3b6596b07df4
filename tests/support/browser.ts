// Debian's Chromium driven by playwright-core. The flags keep it off this machine's closed
// network (background services, updates, sync) and let it run as root in a container.
import { mkdirSync } from "node:fs";
import path from "node:path";
import AxeBuilder from "@axe-core/playwright";
import { chromium, type Browser, type Page } from "playwright-core";
import { afterAll, beforeAll } from "vitest";
import { demoPassword } from "#workflows/seed";
import { startProductionServer, type RunningServer } from "./production-server";

const screenshots = path.resolve(__dirname, "../../test-results/screenshots");

/**
 * The whole page as an image in test-results/screenshots/<name>.png, kept after the run as an
 * artefact to be looked at (the journeys number theirs in the order they happen).
 */
export async function keepScreenshot(page: Page, name: string): Promise<void> {
  mkdirSync(screenshots, { recursive: true });
  await page.screenshot({ path: path.join(screenshots, `${name}.png`), fullPage: true });
}

/** The serious and critical WCAG 2.1 A/AA violations axe-core finds on a page, one line each (none is the goal). */
/** The page's uncaught errors and console errors, as they happen: a test expects none at its end. */
export function pageErrors(page: Page): string[] {
  const errors: string[] = [];
  page.on("pageerror", (error) => errors.push(error.message));
  page.on("console", (message) => {
    if (message.type() === "error") errors.push(message.text());
  });
  return errors;
}

export async function seriousViolations(browser: Browser, url: string): Promise<string[]> {
  return violations(browser, url, { impacts: ["serious", "critical"] });
}

/** The WCAG 2.1 A/AA violations axe-core finds on a page at a width, of the impacts asked for (all by default), one line each. */
export async function violations(browser: Browser, url: string, { width = 1280, impacts }: { width?: number; impacts?: string[] } = {}): Promise<string[]> {
  const context = await browser.newContext({ viewport: { width, height: 900 } });
  const page = await context.newPage();
  await page.goto(url);
  const results = await new AxeBuilder({ page }).withTags(["wcag2a", "wcag2aa", "wcag21a", "wcag21aa"]).analyze();
  await context.close();
  return results.violations.filter((v) => !impacts || impacts.includes(v.impact ?? "")).map((v) => `${v.impact} ${v.id}: ${v.nodes.map((n) => n.target.join(" ")).join(", ")}`);
}

export function launchChromium(): Promise<Browser> {
  return chromium.launch({
    executablePath: process.env.CHROMIUM_PATH ?? "/usr/bin/chromium",
    args: [
      "--no-sandbox",
      "--disable-gpu",
      "--disable-quic",
      "--no-first-run",
      "--disable-background-networking",
      "--disable-component-update",
      "--disable-sync",
    ],
  });
}

/** For a browser test file: the production server and Chromium, started before its tests and stopped after. */
export function withServerAndBrowser(): { readonly server: RunningServer; readonly browser: Browser } {
  const state: { server?: RunningServer; browser?: Browser } = {};
  beforeAll(async () => {
    state.server = await startProductionServer();
    state.browser = await launchChromium();
  });
  afterAll(async () => {
    await state.browser?.close();
    await state.server?.stop();
  });
  return {
    get server() {
      return state.server!;
    },
    get browser() {
      return state.browser!;
    },
  };
}

/**
 * A fresh browser context signed in through the sign-in form, landed on /desk. Page errors are
 * collected for the test to check; confirmation dialogs (publish, withdraw) are accepted, as the
 * person would.
 */
export async function signedIn(browser: Browser, baseUrl: string, email: string) {
  const context = await browser.newContext();
  const page = await context.newPage();
  const errors: string[] = [];
  page.on("pageerror", (error) => errors.push(error.message));
  page.on("dialog", (dialog) => void dialog.accept());
  await page.goto(`${baseUrl}/sign-in`);
  await page.fill("input[name=email]", email);
  await page.fill("input[name=password]", demoPassword);
  await Promise.all([page.waitForURL(`${baseUrl}/desk`), page.click("button[type=submit]")]);
  return { page, errors, close: () => context.close() };
}
