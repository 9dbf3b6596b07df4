// The server killed during a publish (hostile probe round 3, F9): the version, the brief's status, the
// audit row, the alerts with their delivery jobs and, for a scheduled version, its release job commit
// together (decision 0036). Every kill must leave all of them or none. Three kills are made certain
// by holding the publish inside its transaction behind a lock this test takes (the brief's row, the
// messages table, the queue's job table), one after the answer; twenty more land at random instants.
import pg from "pg";
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { migrateAndSeed } from "../../scripts/lib/steps";
import { startProductionServer, type RunningServer } from "../../scripts/lib/production-server";
import { ownDatabase, testSessionSecret } from "../support/app";
import { analysedBrief, approve } from "../support/briefs";
import { demoClient } from "../support/client";

type Kind = "immediate" | "scheduled";
type Ending = "everything" | "nothing";

let database: Awaited<ReturnType<typeof ownDatabase>>;
let db: pg.Client;
const briefs: { id: string; title: string; statusBefore: string }[] = [];

const start = (): Promise<RunningServer> => startProductionServer({ databaseUrl: database.url, sessionSecret: testSessionSecret });

beforeAll(async () => {
  database = await ownDatabase("publish_kills");
  await migrateAndSeed(database.url, true);
  db = new pg.Client({ connectionString: database.url });
  await db.connect();
  // Approved briefs, one per kill, made before any server is killed.
  const server = await start();
  try {
    const analyst = await demoClient(server.url, "analyst");
    const editor = await demoClient(server.url, "editor");
    for (let i = 0; i < 28; i++) {
      const title = `Killed publish ${String(i).padStart(2, "0")}`;
      const { briefId } = await analysedBrief(analyst, title);
      await approve(analyst, editor, briefId);
      briefs.push({ id: briefId, title, statusBefore: (await db.query("select status from briefs where id = $1", [briefId])).rows[0].status });
    }
  } finally {
    await server.stop();
  }
}, 300_000);

afterAll(async () => {
  await db?.end();
  await database?.drop();
});

const count = async (query: string, values: unknown[]): Promise<number> => Number((await db.query(query, values)).rows[0].count);

/** The people an alert about a Smoking brief goes to, counted by hand from the tables (not by the server's code). */
async function recipients(): Promise<{ press: number; translators: number; subscribers: number }> {
  const active = "p.deactivated_at is null and p.password_hash is not null";
  return {
    press: await count(`select count(*) from people p join person_roles r on r.person_id = p.id where r.role = 'press' and ${active} and (p.alert_topics = '{}' or 'smoking' = any(p.alert_topics))`, []),
    translators: await count(`select count(*) from people p join person_roles r on r.person_id = p.id where r.role = 'translator' and ${active} and p.translation_locales <> '{}'`, []),
    subscribers: await count(`select count(*) from subscriptions where topic_slug = 'smoking' and confirmed_at is not null and unsubscribed_at is null`, []),
  };
}

/** What a publish left behind, read straight from the tables. */
async function leftBehind(brief: { id: string; title: string }) {
  const byTitle = [brief.id, `%${brief.title}%`];
  const kinds = await db.query<{ kind: string; count: string; jobs: string }>(
    `select m.kind, count(*) as count,
       count(*) filter (where exists (select 1 from pgboss.job j where j.name = 'mail' and j.data->>'messageId' = m.id::text)) as jobs
     from messages m where m.text like $2 and $1::text is not null group by m.kind`,
    byTitle,
  );
  const messages = Object.fromEntries(kinds.rows.map((row) => [row.kind, Number(row.count)]));
  return {
    versions: await count("select count(*) from brief_versions where brief_id = $1", [brief.id]),
    status: (await db.query("select status from briefs where id = $1", [brief.id])).rows[0].status as string,
    audit: await count("select count(*) from audit_log where entity_id = $1 and action = 'publish'", [brief.id]),
    announced: await count("select count(*) from release_announcements a join brief_versions v on v.id = a.version_id where v.brief_id = $1", [brief.id]),
    releaseJobs: await count("select count(*) from pgboss.job where name = 'release' and data->>'briefId' = $1", [brief.id]),
    messages,
    messagesWithoutJob: kinds.rows.reduce((sum, row) => sum + Number(row.count) - Number(row.jobs), 0),
  };
}

/** Everything or nothing, or a description of the half-made state. */
async function ending(brief: (typeof briefs)[number], kind: Kind): Promise<Ending | string> {
  const left = await leftBehind(brief);
  const { press, translators, subscribers } = await recipients();
  const nothing = { versions: 0, status: brief.statusBefore, audit: 0, announced: 0, releaseJobs: 0, messages: {}, messagesWithoutJob: 0 };
  const everything =
    kind === "immediate"
      ? { versions: 1, status: "published", audit: 1, announced: 1, releaseJobs: 0, messages: { "release-alert": press, "translation-request": translators, ...(subscribers ? { "topic-notice": subscribers } : {}) }, messagesWithoutJob: 0 }
      : // Scheduled: the press are alerted and translators asked at once, so that translations are ready at the release.
        { versions: 1, status: "scheduled", audit: 1, announced: 0, releaseJobs: 1, messages: { "press-alert": press, "translation-request": translators }, messagesWithoutJob: 0 };
  if (canonical(left) === canonical(everything)) return "everything";
  if (canonical(left) === canonical(nothing)) return "nothing";
  return `half-made: ${JSON.stringify(left)}`;
}

