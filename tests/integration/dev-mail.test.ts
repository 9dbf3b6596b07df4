// The development mailbox page's API: the messages the fake SMTP server kept, in development only.
import { mkdtempSync, rmSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { afterAll, expect, it } from "vitest";
import { demoPassword } from "#workflows/seed";
import { ApiClient } from "../support/client";
import { startTestApp } from "../support/app";

const folder = mkdtempSync(path.join(tmpdir(), "fairweigh-mail-"));
afterAll(() => rmSync(folder, { recursive: true, force: true }));

it("in development, a signed-in person reads the kept messages, newest first; in production the address answers 404", async () => {
  writeFileSync(path.join(folder, "1000-1.json"), JSON.stringify({ to: "a@example.org", subject: "Older", text: "", receivedAt: "2026-12-01T00:00:00Z" }));
  writeFileSync(path.join(folder, "2000-2.json"), JSON.stringify({ to: "b@example.org", subject: "Newer", text: "", receivedAt: "2026-12-02T00:00:00Z" }));
  for (const production of [false, true]) {
    const app = await startTestApp(undefined, { production, mailFolder: folder });
    try {
      const client = new ApiClient(app.url);
      expect((await client.request("GET", "/api/dev/mail")).status).toBe(401);
      await client.signIn("translator@fairweigh.example", demoPassword);
      const answer = await client.request("GET", "/api/dev/mail");
      if (production) {
        expect(answer.status).toBe(404);
      } else {
        expect(answer.status).toBe(200);
        expect((answer.body.messages as { subject: string }[]).map((m) => m.subject)).toEqual(["Newer", "Older"]);
      }
    } finally {
      await app.close();
    }
  }
});
