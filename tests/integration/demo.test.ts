// The demo seed (run by npm test's set-up, as by npm start) publishes two fictional briefs through
// the same path as real ones: upload, analysis, certainty, publication.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoBriefs } from "#workflows/demo-briefs";
import { slugify } from "#core/publication/slug";
import { snapshotSchemaVersion } from "#core/snapshot/schema";
import { readSnapshot } from "#core/snapshot/upgrade";
import { briefReadiness } from "#workflows/readiness";
import { startTestApp, type TestApp } from "../support/app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app.close();
});

interface Snapshot {
  schemaVersion: number;
  brief: { demo: boolean };
  outcomes: { result: { treatments: string[] }; dataset: { parsed: { studies: { arms: unknown[] }[] } }; groups: { level: number }[] }[];
}

async function snapshotOf(title: string): Promise<Snapshot> {
  const response = await fetch(`${app.url}/api/briefs/${slugify(title)}/versions/1`);
  expect(response.status).toBe(200);
  return (await response.json()) as Snapshot;
}

describe("the fictional demo briefs", () => {
  const [small, large] = demoBriefs();

  it("a small brief: 6 treatments, two outcomes, a three-arm study, marked as demo", async () => {
    const snapshot = await snapshotOf(small!.title);
    expect(snapshot.brief.demo).toBe(true);
    expect(snapshot.outcomes).toHaveLength(2);
    expect(snapshot.outcomes[0]!.result.treatments).toHaveLength(6);
    expect(snapshot.outcomes[0]!.dataset.parsed.studies.some((s) => s.arms.length === 3)).toBe(true);
  });

  it("a large brief: at least 20 treatments, in more than one group", async () => {
    const snapshot = await snapshotOf(large!.title);
    expect(snapshot.outcomes[0]!.result.treatments.length).toBeGreaterThanOrEqual(20);
    expect(new Set(snapshot.outcomes[0]!.groups.map((g) => g.level)).size).toBeGreaterThan(1);
  });
});

describe("the demo briefs' texts", () => {
  it("claim nothing their findings do not show: no readiness warning about the texts", async () => {
    for (const demo of demoBriefs()) {
      const { rows } = await app.connection.pool.query<{ id: string }>("select id from briefs where slug = $1", [slugify(demo.title)]);
      const readiness = await briefReadiness(app.connection.db, rows[0]!.id);
      expect(readiness!.warnings.filter((w) => w.key.startsWith("readiness.claim.")), demo.title).toEqual([]);
    }
  });
});

describe("every stored snapshot", () => {
  it("parses against the declared contract, and the API answers the current shape", async () => {
    const { rows } = await app.connection.pool.query<{ snapshot: unknown }>("select snapshot from brief_versions");
    expect(rows.length).toBeGreaterThanOrEqual(2);
    for (const row of rows) expect(readSnapshot(row.snapshot).schemaVersion).toBe(snapshotSchemaVersion);
    const snapshot = await snapshotOf(demoBriefs()[0]!.title);
    expect(snapshot.schemaVersion).toBe(snapshotSchemaVersion);
  });
});
