// What the public pages of a version show, projected from its frozen snapshot only (never from the
// draft tables): the page data of /briefs/:slug/v/:n and of one comparison. Pure, and no statistics:
// every interval, count and footnote was computed when the version was published
// (server/core/snapshot/facts.ts). Only what a page shows is kept, so the HTML stays small even for a
// 22-treatment network.
import type { Rating } from "../grade/certainty";
import type { Firmness } from "../grade/groups";
import type { Measure } from "../nma/types";
import { flipInterval, pairFinder, type Interval } from "../nma/pairs";
import type { CertaintyPathFacts, Footnote, Message, OutcomeSnapshot, PairFacts, Reading, VersionSnapshot } from "../snapshot/schema";
import { slugify } from "./slug";

export type { Footnote, Interval };

export interface Named {
  id: string;
  name: string;
}

export interface EffectRow extends Named {
  network: Interval;
  certainty: Rating | null;
  statement: Message | null;
  absolute: Reading["absolute"];
}

export interface OutcomeView {
  index: number;
  name: string;
  kind: "binary" | "continuous";
  measure: Measure;
  model: "fixed" | "random";
  unit: string | null;
  better: "higher" | "lower";
  framework: "minimal" | "partial";
  /** The thresholds the partially contextualised groups use, on their scale; null for the minimal framework. */
  thresholds: { small: number | null; moderate: number | null; large: number | null; unit: "per1000" | "units"; baselinePer1000: number | null } | null;
  reference: Named;
  groups: { label: Message; firmness: Firmness; level: number; treatments: Named[] }[];
  /** Every treatment against the reference, alphabetically by name: the forest plot and its table. */
  effects: EffectRow[];
  network: { nodes: (Named & { participants: number | null })[]; edges: { from: string; to: string; studies: number }[] };
  /** Every pair once, as the engine lists it: the league table builds both directions from it. */
  pairs: ({ treatment: string; comparator: string } & Interval)[];
  rankScores: { rows: (Named & { pScore: number; sucra: number })[]; draws: number; seed: number };
  methods: OutcomeSnapshot["methods"] & { fileName: string; sha256: string; baselineRisk: number | null };
  /** Pairs whose direct and indirect estimates disagree (p < 0.05, METHODS.md §5): said in words on the page. */
  incoherentPairs: number;
  /** How much of the evidence comes from studies at each risk of bias (METHODS.md §13); null without judgements. */
  riskOfBias: OutcomeSnapshot["riskOfBias"];
}

export interface BriefHeader {
  slug: string;
  title: string;
  topic: string;
  topicSlug: string;
  condition: string;
  population: string;
  demo: boolean;
  version: number;
  releaseAt: string;
  note: string | null;
}

/** One line of a brief's version history, as this reader may see it. */
export interface VersionEntry {
  number: number;
  releaseAt: string;
  note: string | null;
  embargoed: boolean;
}

/** What a page shows beyond its version: this reader's view of the brief's versions and state. */
export interface PageState {
  embargoed: boolean;
  withdrawal: { at: string; reason: string } | null;
  /** The newest version this reader may see; older versions say that a newer one exists. */
  latestVersion: number;
  history: VersionEntry[];
  /** The time zone release times are shown in: the reader's own for an embargoed version (their account's), else UTC. */
  timeZone: string;
}

/** What a version holds for its brief page; the page adds the reader's PageState. */
export interface BriefContent extends BriefHeader {
  texts: VersionSnapshot["texts"];
  outcomes: OutcomeView[];
  treatments: Named[];
}

/**
 * What a brief page holds beside its outcome sections, which come rendered (server/web/pages/stored-brief.ts):
 * of each outcome, the name its contents list links to.
 */
export type BriefOutline = Omit<BriefContent, "outcomes"> & { outcomes: Pick<OutcomeView, "index" | "name">[] };

export type BriefView = BriefOutline & PageState;

export function briefHeader(snapshot: VersionSnapshot): BriefHeader {
  const { brief } = snapshot;
  return {
    slug: brief.slug,
    title: brief.title,
    topic: brief.topic,
    topicSlug: slugify(brief.topic),
    condition: brief.condition,
    population: brief.population,
    demo: brief.demo,
    version: snapshot.version,
    releaseAt: snapshot.releaseAt,
    note: snapshot.note,
  };
}

const namer = (snapshot: VersionSnapshot) => {
  const names = new Map(snapshot.treatments.map((t) => [t.label, t.displayName]));
  return (id: string): Named => ({ id, name: names.get(id) ?? id });
};

const interval = (x: Interval): Interval => ({ estimate: x.estimate, lower: x.lower, upper: x.upper });

