// Rendering a brief's page before its readers ask: when its public pages change (a release, a
// correction, a published translation) or a scheduled version's release time comes, one process
// renders its newest version in every language, so that the parts a version's pages share are
// stored already (server/web/pages/stored-brief.ts) and no reader waits for them. Each process hears
// the change; the queue's singleton key makes one job of their requests, as for the CDN purge.
import type { Queue } from "./queue";

export const renderAheadJob = "render-ahead";

/**
 * A few seconds later: readers who come at once after a change (a purged CDN sends them all) render
 * and store the pages they read themselves, and the job then renders only the languages nobody read.
 */
const delayMs = 5000;

export function requestRenderAhead(queue: Queue, slug: string): Promise<void> {
  return queue.send(renderAheadJob, { slug }, { singletonKey: `render-ahead:${slug}`, startAfter: new Date(Date.now() + delayMs) });
}

/** `render`: the pages' own renderer (server/web/pages/render-and-keep.ts, renderAhead). */
export async function startRenderAheadWorker(queue: Queue, render: (slug: string) => Promise<void>): Promise<void> {
  await queue.work<{ slug: string }>(renderAheadJob, ({ data }) => render(data.slug));
}
