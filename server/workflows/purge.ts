// The CDN purge hook: when what a brief's public pages show changes (a withdrawal, a new version, a
// moved release, a published translation), a POST to PURGE_URL names the brief's surrogate key, so
// that a CDN in front drops every page and file of that brief at once (docs/operations.md). Each
// process hears the change (server/db/notices.ts); the queue's singleton key makes one job of their
// requests, and a refused purge is tried again like an e-mail.
import { surrogateKeys } from "#core/publication/urls";
import type { Queue } from "./queue";

export const purgeJob = "cdn-purge";

export function requestPurge(queue: Queue, slug: string): Promise<void> {
  return queue.send(purgeJob, { slug }, { singletonKey: `purge:${slug}` });
}

/** The body the hook receives: `{"surrogateKeys": ["brief:<slug>"]}`. */
export async function startPurgeWorker(queue: Queue, purgeUrl: string): Promise<void> {
  await queue.work<{ slug: string }>(purgeJob, async ({ data }) => {
    const answer = await fetch(purgeUrl, {
      method: "POST",
      headers: { "content-type": "application/json" },
      body: JSON.stringify({ surrogateKeys: [surrogateKeys({ slug: data.slug })] }),
      signal: AbortSignal.timeout(10_000),
    });
    if (!answer.ok) throw new Error(`the purge hook answered ${answer.status}`);
  });
}
