// Debian's Chromium driven by playwright-core. The flags keep it off this machine's closed
// network (background services, updates, sync) and let it run as root in a container.
import { chromium, type Browser } from "playwright-core";

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
