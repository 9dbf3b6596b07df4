// Versions are frozen, but the shape the code reads moves on: each stored snapshot is brought to the
// current shape when it is read, by numbered upgrades, then checked against the declared schema
// (docs/decisions/0012-snapshot-contract.md). An upgrade never changes a stored row; it only adds
// what a newer shape holds, computed from what the old one froze.
import type { ComparisonCertainty } from "../grade/assess";
import { rankExplainer } from "../grade/rank-explainer";
import type { AnalysisResult } from "../nma/analyse";
import { treatmentRisk } from "../nma/absolute";
import type { Measure, ParsedStudy } from "../nma/types";
import { outcomeFacts } from "./facts";
import { snapshotSchemaVersion, versionSnapshotSchema, type Message, type VersionSnapshot } from "./schema";

type Stored = Record<string, unknown> & { schemaVersion?: number; outcomes: Record<string, unknown>[] };

/**
 * Shape 1 (no `schemaVersion`): the engine's result and the certainty assessment were frozen whole, and
 * the page computed intervals, participants and footnotes from them when it was read. The earliest
 * versions of development also lack the conclusions (framework, labelled groups, readings, rank scores).
 */
interface OutcomeV1 {
  result: AnalysisResult;
  certainty: ComparisonCertainty[];
  dataset: { parsed: { studies: ParsedStudy[] } };
  framework?: "minimal" | "partial";
  groups: { label?: Message; level: number }[];
  readings?: unknown[];
  rankScores?: unknown;
}

/** 1 → 2: the facts pages show are computed once, here, as publishing now stores them. */
function upgrade1to2(snapshot: Stored): Stored {
  const outcomes = (snapshot.outcomes as unknown as OutcomeV1[]).map((outcome) => ({
    ...outcome,
    framework: outcome.framework ?? "minimal",
    groups: outcome.groups.map((group) => ({ ...group, label: group.label ?? { key: "groups.level", values: { level: group.level } } })),
    readings: outcome.readings ?? [],
    rankScores: outcome.rankScores ?? rankExplainer(outcome.result),
    ...outcomeFacts(outcome.result, outcome.certainty, outcome.dataset.parsed.studies),
  }));
  return { ...snapshot, schemaVersion: 2, outcomes };
}

/**
 * 2 → 3: thresholds of binary outcomes move from the analysis scale to the difference per 1000 people
 * at the baseline risk, exactly as migration 0008 converts stored outcomes (a magnitude t becomes
 * 1000·(p₁ − p₀) for an effect of +t, rounded to 0.1); without a baseline risk they have no meaning
 * per 1000 and are dropped. The frozen groups, computed with the old thresholds, stay as they were.
 */
function upgrade2to3(snapshot: Stored): Stored {
  type Outcome = { kind: string; settings: { measure: Measure }; baselineRisk: number | null; thresholds: Record<string, number | null> };
  const perThousand = (outcome: Outcome, t: number | null) =>
    t === null || outcome.baselineRisk === null ? null : Math.round(10_000 * (treatmentRisk(outcome.settings.measure, t, outcome.baselineRisk) - outcome.baselineRisk)) / 10;
  const outcomes = (snapshot.outcomes as unknown as Outcome[]).map((outcome) =>
    outcome.kind !== "binary"
      ? outcome
      : { ...outcome, thresholds: Object.fromEntries(Object.entries(outcome.thresholds).map(([size, t]) => [size, perThousand(outcome, t)])) },
  );
  return { ...snapshot, schemaVersion: 3, outcomes } as unknown as Stored;
}

/**
 * 3 → 4: study importances and risk of bias (METHODS.md §13) were not computed when these versions
 * were frozen; they read as not known (null), and the pages say so, rather than being computed now.
 * Footnotes name their domain by a key of the public pages' strings.
 */
function upgrade3to4(snapshot: Stored): Stored {
  type Outcome = { pairs: Record<string, unknown>[] };
  const outcomes = (snapshot.outcomes as unknown as Outcome[]).map((outcome) => ({
    riskOfBias: null,
    ...outcome,
    pairs: outcome.pairs.map((pair) => ({
      importance: null,
      riskOfBias: null,
      ...pair,
      // The domains' words moved to the public pages' own strings (certainty.domain.*): the desk's are not loaded there.
      footnotes: (pair.footnotes as { domainKey: string }[]).map((note) => ({ ...note, domainKey: note.domainKey.replace(/^desk\.domain\./, "certainty.domain.") })),
    })),
  }));
  return { ...snapshot, schemaVersion: 4, outcomes } as unknown as Stored;
}

