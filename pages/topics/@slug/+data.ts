// /topics/:slug — the released briefs of one topic.
import { render } from "vike/abort";
import type { PageContextServer } from "vike/types";
import { briefsOfTopic, topicsOf } from "#core/search";
import { listReleasedBriefs } from "#db/versions";

export async function data(pageContext: PageContextServer) {
  const all = await listReleasedBriefs(pageContext.db!, pageContext.locale);
  const topic = topicsOf(all).find((t) => t.slug === pageContext.routeParams.slug);
  if (!topic) throw render(404);
  return { topic, briefs: briefsOfTopic(all, topic.slug), caching: "revalidate" as const };
}

export type Data = Awaited<ReturnType<typeof data>>;
