// What changed between two versions of a brief, computed from their frozen snapshots (so it never
// changes either): the texts that changed, field by field; the studies added or removed per outcome;
// per outcome the options whose group moved; per comparison a changed certainty, a changed statement,
// or an estimate that moved by more than the tolerance below. Pages, the changes.json file, the
// feed, the alert e-mails and the desk's preview before a correction all read this one result.
import { isDeepStrictEqual } from "node:util";
import type { TFunction } from "i18next";
import type { Locale } from "../languages/locales";
import { sourceFields } from "../languages/translation";
import type { Rating } from "../grade/certainty";
import type { Message, OutcomeSnapshot, VersionSnapshot } from "./schema";

/**
 * An estimate "moved" when its point or either end of its 95% CI moved by more than this share of
 * the earlier interval's width, on the analysis scale. Our own rule (no published standard): a
 * shift a reader would see on the forest plot, scale-free so that it means the same for odds
 * ratios, risk differences and mean differences.
 */
export const estimateTolerance = 0.1;

/** The fields of the texts compared: those a translator translates, but not the correction note (always new) nor how a treatment is inflected. */
const comparedText = (name: string) => name !== "note" && !name.startsWith("treatmentPhrase:") && !name.startsWith("treatmentGrammar:");

export interface TextChange {
  /** "title", "summary", "outcome:0", "treatment:<label>"…, as in the translation desk. */
  field: string;
  before: string | null;
  after: string | null;
}

export interface Interval {
  estimate: number;
  lower: number;
  upper: number;
}

export interface ComparisonChange {
  treatment: string;
  comparator: string;
  /** The comparison is new in this version, or gone from it. */
  presence?: "added" | "removed";
  certainty?: { from: Rating | null; to: Rating | null };
  statement?: { from: Message | null; to: Message | null };
  estimate?: { from: Interval; to: Interval };
}

export interface GroupMove {
  treatment: string;
  from: Message | null;
  to: Message | null;
}

export interface OutcomeChanges {
  /** The outcome's name in the later version (in the earlier one when it was removed). */
  outcome: string;
  /** Its place in each version's outcomes; null in the one it is missing from. */
  index: { before: number | null; after: number | null };
  presence?: "added" | "removed";
  measure: OutcomeSnapshot["settings"]["measure"];
  studies: { added: string[]; removed: string[] };
  groups: GroupMove[];
  comparisons: ComparisonChange[];
}

export interface VersionChanges {
  from: number;
  to: number;
  tolerance: number;
  texts: TextChange[];
  outcomes: OutcomeChanges[];
}

/** Equal whatever the order of their keys (PostgreSQL's jsonb keeps its own order). */
const sameMessage = (a: Message | null, b: Message | null) => isDeepStrictEqual(a, b);

/** The studies of an outcome's data set, by name. */
const studiesOf = (outcome: OutcomeSnapshot) => new Set(outcome.dataset.parsed.studies.map((study) => study.study));

function moved(from: Interval, to: Interval): boolean {
  const width = Math.abs(from.upper - from.lower);
  const limit = estimateTolerance * (width > 0 ? width : 1);
  return Math.abs(to.estimate - from.estimate) > limit || Math.abs(to.lower - from.lower) > limit || Math.abs(to.upper - from.upper) > limit;
}

/** Each treatment's group in an outcome: its label (a message). */
const groupOf = (outcome: OutcomeSnapshot) => new Map(outcome.groups.flatMap((group) => group.treatments.map((treatment) => [treatment, group.label] as const)));

