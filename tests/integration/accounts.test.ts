// People and e-mail against a real SMTP conversation with the fake mailbox (scripts/lib/mailbox.ts):
// an invitation arrives and its link works exactly once; a password reset answers the same for every
// address and its link works once; a deactivated person's session is refused at once; the press and
// translators are alerted around a release; e-mail waits out an SMTP outage and a server restart in
// the queue, and arrives afterwards.
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { startMailbox, type Mailbox } from "../../scripts/lib/mailbox";
import { ApiClient, demoClient } from "../support/client";
import { analysedBrief, approve } from "../support/briefs";
import { testDatabaseUrl } from "../support/app";
import { startProductionServer, type RunningServer } from "../support/production-server";

let mailbox: Mailbox;
let server: RunningServer;
let port: number;
let admin: ApiClient;
const run = Date.now().toString(36);
const mailEnv = () => ({ SMTP_URL: mailbox.url, MAIL_RETRY_DELAY_SECONDS: "1" });

beforeAll(async () => {
  mailbox = await startMailbox();
  server = await startProductionServer({ env: mailEnv() });
  port = Number(new URL(server.url).port);
  admin = await demoClient(server.url, "admin");
}, 60_000);
afterAll(async () => {
  await server?.stop();
  await mailbox?.stop();
});

/** The one link of a message's plain-text part that points at this site. */
const linkIn = (text: string) => new URL(/https?:\/\/\S+\/(invitation|password-reset)\/[A-Za-z0-9_-]+/.exec(text)![0]);

/** What the page of a used or expired link says at once, instead of offering the form. */
const unusable = "the page says the link is used or expired";

/** Sets a password through the form the link opens, as a browser without JavaScript would. */
async function choosePassword(link: URL, password: string) {
  const client = new ApiClient(server.url);
  const page = await fetch(`${server.url}${link.pathname}`, { headers: { cookie: client.cookieHeader } });
  client.cookieHeader = page.headers.getSetCookie().map((c) => c.split(";")[0]).join("; ");
  const html = await page.text();
  if (html.includes('data-testid="link-unusable"')) {
    expect(html).toContain("This link has been used already or has expired.");
    expect(html).not.toContain('name="password"');
    return unusable;
  }
  const csrf = /name="_csrf" value="([^"]+)"/.exec(html)![1]!;
  const answer = await fetch(`${server.url}/api/account/password`, {
    method: "POST",
    headers: { "content-type": "application/x-www-form-urlencoded", cookie: client.cookieHeader },
    body: new URLSearchParams({ _csrf: csrf, token: link.pathname.split("/").pop()!, password, from: link.pathname }),
    redirect: "manual",
  });
  return answer.headers.get("location") ?? "";
}