/** JSON with every object's keys in order, so that two equal records compare equal. */
function canonical(value: unknown): string {
  if (value === null || typeof value !== "object") return JSON.stringify(value);
  return `{${Object.keys(value)
    .sort()
    .map((key) => `${JSON.stringify(key)}:${canonical((value as Record<string, unknown>)[key])}`)
    .join(",")}}`;
}

/** Waits until a statement of the server's matching `pattern` waits for a lock (the publish is held inside its transaction). */
async function heldAt(pattern: RegExp): Promise<void> {
  for (let i = 0; i < 400; i++) {
    const waiting = await db.query<{ query: string }>("select query from pg_stat_activity where wait_event_type = 'Lock' and datname = current_database()");
    if (waiting.rows.some((row) => pattern.test(row.query))) return;
    await new Promise((resolve) => setTimeout(resolve, 25));
  }
  const activity = await db.query("select state, wait_event_type, wait_event, left(query, 120) as query from pg_stat_activity where datname = current_database()");
  throw new Error(`no statement matching ${pattern} waited for the lock within 10 s: ${JSON.stringify(activity.rows)}`);
}

/**
 * Publishes brief `i` on a fresh server and kills it: `hold` takes a lock first and kills once the
 * publish waits for it; `delay` kills after so many ms; neither kills after the answer. What was left,
 * and how long the answer took (when it came).
 */
async function publishAndKill(i: number, kind: Kind, how: { hold?: { lock: string; waits: RegExp }; delay?: number }): Promise<{ ending: Ending | string; ms: number }> {
  const brief = briefs[i]!;
  const server = await start();
  const editor = await demoClient(server.url, "editor");
  await editor.request("GET", "/api/csrf");
  let ms = 0;
  const locker = how.hold ? new pg.Client({ connectionString: database.url }) : null;
  try {
    if (locker && how.hold) {
      await locker.connect();
      await locker.query("begin");
      await locker.query(how.hold.lock, how.hold.lock.includes("$1") ? [brief.id] : []);
    }
    const body = kind === "scheduled" ? { releaseAt: new Date(Date.now() + 86_400_000).toISOString() } : {};
    const sent = Date.now();
    const publishing = editor.request("POST", `/api/briefs/${brief.id}/versions`, { json: body }).catch(() => null);
    if (how.hold) await heldAt(how.hold.waits);
    else if (how.delay !== undefined) await new Promise((resolve) => setTimeout(resolve, how.delay));
    else expect((await publishing)?.status).toBe(201);
    ms = Date.now() - sent;
    await server.kill();
    await publishing;
  } finally {
    if (locker) {
      await locker.query("rollback");
      await locker.end();
    }
    await server.kill();
  }
  return { ending: await ending(brief, kind), ms };
}

const holds = {
  "the brief's row": { lock: "select 1 from briefs where id = $1 for update", waits: /from "briefs".*for update/is },
  "the messages table": { lock: "lock table messages in share mode", waits: /insert into "messages"/i },
  "the queue's job table": { lock: "lock table pgboss.job in share mode", waits: /insert into pgboss\.job/i },
};

describe("the server killed during a publish", () => {
  it("leaves everything or nothing, immediate and scheduled, at certain and at random instants", async () => {
    const { press, translators } = await recipients();
    // The alerts are only worth checking if somebody gets them.
    expect(press).toBeGreaterThan(0);
    expect(translators).toBeGreaterThan(0);
    const seen: Record<Kind, Record<string, number>> = { immediate: {}, scheduled: {} };
    const record = (kind: Kind, result: string, label: string) => {
      expect(result, `${kind}, ${label}`).toMatch(/^(everything|nothing)$/);
      seen[kind][result] = (seen[kind][result] ?? 0) + 1;
    };
    let next = 0;
    const kinds: Kind[] = ["immediate", "scheduled"];
    for (const kind of kinds) {
      // Certain: after the answer, everything…
      const answered = await publishAndKill(next++, kind, {});
      expect(answered.ending, `${kind}, killed after the answer`).toBe("everything");
      const publishMs = answered.ms;
      // …and, held at each lock inside the transaction, nothing.
      for (const [label, hold] of Object.entries(holds)) expect((await publishAndKill(next++, kind, { hold })).ending, `${kind}, killed while held at ${label}`).toBe("nothing");
      // Random instants across the publish's own duration (and a little after it).
      for (let run = 0; run < 10; run++) {
        const delay = Math.round(Math.random() * publishMs * 1.2);
        record(kind, (await publishAndKill(next++, kind, { delay })).ending, `killed at ${delay} ms`);
      }
      console.log(`killed during a ${kind} publish (${publishMs} ms to answer): ${JSON.stringify(seen[kind])} at random instants; everything after the answer; nothing when held at ${Object.keys(holds).join(", ")}`);
    }
    expect(next).toBeLessThanOrEqual(briefs.length);
  }, 600_000);
});
