// Citations of a brief version or of one comparison in it: one CSL-JSON item, turned into RIS,
// BibTeX and a formatted reference by citation-js (a maintained citation library), so that every
// format says the same thing.
import { Cite } from "@citation-js/core";
import "@citation-js/plugin-bibtex";
import "@citation-js/plugin-csl";
import "@citation-js/plugin-ris";
import { splitLocale, type Locale } from "#core/languages/locales";
import type { CitationFormat } from "#core/publication/urls";

export interface CitationInput {
  title: string;
  version: number;
  releaseAt: string;
  /** The permalink: the version's URL (or the comparison's), absolute. */
  url: string;
  accessed: Date;
  /** For one comparison: "A vs B", in the reader's language (brief.versus). */
  comparison?: string;
  /** The author team, the citation's author; the product's name when none is set. */
  author?: string | null;
  /** The language the version was read in: the permalink names it, the item says it; the version cited is the same. */
  language?: Locale;
  /**
   * The brief was withdrawn: every citation file of every version says so, in the reader's words
   * (`note`, e.g. "Withdrawn on 2026-12-04. Reason: …"), so that a reference manager learns it too.
   */
  withdrawn?: { note: string; titlePrefix: string } | null;
}

const dateParts = (date: Date) => ({ "date-parts": [[date.getUTCFullYear(), date.getUTCMonth() + 1, date.getUTCDate()]] });

/**
 * One line, without control characters: a line break inside a field would start a new record in RIS
 * (and a new field in BibTeX). Every text field goes through it, the author as well as the title.
 */
// eslint-disable-next-line no-control-regex -- finding control characters is the point
const oneLine = (text: string) => text.replace(/[\r\n\u2028\u2029\u0000-\u001f\u007f-\u009f]+/g, " ").trim();

export function cslItem(input: CitationInput) {
  const title = oneLine(input.comparison ? `${input.comparison}: ${input.title}` : input.title);
  return {
    // One id per version (or comparison) in every language: the locale prefix is not part of it.
    id: `fairweigh-${splitLocale(new URL(input.url).pathname).path.replace(/[^a-z0-9]+/gi, "-").replace(/^-|-$/g, "")}`,
    type: "report",
    title,
    author: [{ literal: oneLine(input.author ?? "") || "Fairweigh" }],
    publisher: "Fairweigh",
    version: String(input.version),
    // RIS ET and BibTeX edition: reference managers show which version is cited.
    edition: `Version ${input.version}`,
    issued: dateParts(new Date(input.releaseAt)),
    accessed: dateParts(input.accessed),
    URL: input.url,
    language: input.language ?? "en",
    // CSL-JSON's status ("withdrawn") and note; citation-js writes the note as RIS N1 and BibTeX note.
    ...(input.withdrawn ? { status: "withdrawn", note: oneLine(input.withdrawn.note) } : {}),
  };
}

export type { CitationFormat } from "#core/publication/urls";

export const citationMedia: Record<CitationFormat, string> = {
  ris: "application/x-research-info-systems",
  bib: "application/x-bibtex",
  json: "application/vnd.citationstyles.csl+json",
};

export function citationFile(input: CitationInput, format: CitationFormat): string {
  const item = cslItem(input);
  if (format === "json") return `${JSON.stringify([item], null, 2)}\n`;
  // citation-js makes its own keys (author, year, first title word), which repeat across versions and
  // comparisons: each file carries the item's id instead, unique per brief, version and comparison.
  if (format === "bib") {
    // citation-js writes the day into the month ("month = {dec 4}"), which BibTeX reads as no month:
    // the month macro ("dec"), and the whole date in biblatex's date field.
    const released = new Date(input.releaseAt).toISOString().slice(0, 10);
    return new Cite(item)
      .format("bibtex")
      .replace(/^(@\w+\{)[^,\n]*,/, `$1${item.id},`)
      .replace(/^(\s*)month = \{(\w{3})[^}]*\},$/m, `$1month = $2,\n$1date = {${released}},`);
  }
  // citation-js folds RIS values every 70 characters; reference managers read the continuation as a
  // new value or join it with a space, which breaks permalinks. Each value is joined back whole.
  const ris = new Cite(item)
    .format("ris")
    .replace(/\n(?![A-Z][A-Z0-9] {2}- |$)/g, "")
    .replace(/^ID {2}- .*$/m, `ID  - ${item.id}`)
    // RIS dates are YYYY/MM/DD/: citation-js leaves the month and day unpadded ("2026/3/5/").
    .replace(/^(DA|Y2) {2}- (\d{4})\/(\d{1,2})\/(\d{1,2})\//gm, (_, tag: string, year: string, month: string, day: string) => `${tag}  - ${year}/${month.padStart(2, "0")}/${day.padStart(2, "0")}/`);
  // A reference manager lists RIS titles only: a withdrawn one says so before its title, as retraction notices do.
  return input.withdrawn ? ris.replace(/^TI {2}- /m, `TI  - ${oneLine(input.withdrawn.titlePrefix)}: `) : ris;
}

/** The reference as a reader copies it (APA style); the page adds the access date in its own words. */
export function formattedReference(input: Omit<CitationInput, "accessed">): string {
  // APA names the version already ("(Version 1)"): the edition would say it twice.
  return new Cite({ ...cslItem({ ...input, accessed: new Date() }), edition: undefined, accessed: undefined }).format("bibliography", { format: "text", template: "apa", lang: "en-US" }).trim();
}
