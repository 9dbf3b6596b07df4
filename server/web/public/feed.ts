// The Atom feed of new, corrected and withdrawn briefs (RFC 4287). Written here rather than by a
// feed package because titles and summaries must be plain text (type="text"): a brief's title is
// the editor's words, and as HTML a feed reader would run whatever markup it held.
import { versionUrl } from "#core/urls";
import type { ReleasedVersion } from "#db/versions";

export function escapeXml(text: string): string {
  return text.replace(/[<>&'"]/g, (c) => `&#${c.charCodeAt(0)};`);
}

interface Entry {
  id: string;
  url: string;
  title: string;
  summary: string;
  updated: string;
}

/** One entry per release (a new brief or a correction), and one per withdrawn brief, newest first. */
export function feedEntries(versions: ReleasedVersion[], base: string): Entry[] {
  const entries: Entry[] = versions.map((version) => {
    const url = `${base}${versionUrl({ slug: version.slug, version: version.number })}`;
    return {
      id: url,
      url,
      title: version.number === 1 ? version.title : `Corrected (version ${version.number}): ${version.title}`,
      summary: version.number === 1 ? `New brief: ${version.title}` : `Correction note: ${version.note ?? ""}`,
      updated: version.releaseAt,
    };
  });
  const withdrawn = new Map<string, ReleasedVersion>();
  for (const version of versions) if (version.withdrawnAt && !withdrawn.has(version.slug)) withdrawn.set(version.slug, version);
  for (const version of withdrawn.values()) {
    const url = `${base}${versionUrl({ slug: version.slug, version: version.number })}`;
    entries.push({ id: `${url}#withdrawn`, url, title: `Withdrawn: ${version.title}`, summary: `Withdrawn: ${version.withdrawalReason ?? ""}`, updated: version.withdrawnAt! });
  }
  return entries.sort((a, b) => b.updated.localeCompare(a.updated)).slice(0, 50);
}

export function atomFeed(feed: { base: string; selfUrl: string; entries: Entry[] }): string {
  const text = (name: string, value: string) => `<${name} type="text">${escapeXml(value.replace(/[\r\n]+/g, " "))}</${name}>`;
  const entries = feed.entries.map(
    (entry) =>
      `  <entry>\n    <id>${escapeXml(entry.id)}</id>\n    ${text("title", entry.title)}\n    <link href="${escapeXml(entry.url)}"/>\n    <updated>${entry.updated}</updated>\n    ${text("summary", entry.summary)}\n  </entry>`,
  );
  return [
    `<?xml version="1.0" encoding="utf-8"?>`,
    `<feed xmlns="http://www.w3.org/2005/Atom">`,
    `  <id>${escapeXml(feed.base)}/</id>`,
    `  ${text("title", "Fairweigh: new, corrected and withdrawn briefs")}`,
    `  ${text("subtitle", "Network meta-analyses published so that readers can see what the evidence supports.")}`,
    `  <link href="${escapeXml(feed.base)}/"/>`,
    `  <link rel="self" type="application/atom+xml" href="${escapeXml(feed.selfUrl)}"/>`,
    `  <updated>${feed.entries[0]?.updated ?? new Date(0).toISOString()}</updated>`,
    `  <author><name>Fairweigh</name></author>`,
    ...entries,
    `</feed>`,
    ``,
  ].join("\n");
}