/** "t vs u" of an outcome: the stored pair read in this direction, and its reading in words. */
function comparisonIn(outcome: OutcomeSnapshot, t: string, u: string): { pair: PairFacts; flipped: boolean; reading: Reading | null } | null {
  const found = pairFinder(outcome.pairs)(t, u);
  if (!found) return null;
  const reading = outcome.readings.find((r) => r.treatment === t && r.comparator === u) ?? null;
  return { pair: found.item, flipped: found.flipped, reading };
}

const oriented = <T extends Interval>(x: T, flipped: boolean): Interval => interval(flipped ? flipInterval(x) : x);

function outcomeView(outcome: OutcomeSnapshot, index: number, named: (id: string) => Named): OutcomeView {
  const { methods, settings } = outcome;
  const reference = methods.reference;
  return {
    index,
    name: outcome.name,
    kind: outcome.kind,
    measure: settings.measure,
    model: settings.model,
    unit: outcome.unit,
    better: settings.better,
    framework: outcome.framework,
    thresholds:
      outcome.framework === "partial"
        ? { ...outcome.thresholds, unit: outcome.kind === "binary" ? "per1000" : "units", baselinePer1000: outcome.baselineRisk === null ? null : Math.round(1000 * outcome.baselineRisk) }
        : null,
    reference: named(reference),
    groups: outcome.groups.map((g) => ({ label: g.label, firmness: g.firmness, level: g.level, treatments: g.treatments.map(named) })),
    effects: methods.treatments
      .filter((t) => t !== reference)
      .map((t) => {
        const { pair, flipped, reading } = comparisonIn(outcome, t, reference)!;
        return { ...named(t), network: oriented(pair.network, flipped), certainty: reading?.certainty ?? null, statement: reading?.statement ?? null, absolute: reading?.absolute ?? null };
      })
      // Alphabetical, never by effect: the table must not read as a ranking.
      .sort((x, y) => x.name.localeCompare(y.name)),
    network: {
      nodes: outcome.network.nodes.map((node) => ({ ...named(node.treatment), participants: node.participants })),
      edges: outcome.network.edges.map((e) => ({ from: e.treatment, to: e.comparator, studies: e.studies })),
    },
    pairs: outcome.pairs.map((p) => ({ treatment: p.treatment, comparator: p.comparator, ...interval(p.network) })),
    rankScores: {
      // Alphabetical by the names readers see, never by score (the list is not a leaderboard).
      rows: outcome.rankScores.rows.map((r) => ({ ...named(r.treatment), pScore: r.pScore, sucra: r.sucra })).sort((x, y) => x.name.localeCompare(y.name)),
      draws: outcome.rankScores.draws,
      seed: outcome.rankScores.seed,
    },
    methods: { ...methods, fileName: outcome.dataset.fileName, sha256: outcome.dataset.sha256, baselineRisk: outcome.baselineRisk },
    incoherentPairs: outcome.pairs.filter((p) => p.incoherenceP !== null && p.incoherenceP < 0.05).length,
    riskOfBias: outcome.riskOfBias,
  };
}

export function briefContent(snapshot: VersionSnapshot): BriefContent {
  const named = namer(snapshot);
  return {
    ...briefHeader(snapshot),
    texts: snapshot.texts,
    treatments: snapshot.treatments.map((t) => named(t.label)),
    outcomes: snapshot.outcomes.map((outcome, index) => outcomeView(outcome, index, named)),
  };
}

export interface ComparisonOutcomeView {
  index: number;
  name: string;
  measure: Measure;
  unit: string | null;
  kind: "binary" | "continuous";
  certainty: Rating | null;
  statement: Message | null;
  absolute: Reading["absolute"];
  network: Interval;
  direct: (Interval & { studies: number; participants: number | null }) | null;
  /** For a pair no trial compared, the network estimate itself: it is wholly indirect. */
  indirect: Interval | null;
  /** How the certainty was reached, read as the page is (treatment first); null where it was not stored. */
  path: (Omit<CertaintyPathFacts, "indirect"> & { indirect: (Omit<NonNullable<CertaintyPathFacts["indirect"]>, "via"> & { via: Named | null }) | null }) | null;
  footnotes: Footnote[];
  /** The studies that matter most (METHODS.md §13), largest first; null in versions frozen before they were computed. */
  importance: PairFacts["importance"];
  /** Whether the data carry risk-of-bias judgements at all (else every study reads "not assessed" without meaning it). */
  judged: boolean;
}

/** What a version holds about one comparison; the page adds the reader's PageState. */
export interface ComparisonContent extends BriefHeader {
  treatment: Named;
  comparator: Named;
  outcomes: ComparisonOutcomeView[];
}