describe("invitations", () => {
  it("arrive with the right recipient, subject and a link that sets the password exactly once", async () => {
    const email = `translator-${run}@example.org`;
    const invited = await admin.request("POST", "/api/people", { json: { email, displayName: "Tess Translator", roles: ["translator"], translationLocales: ["es", "ar"] } });
    expect(invited.status).toBe(201);
    expect(invited.body.person).toMatchObject({ email, roles: ["translator"], translationLocales: ["es", "ar"], active: true, passwordSet: false });

    const mail = await mailbox.waitFor(email);
    expect(mail.subject).toBe("You are invited to Fairweigh");
    expect(mail.text).toContain("Demo administrator has invited you to Fairweigh as translator");
    expect(mail.html).toContain("<a href=");
    const link = linkIn(mail.text);
    expect(link.pathname).toMatch(/^\/invitation\//);

    // Before the password is set nobody can sign in; after, the person can; the link is then spent.
    expect((await new ApiClient(server.url).signIn(email, "a long enough password")).status).toBe(401);
    expect(await choosePassword(link, "a long enough password")).toBe("/sign-in?done=password");
    expect((await new ApiClient(server.url).signIn(email, "a long enough password")).status).toBe(200);
    expect(await choosePassword(link, "another long password")).toBe(unusable);
    // And the API refuses the spent link whatever the page said.
    const again = await new ApiClient(server.url).request("POST", "/api/account/password", { json: { token: link.pathname.split("/").pop(), password: "another long password" } });
    expect(again.status).toBe(400);
    expect(again.body.error?.key).toBe("errors.account.invalidLink");

    // The message's state is visible to administrators, never its body (it held the link).
    const messages = (await admin.request("GET", "/api/messages")).body.messages as { recipient: string; state: string; attempts: number; kind: string }[];
    expect(messages.find((m) => m.recipient === email)).toMatchObject({ kind: "invitation", state: "sent", attempts: 1 });
    expect(JSON.stringify(messages)).not.toContain(link.pathname);
  });

  it("an address that has an account is refused, naming the field", async () => {
    const answer = await admin.request("POST", "/api/people", { json: { email: "EDITOR@fairweigh.example", displayName: "Again", roles: ["editor"] } });
    expect(answer.status).toBe(409);
    expect(answer.body.error).toMatchObject({ key: "errors.people.taken", details: [{ field: "email" }] });
  });

  it("sent again, the new link works and the old one no longer does", async () => {
    const email = `press-${run}@example.org`;
    const { body } = await admin.request("POST", "/api/people", { json: { email, displayName: "Pat Press", roles: ["press"] } });
    const first = linkIn((await mailbox.waitFor(email)).text);
    expect((await admin.request("POST", `/api/people/${(body.person as { id: string }).id}/invitation`)).status).toBe(202);
    const second = linkIn((await mailbox.waitFor(email, (m) => !m.text.includes(first.pathname))).text);
    expect(await choosePassword(first, "a long enough password")).toBe(unusable);
    expect(await choosePassword(second, "a long enough password")).toBe("/sign-in?done=password");
  });
});

describe("password reset", () => {
  it("answers exactly the same for a known and an unknown address", async () => {
    const ask = (email: string) => new ApiClient(server.url).request("POST", "/api/password-reset", { json: { email } });
    const known = await ask("analyst@fairweigh.example");
    const unknown = await ask(`nobody-${run}@example.org`);
    expect([known.status, unknown.status]).toEqual([202, 202]);
    expect(unknown.body).toEqual(known.body);
    await mailbox.waitFor("analyst@fairweigh.example", (m) => m.subject === "Choose a new Fairweigh password");
    // Only the known address gets a message.
    await new Promise((resolve) => setTimeout(resolve, 1500));
    expect(mailbox.messages().some((m) => m.to.includes(`nobody-${run}`))).toBe(false);
  });

  it("a reset link works once, ends the person's sessions, and an expired one never works", async () => {
    const email = `reset-${run}@example.org`;
    await admin.request("POST", "/api/people", { json: { email, displayName: "Rae Reset", roles: ["analyst"] } });
    expect(await choosePassword(linkIn((await mailbox.waitFor(email)).text), "the first long password")).toBe("/sign-in?done=password");
    const signedIn = new ApiClient(server.url);
    expect((await signedIn.signIn(email, "the first long password")).status).toBe(200);

    await new ApiClient(server.url).request("POST", "/api/password-reset", { json: { email } });
    const link = linkIn((await mailbox.waitFor(email, (m) => m.subject.includes("new Fairweigh password"))).text);
    expect(await choosePassword(link, "the second long password")).toBe("/sign-in?done=password");
    expect((await signedIn.request("GET", "/api/session")).status).toBe(401);
    expect((await new ApiClient(server.url).signIn(email, "the second long password")).status).toBe(200);
    expect(await choosePassword(link, "a third long password")).toBe(unusable);

    // An expired link: the database's clock says so.
    await new ApiClient(server.url).request("POST", "/api/password-reset", { json: { email } });
    const expired = linkIn((await mailbox.waitFor(email, (m) => m.subject.includes("new Fairweigh password") && !m.text.includes(link.pathname))).text);
    const db = new pg.Client({ connectionString: testDatabaseUrl() });
    await db.connect();
    await db.query("update account_tokens set expires_at = now() - interval '1 second' where used_at is null and person_id = (select id from people where email = $1)", [email]);
    await db.end();
    expect(await choosePassword(expired, "a fourth long password")).toBe(unusable);
  });
});

describe("deactivation", () => {
  it("refuses the person's session at once, and they cannot sign in again", async () => {
    const email = `leaver-${run}@example.org`;
    const { body } = await admin.request("POST", "/api/people", { json: { email, displayName: "Lee Leaver", roles: ["editor"] } });
    const id = (body.person as { id: string }).id;
    await choosePassword(linkIn((await mailbox.waitFor(email)).text), "a long enough password");
    const leaver = new ApiClient(server.url);
    await leaver.signIn(email, "a long enough password");
    expect((await leaver.request("GET", "/api/briefs")).status).toBe(200);
    expect((await admin.request("PATCH", `/api/people/${id}`, { json: { active: false } })).status).toBe(200);
    expect((await leaver.request("GET", "/api/briefs")).status).toBe(401);
    expect((await new ApiClient(server.url).signIn(email, "a long enough password")).status).toBe(401);
  });

  // The last administrator's rule needs a database where the count is known: last-admin.test.ts.
  it("nobody deactivates themselves", async () => {
    const me = (await admin.request("GET", "/api/session")).body.person as { id: string };
    const answer = await admin.request("PATCH", `/api/people/${me.id}`, { json: { active: false } });
    expect(answer.status).toBe(409);
    expect(answer.body.error?.key).toBe("errors.people.self");
    expect(((await admin.request("GET", "/api/session")).body.person as { id: string }).id).toBe(me.id);
  });
});

/** A new person with a password, signed in: invited by the administrator, link taken from the mailbox. */
async function newPerson(prefix: string, roles: string[], extra: Record<string, unknown> = {}) {
  const email = `${prefix}-${run}@example.org`;
  expect((await admin.request("POST", "/api/people", { json: { email, displayName: `${prefix} person`, roles, ...extra } })).status).toBe(201);
  await choosePassword(linkIn((await mailbox.waitFor(email)).text), "a long enough password");
  const client = new ApiClient(server.url);
  expect((await client.signIn(email, "a long enough password")).status).toBe(200);
  return { email, client };
}

describe("alerts around a release", () => {
  it("the press hears of an embargo in its own time zone and of the release; translators are asked to translate", async () => {
    const reporter = await newPerson("reporter", ["press"]);
    expect((await reporter.client.request("PATCH", "/api/account", { json: { timeZone: "America/New_York" } })).status).toBe(200);
    // A reporter who follows only another topic hears nothing of this one.
    const sleepReporter = await newPerson("sleep-reporter", ["press"]);
    expect((await sleepReporter.client.request("PATCH", "/api/account", { json: { alertTopics: ["sleep"] } })).status).toBe(200);
    const translator = await newPerson("spanish", ["translator"], { translationLocales: ["es"] });
    const analyst = await demoClient(server.url, "analyst");
    const editor = await demoClient(server.url, "editor");
    const title = `Alerted brief ${run}`;
    const { briefId, slug } = await analysedBrief(analyst, title);
    await approve(analyst, editor, briefId);
    const releaseAt = new Date(Date.now() + 4000);
    expect((await editor.request("POST", `/api/briefs/${briefId}/versions`, { json: { releaseAt: releaseAt.toISOString() } })).status).toBe(201);

    const embargo = await mailbox.waitFor(reporter.email, (m) => m.subject.startsWith("Embargoed until"));
    const newYork = new Intl.DateTimeFormat("en", { dateStyle: "long", timeStyle: "short", timeZone: "America/New_York" }).format(releaseAt);
    expect(embargo.subject).toBe(`Embargoed until ${newYork}: ${title}`);
    expect(embargo.text).toContain("(America/New_York)");
    expect(embargo.text).toMatch(/Open the press room: https?:\/\/\S+\/desk\/press/);
    const released = await mailbox.waitFor(reporter.email, (m) => m.subject === `Released: ${title}`, 20_000);
    expect(released.text).toContain(`/briefs/${slug}/v/1`);
    expect(new Date(released.receivedAt).getTime()).toBeGreaterThanOrEqual(releaseAt.getTime());
    const request = await mailbox.waitFor(translator.email, (m) => m.subject === `To translate: ${title}`);
    expect(request.text).toContain("It is waiting for your translation into Spanish.");
    // Announced once, whatever jobs there were.
    await new Promise((resolve) => setTimeout(resolve, 1500));
    expect(mailbox.messages().filter((m) => m.to.includes(reporter.email) && m.subject === `Released: ${title}`)).toHaveLength(1);
    expect(mailbox.messages().filter((m) => m.to.includes(sleepReporter.email)).map((m) => m.subject)).toEqual(["You are invited to Fairweigh"]);
  }, 60_000);
});

describe("the press room's contact form", () => {
  it("stores the question and e-mails every editor, with the reporter to reply to", async () => {
    const reporter = await demoClient(server.url, "press");
    const subject = `Embargo question ${run}`;
    const asked = await reporter.request("POST", "/api/press-enquiries", { json: { subject, body: "May we quote the lay summary before the release?", briefSlug: null } });
    expect(asked.status).toBe(201);
    const mail = await mailbox.waitFor("editor@fairweigh.example", (m) => m.subject === `Press question: ${subject}`);
    expect(mail.text).toContain("May we quote the lay summary before the release?");
    expect(mail.headers["reply-to"]).toBe("press@fairweigh.example");
    const empty = await reporter.request("POST", "/api/press-enquiries", { json: { subject: "", body: "" } });
    expect(empty.status).toBe(400);
    expect(empty.body.error?.message).toContain("subject");
  });
});

describe("topic alerts for readers", () => {
  it("double opt-in, a correction notice with a one-click unsubscribe (RFC 8058), then nothing more", async () => {
    const analyst = await demoClient(server.url, "analyst");
    const editor = await demoClient(server.url, "editor");
    const title = `Subscribed brief ${run}`;
    const { briefId } = await analysedBrief(analyst, title);
    await approve(analyst, editor, briefId);
    expect((await editor.request("POST", `/api/briefs/${briefId}/versions`, { json: {} })).status).toBe(201);

    // A reader without an account or a CSRF token, as the form on a cached page sends it.
    const reader = `reader-${run}@example.org`;
    const subscribe = () => fetch(`${server.url}/api/subscriptions`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email: reader, topic: "Smoking" }) });
    const first = await subscribe();
    expect(first.status).toBe(202);
    const confirmation = await mailbox.waitFor(reader, (m) => m.subject === "Confirm your Fairweigh alerts for Smoking");
    const token = /\/subscriptions\/confirm\/([A-Za-z0-9_-]+)/.exec(confirmation.text)![1]!;
    // Before confirming, nothing is sent; confirming works once.
    const confirm = () => fetch(`${server.url}/api/subscriptions/confirm`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ token }) });
    expect((await confirm()).status).toBe(200);
    expect((await confirm()).status).toBe(400);
    // Asking again answers the same, and sends nothing new.
    const again = await subscribe();
    expect([again.status, await again.text()]).toEqual([202, await first.text()]);
    // The request is a job: wait until the queue has taken it, or under load it could run after the
    // unsubscription below and rightly ask to confirm again.
    await subscribeJobsDone();

    const correct = async (note: string) => {
      await approveChange(analyst, editor, briefId);
      expect((await editor.request("POST", `/api/briefs/${briefId}/versions`, { json: { note } })).status).toBe(201);
    };
    await correct("A study's arms were swapped.");
    const notice = await mailbox.waitFor(reader, (m) => m.subject === `Corrected: ${title}`, 20_000);
    expect(notice.text).toContain("A study's arms were swapped.");
    expect(notice.headers["list-unsubscribe-post"]).toBe("List-Unsubscribe=One-Click");
    expect(notice.headers["list-unsubscribe"]).toMatch(/^<https?:\/\/\S+\/api\/subscriptions\/unsubscribe\?token=[A-Za-z0-9_%-]+>$/);
    const oneClick = /https?:\/\/\S+\/api\/subscriptions\/unsubscribe\?token=[A-Za-z0-9_%-]+/.exec(notice.text)![0];
    // The mail program's one click: a POST with that body, no cookie, no token.
    const unsubscribed = await fetch(oneClick, { method: "POST", headers: { "content-type": "application/x-www-form-urlencoded" }, body: "List-Unsubscribe=One-Click" });
    expect(unsubscribed.status).toBe(200);

    await correct("A second correction.");
    await mailbox.waitFor("press@fairweigh.example", (m) => m.subject === `Released: ${title}` && m.text.includes("version 3"), 20_000);
    await new Promise((resolve) => setTimeout(resolve, 1500));
    expect(mailbox.messages().filter((m) => m.to.includes(reader)).map((m) => m.subject)).toEqual(["Confirm your Fairweigh alerts for Smoking", `Corrected: ${title}`]);
    expect(mailbox.messages().filter((m) => m.to.includes(reader) && m.subject === "Confirm your Fairweigh alerts for Smoking")).toHaveLength(1);
  }, 90_000);

  it("a topic without a released brief is refused, naming the field", async () => {
    const answer = await fetch(`${server.url}/api/subscriptions`, { method: "POST", headers: { "content-type": "application/json" }, body: JSON.stringify({ email: "x@example.org", topic: "No such topic" }) });
    expect(answer.status).toBe(400);
    expect(((await answer.json()) as { error: { details: { field: string }[] } }).error.details[0]!.field).toBe("topic");
  });
});

