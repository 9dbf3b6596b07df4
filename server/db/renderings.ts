// The renderings of versions' pages kept in the database (schema.ts, versionRenderings): read by
// version and language, replaced when rendered again.
import { and, eq } from "drizzle-orm";
import type { Database } from "./client";
import { versionRenderings } from "./schema";

export interface Rendering {
  build: string;
  state: string;
  page: unknown;
  outcomesHtml: string;
}

export async function readRendering(db: Database, versionId: string, locale: string): Promise<Rendering | null> {
  const [row] = await db
    .select({ build: versionRenderings.build, state: versionRenderings.state, page: versionRenderings.page, outcomesHtml: versionRenderings.outcomesHtml })
    .from(versionRenderings)
    .where(and(eq(versionRenderings.versionId, versionId), eq(versionRenderings.locale, locale)));
  return row ?? null;
}

/** Keeps a rendering, replacing the one before; two processes rendering the same page at once both write the same. */
export async function storeRendering(db: Database, versionId: string, locale: string, rendering: Rendering): Promise<void> {
  await db
    .insert(versionRenderings)
    .values({ versionId, locale, ...rendering })
    .onConflictDoUpdate({ target: [versionRenderings.versionId, versionRenderings.locale], set: { ...rendering, renderedAt: new Date() } });
}
