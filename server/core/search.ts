// Search and topics over the released briefs (the public list is small: filtering in memory keeps
// one query per page). Matches ignore case and accents.

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

const fold = (text: string) => text.normalize("NFKD").replace(/[\u0300-\u036f]/g, "").toLowerCase();

/** Every word of the query must appear in the title, the condition or a treatment's name. */
export function searchBriefs(briefs: ReleasedBrief[], query: { q?: string; topic?: string }): ReleasedBrief[] {
  const words = fold(query.q ?? "").split(/\s+/).filter(Boolean);
  return briefs.filter((brief) => {
    if (query.topic && brief.topicSlug !== query.topic) return false;
    const haystack = fold([brief.title, brief.condition, ...brief.treatments].join(" "));
    return words.every((word) => haystack.includes(word));
  });
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
