// Translations of a released version (docs/decisions/0025-translations-of-frozen-versions.md): which
// of its texts a translator translates, whether each translation still matches its source, what
// changed in a source since it was translated, and the version as readers of a language see it.
// Pure: the frozen snapshot is read, never changed; the translated copy is made for one page.
import { createHash } from "node:crypto";
import { diffWords } from "diff";
import { genders, grammaticalNumbers, inSentence, type Gender, type GrammaticalNumber, type TreatmentGrammar } from "./grammar";
import type { Locale } from "./locales";
import { renderMarkdown, textOf } from "../editorial/markdown";
import type { VersionSnapshot } from "../snapshot/schema";

/** How a field is written: one line, Markdown (shown to readers as sanitised HTML), or a treatment's grammar (a choice). */
export type FieldKind = "line" | "markdown" | "grammar";

export interface SourceField {
  /** "title", "summary", "treatment:<label>", "outcome:<index>"… */
  name: string;
  kind: FieldKind;
  /** The source as plain text: what is hashed and compared. */
  text: string;
  /** For Markdown fields, the source as readers see it. */
  html: string | null;
  /** May stay empty when the translation is marked ready: the default reads correctly (a treatment's phrase and grammar). */
  optional?: boolean;
}

/** A translated field as stored: the target, and the source it was translated from. */
export interface StoredField {
  text: string;
  sourceHash: string;
  sourceText: string;
}

export type StoredFields = Record<string, StoredField>;
/** What readers of a language see: the target text of each field. */
export type PublishedFields = Record<string, string>;

export const sourceHash = (text: string) => createHash("sha256").update(text).digest("hex").slice(0, 32);

/** The texts of a version that a translator translates, in the order the page shows them. */
export function sourceFields(snapshot: VersionSnapshot): SourceField[] {
  const line = (name: string, text: string): SourceField => ({ name, kind: "line", text, html: null });
  const markdown = (name: string, html: string): SourceField => ({ name, kind: "markdown", text: textOf(html), html });
  return [
    line("title", snapshot.brief.title),
    line("topic", snapshot.brief.topic),
    line("condition", snapshot.brief.condition),
    line("population", snapshot.brief.population),
    markdown("shortTake", snapshot.texts.shortTakeHtml),
    markdown("summary", snapshot.texts.laySummaryHtml),
    ...(snapshot.note ? [line("note", snapshot.note)] : []),
    ...snapshot.outcomes.flatMap((outcome, index) => {
      const phrase = statementPhrase(outcome);
      return [line(`outcome:${index}`, outcome.name), ...(phrase ? [line(`outcomePhrase:${index}`, phrase)] : []), ...(outcome.unit ? [line(`unit:${index}`, outcome.unit)] : [])];
    }),
    ...snapshot.treatments.flatMap((treatment): SourceField[] => [
      line(`treatment:${treatment.label}`, treatment.displayName),
      // How a sentence of the language names it (with its article: "les soins habituels"), and its gender and number.
      { ...line(`treatmentPhrase:${treatment.label}`, treatment.phrase ?? inSentence(treatment.displayName, "en")), optional: true },
      { name: `treatmentGrammar:${treatment.label}`, kind: "grammar", text: treatment.number ?? "singular", html: null, optional: true },
    ]),
  ].filter((field) => field.text.trim() !== "");
}

/** The words statements use for an outcome inside a sentence ("pain at 12 weeks"), when they are not its name. */
function statementPhrase(outcome: VersionSnapshot["outcomes"][number]): string | null {
  const phrase = outcome.readings.find((reading) => reading.statement)?.statement?.values.outcome;
  return typeof phrase === "string" && phrase !== outcome.name ? phrase : null;
}

export type DiffPart = { text: string; change: "same" | "added" | "removed" };

/** What changed in a source since it was translated, word by word. */
export function wordDiff(before: string, after: string): DiffPart[] {
  return diffWords(before, after).map((part) => ({ text: part.value, change: part.added ? "added" : part.removed ? "removed" : "same" }));
}

export interface FieldView extends SourceField {
  target: string;
  /** The source changed since this field was translated: it needs a look before it can be ready. */
  stale: boolean;
  /** For a stale field: the old source against the new. */
  diff: DiffPart[] | null;
}

/** Each source field beside its translation, flagged where the source has changed since. */
export function fieldViews(sources: SourceField[], stored: StoredFields): FieldView[] {
  return sources.map((source) => {
    const saved = Object.hasOwn(stored, source.name) ? stored[source.name] : undefined;
    const stale = saved !== undefined && saved.sourceHash !== sourceHash(source.text);
    return { ...source, target: saved?.text ?? "", stale, diff: stale ? wordDiff(saved.sourceText, source.text) : null };
  });
}

/** Why a translation cannot be marked ready: fields left empty, and fields whose source changed (an optional one only once filled in). */
export function unfinished(views: FieldView[]): { empty: string[]; stale: string[] } {
  return {
    empty: views.filter((v) => !v.optional && v.target.trim() === "").map((v) => v.name),
    stale: views.filter((v) => v.stale && (!v.optional || v.target.trim() !== "")).map((v) => v.name),
  };
}

/**
 * Each treatment's grammar for the words of `locale`: the translator's phrase and choice where the
 * translation gives them, else the display name inside a sentence, the source's number, masculine.
 */
