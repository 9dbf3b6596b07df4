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

/**
 * The hook receives the keys twice: in the body, `{"surrogateKeys": ["brief:<slug>"]}`, for a CDN's
 * API or a small relay; and in a Surrogate-Key header, space separated, which a Varnish in front
 * purges by itself (deploy/varnish/fairweigh.vcl).
 */
export async function startPurgeWorker(queue: Queue, purgeUrl: string): Promise<void> {
  await queue.work<{ slug: string }>(purgeJob, async ({ data }) => {
    const answer = await fetch(purgeUrl, {
      method: "POST",
      headers: { "content-type": "application/json", "surrogate-key": surrogateKeys({ slug: data.slug })! },
      body: JSON.stringify({ surrogateKeys: [surrogateKeys({ slug: data.slug })] }),
      signal: AbortSignal.timeout(10_000),
    });
    if (!answer.ok) throw new Error(`the purge hook answered ${answer.status}`);
  });
}
