// Topics over the released briefs; the words of a search are matched by PostgreSQL
// (server/db/versions.ts, searchReleasedSlugs).

export interface ReleasedBrief {
  slug: string;
  title: string;
  topic: string;
  topicSlug: string;
  condition: string;
  population: string;
  /** The names readers see, for search. */
  treatments: string[];
  demo: boolean;
  withdrawn: boolean;
  version: number;
  releasedAt: string;
}

/** The briefs of one topic (all of them without one). */
export function briefsOfTopic(briefs: ReleasedBrief[], topic: string | undefined): ReleasedBrief[] {
  return topic ? briefs.filter((brief) => brief.topicSlug === topic) : briefs;
}

export interface Topic {
  slug: string;
  name: string;
  count: number;
}

export function topicsOf(briefs: ReleasedBrief[]): Topic[] {
  const topics = new Map<string, Topic>();
  for (const brief of briefs) {
    const topic = topics.get(brief.topicSlug) ?? { slug: brief.topicSlug, name: brief.topic, count: 0 };
    topic.count += 1;
    topics.set(brief.topicSlug, topic);
  }
  return [...topics.values()].sort((a, b) => a.name.localeCompare(b.name));
}