export function versionGrammar(snapshot: VersionSnapshot, locale: Locale, published: PublishedFields | null): (label: string) => TreatmentGrammar {
  const given = (name: string) => published?.[name]?.trim() || null;
  const byLabel = new Map(
    snapshot.treatments.map((treatment) => {
      const number = treatment.number ?? "singular";
      if (!published) return [treatment.label, { phrase: treatment.phrase ?? inSentence(treatment.displayName, "en"), number, gender: "masculine" }] as const;
      const name = given(`treatment:${treatment.label}`) ?? treatment.displayName;
      const [gender, chosenNumber] = (given(`treatmentGrammar:${treatment.label}`) ?? "").split(" ") as [Gender | undefined, GrammaticalNumber | undefined];
      return [
        treatment.label,
        {
          phrase: given(`treatmentPhrase:${treatment.label}`) ?? inSentence(name, locale),
          number: chosenNumber && grammaticalNumbers.includes(chosenNumber) ? chosenNumber : number,
          gender: gender && genders.includes(gender) ? gender : "masculine",
        },
      ] as const;
    }),
  );
  return (label) => byLabel.get(label) ?? { phrase: label, number: "singular", gender: "masculine" };
}

/** The stored fields after a save: each target with the source it now translates. */
export function storedAfterSave(sources: SourceField[], previous: StoredFields, targets: Record<string, string>): StoredFields {
  const next: StoredFields = {};
  for (const source of sources) {
    // A field saved now translates today's source; one left alone keeps the source it was written for.
    if (Object.hasOwn(targets, source.name)) next[source.name] = { text: targets[source.name]!, sourceHash: sourceHash(source.text), sourceText: source.text };
    else if (Object.hasOwn(previous, source.name)) next[source.name] = previous[source.name]!;
  }
  return next;
}

/**
 * A new version's translation, carried from the published translation of an earlier one
 * (docs/decisions/0040-translations-carried-field-by-field.md): every field whose source text is
 * unchanged keeps its published translation, and readers see it at once; a field whose source
 * changed keeps its old translation in the working copy only, against its old source, so that the
 * translator sees what changed; a new field is empty. Readers see the original for those two, marked.
 */
export function carriedTranslation(earlier: { snapshot: VersionSnapshot; published: PublishedFields }, next: VersionSnapshot): { fields: StoredFields; published: PublishedFields; open: string[] } {
  const before = new Map(sourceFields(earlier.snapshot).map((field) => [field.name, field.text]));
  const fields: StoredFields = {};
  const published: PublishedFields = {};
  for (const source of sourceFields(next)) {
    const target = earlier.published[source.name]?.trim() ? earlier.published[source.name]! : null;
    const was = before.get(source.name);
    if (target === null || was === undefined) continue;
    if (was === source.text) published[source.name] = target;
    fields[source.name] = { text: target, sourceHash: sourceHash(was), sourceText: was };
  }
  return { fields, published, open: openFields(sourceFields(next), published) };
}

/** The fields readers of a partly translated version see in the original: not optional, and not (yet) translated. */
export function openFields(sources: SourceField[], published: PublishedFields): string[] {
  return sources.filter((source) => !source.optional && !published[source.name]?.trim()).map((source) => source.name);
}

/** The topic's name in the reader's language; its address (the slug) stays that of the original. */
export const translatedTopic = (snapshot: VersionSnapshot, published: PublishedFields) => published.topic?.trim() || snapshot.brief.topic;

/**
 * The version as readers of a language see it: the published texts in place of the originals, the
 * frozen numbers, groups and statements untouched (statements name treatments by their display names,
 * which are swapped here too). A field left empty keeps the original.
 */
export function translatedSnapshot(snapshot: VersionSnapshot, published: PublishedFields): VersionSnapshot {
  const given = (name: string) => (Object.hasOwn(published, name) && published[name]!.trim() !== "" ? published[name]! : null);
  const names = new Map<string, string>();
  const treatments = snapshot.treatments.map((treatment) => {
    const name = given(`treatment:${treatment.label}`);
    if (name) names.set(treatment.displayName, name);
    return name ? { ...treatment, displayName: name } : treatment;
  });
  const outcomeNames = snapshot.outcomes.map((outcome, index) => given(`outcome:${index}`) ?? outcome.name);
  snapshot.outcomes.forEach((outcome, index) => {
    if (outcomeNames[index] !== outcome.name) names.set(outcome.name, outcomeNames[index]!);
    const phrase = statementPhrase(outcome);
    const translatedPhrase = given(`outcomePhrase:${index}`);
    if (phrase && translatedPhrase) names.set(phrase, translatedPhrase);
  });
  const rename = <T extends { values: Record<string, string | number> }>(message: T): T => ({
    ...message,
    values: Object.fromEntries(Object.entries(message.values).map(([key, value]) => [key, typeof value === "string" ? (names.get(value) ?? value) : value])),
  });
  const html = (name: string, original: string) => {
    const text = given(name);
    return text ? renderMarkdown(text) : original;
  };
  return {
    ...snapshot,
    brief: { ...snapshot.brief, title: given("title") ?? snapshot.brief.title, condition: given("condition") ?? snapshot.brief.condition, population: given("population") ?? snapshot.brief.population },
    treatments,
    texts: { shortTakeHtml: html("shortTake", snapshot.texts.shortTakeHtml), laySummaryHtml: html("summary", snapshot.texts.laySummaryHtml) },
    note: snapshot.note ? (given("note") ?? snapshot.note) : null,
    outcomes: snapshot.outcomes.map((outcome, index) => ({
      ...outcome,
      name: outcomeNames[index]!,
      unit: outcome.unit ? (given(`unit:${index}`) ?? outcome.unit) : null,
      groups: outcome.groups.map((group) => ({ ...group, label: rename(group.label) })),
      readings: outcome.readings.map((reading) => ({
        ...reading,
        statement: reading.statement ? rename(reading.statement) : null,
        absolute: reading.absolute ? { ...reading.absolute, statement: rename(reading.absolute.statement) } : null,
      })),
    })),
  };
}
