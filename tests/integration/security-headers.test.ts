// Security headers and the session's life, checked on the production build: a content security
// policy without inline scripts, no framing, no X-Powered-By, HSTS behind HTTPS, a new session id at
// sign-in (against session fixation, OWASP's session management guidance).
import { describe, expect, it } from "vitest";
import { demoPassword } from "#workflows/seed";
import { startTestApp } from "../support/app";
import { ApiClient } from "../support/client";
import { withProductionServer } from "../support/production-server";

const { server } = withProductionServer();

describe("security headers", () => {
  it("a page and an API answer forbid inline scripts and framing, and do not name the server's framework", async () => {
    for (const path of ["/", "/briefs", "/api/health", "/sign-in"]) {
      const response = await fetch(`${server.url}${path}`);
      const policy = response.headers.get("content-security-policy") ?? "";
      const scripts = /script-src ([^;]*)/.exec(policy)?.[1] ?? "";
      expect(scripts, path).toContain("'self'");
      expect(scripts, path).not.toContain("unsafe-inline");
      expect(policy, path).toContain("frame-ancestors 'none'");
      expect(policy, path).toContain("object-src 'none'");
      expect(response.headers.get("x-powered-by"), path).toBeNull();
      expect(response.headers.get("x-content-type-options"), path).toBe("nosniff");
    }
  });

  it("HSTS is sent behind HTTPS and only there", async () => {
    const secure = await startTestApp(undefined, { secureTransport: true });
    const plain = await startTestApp();
    try {
      expect((await fetch(`${secure.url}/api/health`)).headers.get("strict-transport-security")).toMatch(/max-age=\d+/);
      expect((await fetch(`${plain.url}/api/health`)).headers.get("strict-transport-security")).toBeNull();
    } finally {
      await secure.close();
      await plain.close();
    }
  });
});

describe("the session", () => {
  it("has no session before signing in, so none can be fixed in advance; the visitor cookie signs nobody in", async () => {
    const person = new ApiClient(server.url);
    await person.request("GET", "/api/csrf", { csrf: false });
    const cookie = (client: ApiClient, name: string) => new RegExp(`${name.replace(".", "\\.")}=([^;]+)`).exec(client.cookieHeader)?.[1];
    expect(cookie(person, "fairweigh.session")).toBeUndefined();
    const visitor = cookie(person, "fairweigh.visitor");
    expect(visitor).toBeTruthy();
    expect((await person.signIn("analyst@fairweigh.example", demoPassword)).status).toBe(200);
    expect(cookie(person, "fairweigh.session")).toBeTruthy();
    const replay = await fetch(`${server.url}/api/session`, { headers: { cookie: `fairweigh.visitor=${visitor}` } });
    expect(replay.status).toBe(401);
  });
});