export type ComparisonView = ComparisonContent & PageState;

/** a vs b in every outcome whose network holds both; null when no outcome does. */
export function comparisonContent(snapshot: VersionSnapshot, a: string, b: string): ComparisonContent | null {
  const named = namer(snapshot);
  const outcomes: ComparisonOutcomeView[] = [];
  snapshot.outcomes.forEach((outcome, index) => {
    const found = comparisonIn(outcome, a, b);
    if (!found) return;
    const { pair, flipped, reading } = found;
    outcomes.push({
      index,
      name: outcome.name,
      measure: outcome.settings.measure,
      unit: outcome.unit,
      kind: outcome.kind,
      certainty: reading?.certainty ?? null,
      statement: reading?.statement ?? null,
      absolute: reading?.absolute ?? null,
      network: oriented(pair.network, flipped),
      direct: pair.direct ? { ...oriented(pair.direct, flipped), studies: pair.direct.studies, participants: pair.direct.participants } : null,
      indirect: pair.indirect ? oriented(pair.indirect, flipped) : pair.direct ? null : oriented(pair.network, flipped),
      path: pair.path && {
        ...pair.path,
        // The loop's sides as the page reads the pair: treatment–via, then via–comparator.
        indirect: pair.path.indirect && {
          ...pair.path.indirect,
          via: pair.path.indirect.via === null ? null : named(pair.path.indirect.via),
          sides: pair.path.indirect.sides && (flipped ? [pair.path.indirect.sides[1], pair.path.indirect.sides[0]] : pair.path.indirect.sides),
        },
      },
      footnotes: pair.footnotes,
      importance: pair.importance,
      judged: outcome.riskOfBias !== null,
    });
  });
  if (outcomes.length === 0) return null;
  return { ...briefHeader(snapshot), treatment: named(a), comparator: named(b), outcomes };
}

/** One chosen option in one outcome: against the reference, its group; null effect for the reference itself or an option the outcome did not study. */
export interface SideBySideRow {
  option: Named;
  isReference: boolean;
  effect: EffectRow | null;
  group: Message | null;
}

export interface SideBySideOutcome {
  index: number;
  name: string;
  measure: Measure;
  unit: string | null;
  reference: Named;
  rows: SideBySideRow[];
  /** Every pair of chosen options the outcome holds, in the order chosen: its statement and certainty. */
  pairs: { a: Named; b: Named; statement: Message | null; certainty: Rating | null }[];
}

export interface SideBySideContent extends BriefHeader {
  options: Named[];
  outcomes: SideBySideOutcome[];
}

/**
 * The options a reader chose (2 to 4 labels, in their order), side by side: in each outcome, each
 * against the reference and its group, then every pair among them. Never reordered by any score.
 */
export function sideBySideContent(snapshot: VersionSnapshot, ids: string[]): SideBySideContent {
  const named = namer(snapshot);
  const outcomes = snapshot.outcomes.map((outcome, index): SideBySideOutcome => {
    const view = outcomeView(outcome, index, named);
    const groupOf = (id: string) => outcome.groups.find((g) => g.treatments.includes(id))?.label ?? null;
    const rows = ids.map((id) => ({ option: named(id), isReference: id === view.reference.id, effect: view.effects.find((e) => e.id === id) ?? null, group: groupOf(id) }));
    const pairs = ids.flatMap((a, i) =>
      ids.slice(i + 1).flatMap((b) => {
        const found = comparisonIn(outcome, a, b);
        return found ? [{ a: named(a), b: named(b), statement: found.reading?.statement ?? null, certainty: found.reading?.certainty ?? null }] : [];
      }),
    );
    return { index, name: outcome.name, measure: outcome.settings.measure, unit: outcome.unit, reference: view.reference, rows, pairs };
  });
  return { ...briefHeader(snapshot), options: ids.map(named), outcomes };
}

/**
 * The options of a side-by-side address: `options=a,b` (the canonical form) or `option=a&option=b`
 * (what the brief page's form sends without JavaScript). Null when they are not 2 to 4 distinct
 * treatments of the version; `canonical` is the query to redirect to when the address is not it.
 */
export function chosenOptions(query: { options?: string; option?: string[] }, labels: string[]): { ids: string[]; canonical: string } | null {
  const ids = query.options !== undefined ? query.options.split(",") : (query.option ?? []);
  if (ids.length < 2 || ids.length > 4 || new Set(ids).size !== ids.length || !ids.every((id) => labels.includes(id))) return null;
  return { ids, canonical: `options=${ids.map(encodeURIComponent).join(",")}` };
}
