// Sign-in, sessions and role checks against the real database (PostgreSQL started by npm test).
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoPassword } from "#workflows/seed";
import { startTestApp, type TestApp } from "../support/app";
import { ApiClient, demoClient } from "../support/client";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app.close();
});

describe("health", () => {
  it("reports the database as reachable", async () => {
    const response = await new ApiClient(app.url).request("GET", "/api/health");
    expect(response.status).toBe(200);
    expect(response.body).toEqual({ status: "ok", database: "ok" });
  });
});

describe("signing in", () => {
  it("accepts the right password and returns the person with roles", async () => {
    const client = new ApiClient(app.url);
    const response = await client.signIn("analyst@fairweigh.example", demoPassword);
    expect(response.status).toBe(200);
    expect(response.body.person).toMatchObject({ email: "analyst@fairweigh.example", roles: ["analyst"] });
    const session = await client.request("GET", "/api/session");
    expect(session.status).toBe(200);
    expect(session.body.person).toMatchObject({ email: "analyst@fairweigh.example" });
  });

  it("ignores the case of the e-mail address", async () => {
    const response = await new ApiClient(app.url).signIn("Editor@Fairweigh.Example", demoPassword);
    expect(response.status).toBe(200);
    expect(response.body.person).toMatchObject({ email: "editor@fairweigh.example", roles: ["editor"] });
  });

  it("gives the same 401 message for a wrong password and for an unknown e-mail", async () => {
    const wrongPassword = await new ApiClient(app.url).signIn("analyst@fairweigh.example", "not-the-password");
    const unknownEmail = await new ApiClient(app.url).signIn("nobody@fairweigh.example", demoPassword);
    expect(wrongPassword.status).toBe(401);
    expect(unknownEmail.status).toBe(401);
    expect(wrongPassword.body.error).toEqual(unknownEmail.body.error);
    expect(wrongPassword.body.error?.message).toBe("That e-mail and password do not match an account.");
  });

  it("names the missing field when the body is incomplete", async () => {
    const response = await new ApiClient(app.url).request("POST", "/api/session", { json: { email: "a@b.example" } });
    expect(response.status).toBe(400);
    expect(response.body.error).toMatchObject({ key: "errors.invalidRequest", details: [{ field: "password" }] });
  });

  it("answers 401 to GET /api/session when nobody is signed in", async () => {
    const response = await new ApiClient(app.url).request("GET", "/api/session");
    expect(response.status).toBe(401);
  });

  it("signs out with DELETE /api/session", async () => {
    const client = await demoClient(app.url, "press");
    expect((await client.request("DELETE", "/api/session")).status).toBe(204);
    expect((await client.request("GET", "/api/session")).status).toBe(401);
  });

  it("sets an httpOnly, SameSite=Lax session cookie when someone signs in", async () => {
    const signedIn = await new ApiClient(app.url).signIn("analyst@fairweigh.example", demoPassword);
    const cookies = signedIn.headers.getSetCookie().join("\n");
    expect(cookies).toMatch(/fairweigh\.session=[^;]+;.*HttpOnly/i);
    expect(cookies).toMatch(/SameSite=Lax/i);
  });

  it("stores no session for a reader who only asks for a token (hostile probe round 3, F13; the sign-in page: hostile.test.ts)", async () => {
    for (const path of ["/api/csrf"]) {
      const response = await fetch(`${app.url}${path}`);
      expect(response.status).toBe(200);
      const cookies = response.headers.getSetCookie().join("\n");
      expect(cookies, path).not.toMatch(/fairweigh\.session=/);
      expect(cookies, path).toMatch(/fairweigh\.visitor=[^;]+;.*HttpOnly/i);
    }
  });
});

describe("CSRF protection", () => {
  it("refuses a sign-in without the token with 403", async () => {
    const response = await new ApiClient(app.url).request("POST", "/api/session", {
      json: { email: "analyst@fairweigh.example", password: demoPassword },
      csrf: false,
    });
    expect(response.status).toBe(403);
    expect(response.body.error?.key).toBe("errors.csrf");
  });

  it("refuses a token from another browser, and accepts the browser's own", async () => {
    const first = new ApiClient(app.url);
    const theirs = String((await first.request("GET", "/api/csrf", { csrf: false })).body.token);
    // The second browser has cookies of its own (its visitor and CSRF cookies): only the token differs.
    const second = new ApiClient(app.url);
    const own = String((await second.request("GET", "/api/csrf", { csrf: false })).body.token);
    expect(own).not.toBe(theirs);
    const signIn = (token: string) =>
      second.request("POST", "/api/session", { json: { email: "analyst@fairweigh.example", password: demoPassword }, csrf: false, headers: { "x-csrf-token": token } });
    expect((await signIn(theirs)).status).toBe(403);
    expect((await signIn(own)).status).toBe(200);
  });

  it("refuses a signed-in person's token from before another sign-in", async () => {
    const person = await demoClient(app.url, "editor");
    const before = String((await person.request("GET", "/api/csrf", { csrf: false })).body.token);
    await person.signIn("editor@fairweigh.example", demoPassword);
    const change = (token: string) => person.request("PATCH", "/api/account", { json: { displayName: "Demo editor" }, csrf: false, headers: { "x-csrf-token": token } });
    expect((await change(before)).status).toBe(403);
    const after = String((await person.request("GET", "/api/csrf", { csrf: false })).body.token);
    expect((await change(after)).status).not.toBe(403);
  });
});

describe("role checks", () => {
  it("answers 401 to an anonymous caller", async () => {
    expect((await new ApiClient(app.url).request("GET", "/api/people")).status).toBe(401);
  });

  it("answers 403 to a person without the role", async () => {
    const client = await demoClient(app.url, "editor");
    const response = await client.request("GET", "/api/people");
    expect(response.status).toBe(403);
    expect(response.body.error).toMatchObject({ key: "errors.roleRequired", details: { required: ["admin"] } });
  });

  it("lets an administrator list people and their roles", async () => {
    const client = await demoClient(app.url, "admin");
    const response = await client.request("GET", "/api/people");
    expect(response.status).toBe(200);
    const people = response.body.people as { email: string; roles: string[] }[];
    expect(people.find((p) => p.email === "translator@fairweigh.example")?.roles).toEqual(["translator"]);
  });
});

describe("sessions in PostgreSQL", () => {
  it("survive a restart of the server", async () => {
    // Signed in on a server that is then stopped, with its database pool: nothing of the session
    // lives on in a process, only in PostgreSQL.
    const first = await startTestApp();
    const client = await demoClient(first.url, "translator");
    const cookies = client.cookieHeader;
    await first.close();
    expect(await fetch(`${first.url}/api/health`).then(() => "answered", () => "stopped")).toBe("stopped");

    const restarted = await startTestApp();
    try {
      const again = new ApiClient(restarted.url);
      again.cookieHeader = cookies;
      const response = await again.request("GET", "/api/session");
      expect(response.status).toBe(200);
      expect(response.body.person).toMatchObject({ email: "translator@fairweigh.example" });
    } finally {
      await restarted.close();
    }
  });
});

describe("audit log", () => {
  it("records a sign-in", async () => {
    await new ApiClient(app.url).signIn("press@fairweigh.example", demoPassword);
    const { rows } = await app.connection.pool.query(
      `select a.action from audit_log a join people p on p.id = a.actor_id
       where p.email = 'press@fairweigh.example' order by a.id desc limit 1`,
    );
    expect(rows[0]?.action).toBe("sign-in");
  });
});