function outcomeChanges(before: OutcomeSnapshot | undefined, after: OutcomeSnapshot | undefined, index: OutcomeChanges["index"]): OutcomeChanges | null {
  const either = (after ?? before)!;
  const base = { outcome: either.name, index, measure: either.settings.measure };
  if (!before || !after) {
    const studies = [...studiesOf(either)];
    return { ...base, presence: before ? "removed" : "added", studies: before ? { added: [], removed: studies } : { added: studies, removed: [] }, groups: [], comparisons: [] };
  }
  const [was, is] = [studiesOf(before), studiesOf(after)];
  const studies = { added: [...is].filter((s) => !was.has(s)), removed: [...was].filter((s) => !is.has(s)) };

  const [groupsBefore, groupsAfter] = [groupOf(before), groupOf(after)];
  const groups: GroupMove[] = [...new Set([...groupsBefore.keys(), ...groupsAfter.keys()])]
    .map((treatment) => ({ treatment, from: groupsBefore.get(treatment) ?? null, to: groupsAfter.get(treatment) ?? null }))
    .filter((move) => !sameMessage(move.from, move.to));

  // Every pair once, as the later version orders them; a pair is matched in either direction.
  const key = (a: string, b: string) => [a, b].sort().join("\u0000");
  const pairsBefore = new Map(before.pairs.map((pair) => [key(pair.treatment, pair.comparator), pair]));
  const readingOf = (outcome: OutcomeSnapshot, treatment: string, comparator: string) => outcome.readings.find((r) => r.treatment === treatment && r.comparator === comparator) ?? null;
  const comparisons: ComparisonChange[] = [];
  for (const pair of after.pairs) {
    const old = pairsBefore.get(key(pair.treatment, pair.comparator));
    pairsBefore.delete(key(pair.treatment, pair.comparator));
    const at = { treatment: pair.treatment, comparator: pair.comparator };
    if (!old) {
      comparisons.push({ ...at, presence: "added" });
      continue;
    }
    // The earlier pair read in the later one's direction: a flipped estimate changes sign.
    const flipped = old.treatment !== pair.treatment;
    const from = flipped ? { estimate: -old.network.estimate, lower: -old.network.upper, upper: -old.network.lower } : { estimate: old.network.estimate, lower: old.network.lower, upper: old.network.upper };
    const to = { estimate: pair.network.estimate, lower: pair.network.lower, upper: pair.network.upper };
    const statementFrom = readingOf(before, pair.treatment, pair.comparator)?.statement ?? null;
    const statementTo = readingOf(after, pair.treatment, pair.comparator)?.statement ?? null;
    const change: ComparisonChange = {
      ...at,
      ...(old.certainty !== pair.certainty ? { certainty: { from: old.certainty, to: pair.certainty } } : {}),
      ...(!sameMessage(statementFrom, statementTo) ? { statement: { from: statementFrom, to: statementTo } } : {}),
      ...(moved(from, to) ? { estimate: { from, to } } : {}),
    };
    if (Object.keys(change).length > 2) comparisons.push(change);
  }
  for (const old of pairsBefore.values()) comparisons.push({ treatment: old.treatment, comparator: old.comparator, presence: "removed" });

  if (studies.added.length + studies.removed.length + groups.length + comparisons.length === 0) return null;
  return { ...base, studies, groups, comparisons };
}

/** What changed from `before` (an earlier version, or the last one) to `after` (the next version or a draft). */
export function versionChanges(before: VersionSnapshot, after: VersionSnapshot | (Omit<VersionSnapshot, "version" | "releaseAt" | "note"> & { version?: number; note?: string | null })): VersionChanges {
  const textsBefore = new Map(sourceFields(before).map((field) => [field.name, field.text]));
  const textsAfter = new Map(sourceFields({ version: 0, releaseAt: "", note: null, ...after }).map((field) => [field.name, field.text]));
  const texts: TextChange[] = [...new Set([...textsBefore.keys(), ...textsAfter.keys()])]
    .filter(comparedText)
    .map((field) => ({ field, before: textsBefore.get(field) ?? null, after: textsAfter.get(field) ?? null }))
    .filter((change) => change.before !== change.after);

  // Outcomes are matched by name: a renamed outcome reads as one removed and one added.
  const indexIn = (outcomes: OutcomeSnapshot[], name: string) => {
    const found = outcomes.findIndex((outcome) => outcome.name === name);
    return found < 0 ? null : found;
  };
  const outcomes = [
    ...after.outcomes.map((outcome, index) => {
      const was = indexIn(before.outcomes, outcome.name);
      return outcomeChanges(was === null ? undefined : before.outcomes[was], outcome, { before: was, after: index });
    }),
    ...before.outcomes.flatMap((outcome, index) => (indexIn(after.outcomes, outcome.name) === null ? [outcomeChanges(outcome, undefined, { before: index, after: null })] : [])),
  ].filter((change): change is OutcomeChanges => change !== null);

  return { from: before.version, to: after.version ?? before.version + 1, tolerance: estimateTolerance, texts, outcomes };
}

