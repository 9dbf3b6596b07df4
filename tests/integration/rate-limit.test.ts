// The sign-in rate limit: more than five failed sign-ins within a minute are refused (server/http/security.ts).
// A server of its own, so that the failures counted here do not meet other tests.
import { afterAll, beforeAll, expect, it } from "vitest";
import { demoPassword } from "#workflows/seed";
import { startTestApp, type TestApp } from "../support/app";
import { ApiClient } from "../support/client";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app.close();
});

it("answers 429 to the sixth failed sign-in for one e-mail within a minute, even with the right password", async () => {
  const statuses: number[] = [];
  for (let attempt = 0; attempt < 5; attempt += 1) {
    statuses.push((await new ApiClient(app.url).signIn("admin@fairweigh.example", `wrong-${attempt}`)).status);
  }
  expect(statuses).toEqual([401, 401, 401, 401, 401]);
  const sixth = await new ApiClient(app.url).signIn("admin@fairweigh.example", demoPassword);
  expect(sixth.status).toBe(429);
  expect(sixth.body.error?.key).toBe("errors.signIn.tooMany");
});
