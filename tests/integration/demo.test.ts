// The demo seed (run by npm test's set-up, as by npm start) publishes two fictional briefs through
// the same path as real ones: upload, analysis, certainty, publication.
import { afterAll, beforeAll, describe, expect, it } from "vitest";
import { demoBriefs } from "../../server/db/demo-briefs";
import { slugify } from "../../server/briefs/briefs";
import { startTestApp, type TestApp } from "../support/app";

let app: TestApp;
beforeAll(async () => {
  app = await startTestApp();
});
afterAll(async () => {
  await app.close();
});

interface Snapshot {
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