/**
 * 4 → 5: two fields took the product's own names (decision 0034): the brief's author, `reviewGroup`
 * before, is `authorTeam`; the editor's short text, `keyMessagesHtml` before, is `shortTakeHtml`.
 * The words themselves are as they were frozen.
 */
function upgrade4to5(snapshot: Stored): Stored {
  const { reviewGroup, ...brief } = snapshot.brief as Record<string, unknown>;
  const { keyMessagesHtml, ...texts } = snapshot.texts as Record<string, unknown>;
  return {
    ...snapshot,
    schemaVersion: 5,
    brief: reviewGroup === undefined ? brief : { ...brief, authorTeam: reviewGroup },
    texts: { ...texts, shortTakeHtml: keyMessagesHtml },
  };
}

/**
 * 5 → 6: without thresholds (the minimally contextualised framework), a comparison whose 95% CI
 * includes the null was frozen as "trivial" and read "little to no difference", which claims a trivial
 * effect that no threshold defines (METHODS.md §10). The fact frozen is the same; it now reads "does
 * not show a clear difference". A group placed away from the reference with a member of moderate
 * certainty against it reads "probably", as new versions do (with or without thresholds). How each certainty was reached (§8
 * step 5) was not stored: it reads as not known.
 */
function upgrade5to6(snapshot: Stored): Stored {
  type Reading = { treatment: string; comparator: string; certainty: string | null; magnitude: string; statement: { key: string } | null };
  type Group = { level: number; firmness: string; treatments: string[]; label: { key: string } };
  type Outcome = { framework: string; readings: Reading[]; groups: Group[]; methods: { reference: string }; pairs: Record<string, unknown>[] };
  const outcomes = (snapshot.outcomes as unknown as Outcome[]).map((stored) => {
    // How each certainty was reached was not stored then: the page shows the footnotes alone.
    const outcome = { ...stored, pairs: stored.pairs.map((pair) => ({ path: null, ...pair })) };
    const moderate = new Set(outcome.readings.filter((r) => r.comparator === outcome.methods.reference && r.certainty === "moderate").map((r) => r.treatment));
    const minimal = outcome.framework === "minimal";
    return {
      ...outcome,
      readings: outcome.readings.map((reading) =>
        !minimal || reading.magnitude !== "trivial"
          ? reading
          : { ...reading, magnitude: "unclear", statement: reading.statement && { ...reading.statement, key: reading.statement.key.replace(/\.trivial$/, ".unclear") } },
      ),
      groups: outcome.groups.map((group) =>
        group.firmness === "firm" && group.level !== 0 && group.treatments.some((t) => moderate.has(t))
          ? { ...group, label: { ...group.label, key: group.label.key.replace(/\.firm$/, ".probably") } }
          : group,
      ),
    };
  });
  return { ...snapshot, schemaVersion: 6, outcomes } as unknown as Stored;
}

/** upgrades[n] brings shape n + 1 to shape n + 2. */
export const upgrades: ((snapshot: Stored) => Stored)[] = [upgrade1to2, upgrade2to3, upgrade3to4, upgrade4to5, upgrade5to6];

export class SnapshotError extends Error {
  constructor(message: string) {
    super(message);
    this.name = "SnapshotError";
  }
}

/** A stored snapshot of any shape, brought to the current one and checked: what every reader reads. */
export function readSnapshot(stored: unknown): VersionSnapshot {
  let snapshot = stored as Stored;
  const from = snapshot.schemaVersion ?? 1;
  if (!Number.isInteger(from) || from < 1 || from > snapshotSchemaVersion) throw new SnapshotError(`a snapshot of shape ${String(from)} cannot be read (known: 1 to ${snapshotSchemaVersion})`);
  for (let shape = from; shape < snapshotSchemaVersion; shape++) snapshot = upgrades[shape - 1]!(snapshot);
  const parsed = versionSnapshotSchema.safeParse(snapshot);
  if (!parsed.success) throw new SnapshotError(`a stored snapshot does not match shape ${snapshotSchemaVersion}: ${parsed.error.issues.slice(0, 3).map((i) => `${i.path.join(".")}: ${i.message}`).join("; ")}`);
  return parsed.data;
}