/** How many things changed, by kind: the summary the feed and the e-mails state in words. */
function changeCounts(changes: VersionChanges) {
  const comparisons = changes.outcomes.flatMap((outcome) => outcome.comparisons);
  return {
    texts: changes.texts.length,
    studiesAdded: changes.outcomes.reduce((sum, o) => sum + o.studies.added.length, 0),
    studiesRemoved: changes.outcomes.reduce((sum, o) => sum + o.studies.removed.length, 0),
    groups: changes.outcomes.reduce((sum, o) => sum + o.groups.length, 0),
    certainty: comparisons.filter((c) => c.certainty).length,
    statements: comparisons.filter((c) => c.statement).length,
    estimates: comparisons.filter((c) => c.estimate).length,
  };
}

/** The summary in one sentence of `locale` ("What changed: 1 text rewritten and 2 studies added."). */
export function changeSummary(t: TFunction, locale: Locale, changes: VersionChanges): string {
  const counts = changeCounts(changes);
  const parts = (Object.keys(counts) as (keyof typeof counts)[]).filter((kind) => counts[kind] > 0).map((kind) => t(`changes.summary.${kind}`, { count: counts[kind] }));
  return parts.length === 0 ? t("changes.summary.nothing") : t("changes.summary.lead", { list: new Intl.ListFormat(locale, { type: "conjunction" }).format(parts) });
}

/** A change as a page shows it: names and sentences of the reader's language. */
export interface ChangesView {
  from: number;
  to: number;
  tolerance: number;
  /** Each changed text: the words naming the field, and the name it concerns (an outcome's, a treatment's). */
  texts: { field: string; name: string | null }[];
  outcomes: {
    name: string;
    anchor: number | null;
    presence: OutcomeChanges["presence"];
    measure: OutcomeChanges["measure"];
    studies: OutcomeChanges["studies"];
    groups: { treatment: string; from: Message | null; to: Message | null }[];
    comparisons: { treatment: string; comparator: string; presence: ComparisonChange["presence"]; certainty?: ComparisonChange["certainty"]; statement?: Message | null; estimate?: ComparisonChange["estimate"] }[];
  }[];
}

/**
 * The changes in the words of the two versions as a reader of one language sees them (`before` and
 * `after` translated, in their grammar): what changed is decided on the originals, what it says is
 * taken from each version as that reader reads it.
 */
export function changesView(changes: VersionChanges, before: VersionSnapshot, after: VersionSnapshot): ChangesView {
  const names = new Map([...before.treatments, ...after.treatments].map((t) => [t.label, t.displayName]));
  const name = (label: string) => names.get(label) ?? label;
  const outcomeName = (index: number) => after.outcomes[index]?.name ?? before.outcomes[index]?.name ?? "";
  const texts = changes.texts.map(({ field }) => {
    const [kind, which] = field.split(":");
    const about = which === undefined ? null : kind === "treatment" ? name(which) : outcomeName(Number(which));
    return { field: kind!, name: about };
  });
  const groupIn = (outcome: OutcomeSnapshot | undefined, treatment: string) => outcome?.groups.find((group) => group.treatments.includes(treatment))?.label ?? null;
  const statementIn = (outcome: OutcomeSnapshot | undefined, treatment: string, comparator: string) => outcome?.readings.find((r) => r.treatment === treatment && r.comparator === comparator)?.statement ?? null;
  return {
    from: changes.from,
    to: changes.to,
    tolerance: changes.tolerance,
    texts,
    outcomes: changes.outcomes.map((outcome) => {
      const was = outcome.index.before === null ? undefined : before.outcomes[outcome.index.before];
      const is = outcome.index.after === null ? undefined : after.outcomes[outcome.index.after];
      return {
        name: (is ?? was)!.name,
        anchor: outcome.index.after,
        presence: outcome.presence,
        measure: outcome.measure,
        studies: outcome.studies,
        groups: outcome.groups.map((move) => ({ treatment: name(move.treatment), from: groupIn(was, move.treatment), to: groupIn(is, move.treatment) })),
        comparisons: outcome.comparisons.map((c) => ({
          treatment: name(c.treatment),
          comparator: name(c.comparator),
          presence: c.presence,
          ...(c.certainty ? { certainty: c.certainty } : {}),
          ...(c.statement ? { statement: statementIn(is, c.treatment, c.comparator) } : {}),
          ...(c.estimate ? { estimate: c.estimate } : {}),
        })),
      };
    }),
  };
}
