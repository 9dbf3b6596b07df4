// The Atom feed of new, corrected and withdrawn briefs (RFC 4287). Written here rather than by a
// feed package because titles and summaries must be plain text (type="text"): a brief's title is
// the editor's words, and as HTML a feed reader would run whatever markup it held.
import type { TFunction } from "i18next";
import { localePath, type Locale } from "#core/languages/locales";
import { notXmlChar } from "#core/editorial/text";
import { versionUrl } from "#core/publication/urls";
import { changeSummary } from "#core/snapshot/changes";
import type { ReleasedVersion } from "#db/versions";

/** Text as XML carries it: the five special characters escaped, and what XML 1.0 forbids dropped (server/core/editorial/text.ts). */
export function escapeXml(text: string): string {
  return text.replace(notXmlChar, "").replace(/[<>&'"]/g, (c) => `&#${c.charCodeAt(0)};`);
}

interface Entry {
  id: string;
  url: string;
  title: string;
  summary: string;
  updated: string;
}

/** One entry per release (a new brief or a correction), and one per withdrawn brief, newest first. */
export function feedEntries(versions: ReleasedVersion[], base: string, locale: Locale, t: TFunction): Entry[] {
  // An entry's id names the version, the same in every language's feed; its link is the reader's language.
  const address = (version: ReleasedVersion) => versionUrl({ slug: version.slug, version: version.number });
  const entries: Entry[] = versions.map((version) => {
    const url = `${base}${localePath(locale, address(version))}`;
    return {
      id: `${base}${address(version)}`,
      url,
      title: version.number === 1 ? version.title : t("feed.corrected", { version: version.number, title: version.title }),
      summary: version.number === 1 ? t("feed.new", { title: version.title }) : [t("feed.correctionNote", { note: version.note ?? "" }), ...(version.changes ? [changeSummary(t, locale, version.changes)] : [])].join(" "),
      updated: version.releaseAt,
    };
  });
  const withdrawn = new Map<string, ReleasedVersion>();
  for (const version of versions) if (version.withdrawnAt && !withdrawn.has(version.slug)) withdrawn.set(version.slug, version);
  for (const version of withdrawn.values()) {
    const url = `${base}${localePath(locale, address(version))}`;
    entries.push({ id: `${base}${address(version)}#withdrawn`, url, title: t("feed.withdrawn", { title: version.title }), summary: t("feed.withdrawnReason", { reason: version.withdrawalReason ?? "" }), updated: version.withdrawnAt! });
  }
  return entries.sort((a, b) => b.updated.localeCompare(a.updated)).slice(0, 50);
}

export function atomFeed(feed: { base: string; selfUrl: string; entries: Entry[]; locale: Locale; t: TFunction }): string {
  const text = (name: string, value: string) => `<${name} type="text">${escapeXml(value.replace(/[\r\n]+/g, " "))}</${name}>`;
  const entries = feed.entries.map(
    (entry) =>
      `  <entry>\n    <id>${escapeXml(entry.id)}</id>\n    ${text("title", entry.title)}\n    <link href="${escapeXml(entry.url)}"/>\n    <updated>${entry.updated}</updated>\n    ${text("summary", entry.summary)}\n  </entry>`,
  );
  return [
    `<?xml version="1.0" encoding="utf-8"?>`,
    `<feed xmlns="http://www.w3.org/2005/Atom" xml:lang="${feed.locale}">`,
    `  <id>${escapeXml(feed.base)}/</id>`,
    `  ${text("title", feed.t("feed.title"))}`,
    `  ${text("subtitle", feed.t("feed.subtitle"))}`,
    `  <link href="${escapeXml(feed.base + localePath(feed.locale, "/"))}"/>`,
    `  <link rel="self" type="application/atom+xml" href="${escapeXml(feed.selfUrl)}"/>`,
    `  <updated>${feed.entries[0]?.updated ?? new Date(0).toISOString()}</updated>`,
    `  <author><name>Fairweigh</name></author>`,
    ...entries,
    `</feed>`,
    ``,
  ].join("\n");
}
