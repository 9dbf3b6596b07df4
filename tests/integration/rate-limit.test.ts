// The sign-in rate limit: more than five failed sign-ins within a minute are refused (server/web/http/security.ts).
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

it("counts failed sign-ins through the form as well, and not malformed requests", async () => {
  // A server of its own: the address's count starts at zero.
  const own = await startTestApp();
  try {
    for (let attempt = 0; attempt < 8; attempt += 1) {
      expect((await new ApiClient(own.url).request("POST", "/api/session", { json: {} })).status).toBe(400);
    }
    const viaForm = async (password: string) => {
      const client = new ApiClient(own.url);
      const { body } = await client.request("GET", "/api/csrf");
      const answer = await fetch(`${own.url}/api/session`, {
        method: "POST",
        headers: { "content-type": "application/x-www-form-urlencoded", cookie: client.cookieHeader },
        body: new URLSearchParams({ email: "editor@fairweigh.example", password, _csrf: String(body.token) }),
        redirect: "manual",
      });
      return answer.headers.get("location") ?? "";
    };
    const locations: string[] = [];
    for (let attempt = 0; attempt < 6; attempt += 1) locations.push(await viaForm(`wrong-${attempt}`));
    expect(locations.slice(0, 5).every((location) => location.includes("error=invalid")), locations.join(" ")).toBe(true);
    expect(locations[5]).toContain("error=too-many");
  } finally {
    await own.close();
  }
});