/** A change to a published brief through review again: the editor edits the short take, the analyst submits, the editor approves. */
/** Until no readers' subscription request waits in the queue (pg-boss's own table). */
async function subscribeJobsDone() {
  const db = new pg.Client({ connectionString: testDatabaseUrl() });
  await db.connect();
  try {
    for (let attempt = 0; attempt < 200; attempt++) {
      const { rows } = await db.query<{ waiting: number }>("select count(*)::int as waiting from pgboss.job where name = 'subscribe' and state in ('created', 'retry', 'active')");
      if (rows[0]!.waiting === 0) return;
      await new Promise((resolve) => setTimeout(resolve, 100));
    }
    throw new Error("the subscription request was not taken from the queue within 20 s");
  } finally {
    await db.end();
  }
}

async function approveChange(analyst: ApiClient, editor: ApiClient, briefId: string) {
  const current = await editor.request("GET", `/api/briefs/${briefId}`);
  const rowVersion = (current.body.brief as { rowVersion: number }).rowVersion;
  expect((await editor.request("PATCH", `/api/briefs/${briefId}`, { json: { rowVersion, shortTake: `Changed at ${Date.now()}` } })).status).toBe(200);
  await approve(analyst, editor, briefId);
}

describe("e-mail through an outage", () => {
  it("with the SMTP server down, an invitation, a scheduling and a release still succeed; the messages arrive once it is back, and survive a server restart", async () => {
    const analyst = await demoClient(server.url, "analyst");
    const editor = await demoClient(server.url, "editor");
    const title = `Released during an outage ${run}`;
    const { briefId } = await analysedBrief(analyst, title);
    await approve(analyst, editor, briefId);

    const outageStarted = Date.now();
    await mailbox.stop();
    const email = `outage-${run}@example.org`;
    expect((await admin.request("POST", "/api/people", { json: { email, displayName: "Otto Outage", roles: ["analyst"] } })).status).toBe(201);
    // Scheduled and released while no e-mail can go out.
    const releaseAt = new Date(Date.now() + 2000);
    expect((await editor.request("POST", `/api/briefs/${briefId}/versions`, { json: { releaseAt: releaseAt.toISOString() } })).status).toBe(201);
    // The server restarts while the message waits: nothing is lost.
    await new Promise((resolve) => setTimeout(resolve, 3000));
    await server.stop();
    server = await startProductionServer({ port, env: mailEnv() });
    const messages = await (async () => {
      const again = await demoClient(server.url, "admin");
      admin = again;
      return (await again.request("GET", "/api/messages")).body.messages as { recipient: string; state: string; attempts: number; lastError: string | null }[];
    })();
    const waiting = messages.find((m) => m.recipient === email)!;
    expect(waiting.state).toBe("queued");
    expect(waiting.attempts).toBeGreaterThanOrEqual(1);
    expect(waiting.lastError).toBeTruthy();

    mailbox = await startMailbox({ port: Number(new URL(mailbox.url).port) });
    const mail = await mailbox.waitFor(email, undefined, 40_000);
    expect(mail.subject).toBe("You are invited to Fairweigh");
    await mailbox.waitFor("press@fairweigh.example", (m) => m.subject.startsWith("Embargoed until") && m.subject.endsWith(title), 40_000);
    await mailbox.waitFor("press@fairweigh.example", (m) => m.subject === `Released: ${title}`, 40_000);
    console.log(`e-mail outage survived: ${((Date.now() - outageStarted) / 1000).toFixed(0)} s, with a server restart`);
  }, 90_000);
});
