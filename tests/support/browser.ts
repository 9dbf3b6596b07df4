// Debian's Chromium driven by playwright-core. The flags keep it off this machine's closed
// network (background services, updates, sync) and let it run as root in a container.
import { chromium, type Browser } from "playwright-core";
import { afterAll, beforeAll } from "vitest";
import { startProductionServer, type RunningServer } from "./production-server";

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
