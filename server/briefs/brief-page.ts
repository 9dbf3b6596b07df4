// What the public pages of a version show, shaped from its frozen snapshot only (never from the
// draft tables): the page data of /briefs/:slug/v/:n and of one comparison. Pure. Only what a page
// shows is kept, so the HTML stays small even for a 22-treatment network.
import type { ComparisonCertainty } from "../grade/assess";
import type { Rating } from "../grade/certainty";
import type { ComparisonReading, Message } from "../grade/conclusions";
import type { Firmness } from "../grade/groups";
import { rankExplainer } from "../grade/rank-explainer";
import { z975 } from "../nma/analyse";
import { comparisonOf } from "../nma/comparison";
import type { Measure, ParsedStudy } from "../nma/types";
import { slugify } from "./briefs";
import type { OutcomeSnapshot, VersionSnapshot } from "./snapshot";
import type { PublicVersion, VersionEntry } from "./versions";

export interface Named {
  id: string;
  name: string;
}

export interface Interval {
  estimate: number;
  lower: number;
  upper: number;
}

/** One reason a comparison was rated down, for its footnote: the analyst's words, or the computed reason. */
export interface Footnote {
  domainKey: string;
  levels: number;
  reason: string | null;
  because: Message | null;
}

export interface EffectRow extends Named {
  network: Interval;
  certainty: Rating | null;
  statement: Message | null;
  absolute: ComparisonReading["absolute"];
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
  reference: Named;
  groups: { label: Message; firmness: Firmness; level: number; treatments: Named[] }[];
  /** Every treatment against the reference, alphabetically by name: the forest plot and its table. */
  effects: EffectRow[];
  network: { nodes: (Named & { participants: number | null })[]; edges: { from: string; to: string; studies: number }[] };
  /** Every pair once, as the engine lists it: the league table builds both directions from it. */
  pairs: ({ treatment: string; comparator: string } & Interval)[];
  rankScores: { rows: (Named & { pScore: number; sucra: number })[]; draws: number; seed: number };
  methods: {
    studies: number;
    excludedStudies: string[];
    tau2: number;
    I2: number;
    Q: number;
    df: number;
    Qbetween: number;
    dfBetween: number;
    pBetween: number | null;
    engineVersion: string;
    fileName: string;
    sha256: string;
    baselineRisk: number | null;
  };
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

export interface PageState {
  embargoed: boolean;
  withdrawal: { at: string; reason: string } | null;
  /** The newest version this reader may see; older versions say that a newer one exists. */
  latestVersion: number;
  history: VersionEntry[];
}

export function pageState(page: PublicVersion): PageState {
  return { embargoed: page.found.embargoed, withdrawal: page.found.withdrawal, latestVersion: page.latestVersion, history: page.history };
}

/** What a version holds for its brief page; the page adds the reader's PageState. */
export interface BriefContent extends BriefHeader {
  texts: VersionSnapshot["texts"];
  outcomes: OutcomeView[];
  treatments: Named[];
}

export type BriefView = BriefContent & PageState;

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

function readingOf(outcome: OutcomeSnapshot, t: string, u: string): ComparisonReading | null {
  return (outcome.readings ?? []).find((r) => r.treatment === t && r.comparator === u) ?? null;
}

/**
 * Versions frozen before conclusions joined the snapshot (local data of early development) have
 * groups without labels and no readings or rank scores: they still render, with what they hold.
 */
type StoredOutcome = OutcomeSnapshot | (Omit<OutcomeSnapshot, "readings" | "framework" | "rankScores"> & Partial<OutcomeSnapshot>);

function outcomeView(stored: StoredOutcome, index: number, named: (id: string) => Named): OutcomeView {
  const outcome = stored as OutcomeSnapshot;
  const { result } = outcome;
  const rankScores = outcome.rankScores ?? rankExplainer(result);
  const others = result.treatments.filter((t) => t !== result.reference);
  return {
    index,
    name: outcome.name,
    kind: outcome.kind,
    measure: result.measure,
    model: result.model,
    unit: outcome.unit,
    better: result.better,
    framework: outcome.framework ?? "minimal",
    reference: named(result.reference),
    groups: outcome.groups.map((g) => ({ label: g.label ?? { key: "groups.level", values: { level: g.level } }, firmness: g.firmness, level: g.level, treatments: g.treatments.map(named) })),
    effects: others
      .map((t) => {
      const reading = readingOf(outcome, t, result.reference);
      return {
        ...named(t),
        network: interval(comparisonOf(result, t, result.reference)!.network),
        certainty: reading?.certainty ?? null,
        statement: reading?.statement ?? null,
        absolute: reading?.absolute ?? null,
      };
    })
      // Alphabetical, never by effect: the table must not read as a ranking.
      .sort((x, y) => x.name.localeCompare(y.name)),
    network: {
      nodes: result.treatments.map((id) => ({ ...named(id), participants: result.network.participants[id] ?? null })),
      edges: result.network.edges.map((e) => ({ from: e.treatment, to: e.comparator, studies: e.studies })),
    },
    pairs: result.comparisons.map((c) => ({ treatment: c.treatment, comparator: c.comparator, ...interval(c.network) })),
    rankScores: {
      rows: rankScores.rows.map((r) => ({ ...named(r.treatment), pScore: r.pScore, sucra: r.sucra })),
      draws: rankScores.draws,
      seed: rankScores.seed,
    },
    methods: {
      studies: result.studies,
      excludedStudies: result.excludedStudies,
      tau2: result.tau2,
      I2: result.heterogeneity.I2,
      Q: result.heterogeneity.Q,
      df: result.heterogeneity.df,
      Qbetween: result.inconsistency.Qbetween,
      dfBetween: result.inconsistency.dfBetween,
      pBetween: result.inconsistency.pBetween,
      engineVersion: result.engineVersion,
      fileName: outcome.dataset.fileName,
      sha256: outcome.dataset.sha256,
      baselineRisk: outcome.baselineRisk,
    },
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

/** The reasons a comparison's certainty went down, domain by domain, as its footnotes. */
export function certaintyFootnotes(certainty: ComparisonCertainty): Footnote[] {
  const { judgement, suggestions } = certainty;
  const notes: Footnote[] = [];
  if (judgement.direct) {
    for (const [domain, downgrade] of Object.entries(judgement.direct)) {
      if (downgrade.levels > 0) notes.push({ domainKey: `desk.domain.${domain}`, levels: downgrade.levels, reason: downgrade.reason, because: null });
    }
  }
  if (judgement.intransitivity && judgement.intransitivity.levels > 0) {
    notes.push({ domainKey: "certainty.footnote.intransitivity", levels: judgement.intransitivity.levels, reason: judgement.intransitivity.reason, because: null });
  }
  if (judgement.indirectRating) {
    notes.push({ domainKey: "certainty.footnote.indirectSet", levels: 0, reason: judgement.indirectRating.reason, because: null });
  }
  for (const domain of ["incoherence", "imprecision"] as const) {
    const decision = judgement[domain];
    if (decision && decision.levels > 0) {
      notes.push({ domainKey: `desk.domain.${domain}`, levels: decision.levels, reason: decision.reason || null, because: decision.reason ? null : suggestions[domain].because });
    }
  }
  return notes;
}

/** Participants in the studies that compare a and b directly (arm-level data only; null for contrasts). */
function directParticipants(studies: ParsedStudy[], a: string, b: string): number | null {
  let total = 0;
  for (const study of studies) {
    if (study.format === "contrast") return null;
    const arms = study.arms as { treatment: string; total?: number; n?: number }[];
    const both = arms.filter((arm) => arm.treatment === a || arm.treatment === b);
    if (both.length < 2) continue;
    total += both.reduce((sum, arm) => sum + (arm.total ?? arm.n ?? 0), 0);
  }
  return total;
}

export interface ComparisonOutcomeView {
  index: number;
  name: string;
  measure: Measure;
  unit: string | null;
  kind: "binary" | "continuous";
  certainty: Rating | null;
  statement: Message | null;
  absolute: ComparisonReading["absolute"];
  network: Interval;
  direct: (Interval & { studies: number; participants: number | null }) | null;
  indirect: Interval | null;
  footnotes: Footnote[];
}

/** What a version holds about one comparison; the page adds the reader's PageState. */
export interface ComparisonContent extends BriefHeader {
  treatment: Named;
  comparator: Named;
  outcomes: ComparisonOutcomeView[];
}

export type ComparisonView = ComparisonContent & PageState;

const withCi = (x: { estimate: number; se: number }): Interval => ({ estimate: x.estimate, lower: x.estimate - z975 * x.se, upper: x.estimate + z975 * x.se });

/** a vs b in every outcome whose network holds both; null when no outcome does. */
export function comparisonContent(snapshot: VersionSnapshot, a: string, b: string): ComparisonContent | null {
  const named = namer(snapshot);
  const outcomes: ComparisonOutcomeView[] = [];
  snapshot.outcomes.forEach((outcome, index) => {
    if (a === b) return;
    const comparison = comparisonOf(outcome.result, a, b);
    if (!comparison) return;
    const reading = readingOf(outcome, a, b);
    const certainty = outcome.certainty.find((c) => (c.treatment === a && c.comparator === b) || (c.treatment === b && c.comparator === a));
    outcomes.push({
      index,
      name: outcome.name,
      measure: outcome.result.measure,
      unit: outcome.unit,
      kind: outcome.kind,
      certainty: reading?.certainty ?? null,
      statement: reading?.statement ?? null,
      absolute: reading?.absolute ?? null,
      network: interval(comparison.network),
      direct: comparison.direct ? { ...withCi(comparison.direct), studies: comparison.direct.studies, participants: directParticipants(outcome.dataset.parsed.studies, a, b) } : null,
      indirect: comparison.indirect ? withCi(comparison.indirect) : null,
      footnotes: certainty ? certaintyFootnotes(certainty) : [],
    });
  });
  if (outcomes.length === 0) return null;
  return { ...briefHeader(snapshot), treatment: named(a), comparator: named(b), outcomes };
}
