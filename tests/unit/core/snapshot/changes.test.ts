// What changed between two versions (server/core/snapshot/changes.ts), on two small hand-made
// versions of an invented brief: texts by field, studies, group moves, certainty, statements, and
// estimates against the stated tolerance; and the one-sentence summary, written out by hand in each
// language; and a correction's translation carried field by field (server/core/languages/translation.ts).
import { describe, expect, it } from "vitest";
import { carriedTranslation, sourceHash } from "#core/languages/translation";
import { wordsOf } from "#core/languages/words";
import { changeSummary, changesView, versionChanges } from "#core/snapshot/changes";
import type { OutcomeSnapshot, VersionSnapshot } from "#core/snapshot/schema";

type Pair = { treatment: string; comparator: string; estimate: number; lower: number; upper: number; certainty: "high" | "moderate" | "low" | "very_low" | null };

const statement = (key: string, treatment: string, comparator: string) => ({ key, values: { outcome: "sleep", treatment, comparator } });

/** One binary outcome over usual care, walking and light; only what the comparison reads is filled in. */
function outcome(studies: string[], pairs: Pair[], groups: { key: string; treatments: string[] }[], statements: Record<string, string>): OutcomeSnapshot {
  return {
    name: "Sleep at 8 weeks",
    settings: { measure: "OR", model: "random", reference: "usual", better: "higher" },
    dataset: { fileName: "s.csv", sha256: "x", format: "arm-binary", parsed: { format: "arm-binary", studies: studies.map((study) => ({ format: "arm-binary", study, arms: [] })) } },
    groups: groups.map((group, level) => ({ label: { key: group.key, values: { reference: "usual care" } }, firmness: "may", level, treatments: group.treatments })),
    // Each comparison is read both ways, as a version stores it.
    readings: pairs.flatMap((p) =>
      [
        [p.treatment, p.comparator],
        [p.comparator, p.treatment],
      ].map(([treatment, comparator]) => ({ treatment, comparator, certainty: p.certainty, magnitude: "small", statement: statement(statements[`${treatment}/${comparator}`] ?? "statement.low.small.increase", treatment!, comparator!), absolute: null })),
    ),
    pairs: pairs.map((p) => ({ treatment: p.treatment, comparator: p.comparator, network: { estimate: p.estimate, lower: p.lower, upper: p.upper, se: 0.1 }, direct: null, indirect: null, incoherenceP: null, certainty: p.certainty, path: null, footnotes: [], importance: null, riskOfBias: null })),
  } as unknown as OutcomeSnapshot;
}

function version(number: number, summary: string, outcomes: OutcomeSnapshot[]): VersionSnapshot {
  return {
    schemaVersion: 6,
    version: number,
    releaseAt: "2026-12-04T09:00:00.000Z",
    note: number > 1 ? "Two studies added." : null,
    brief: { slug: "sleep-after-shifts", title: "Sleep after night shifts (fictional)", topic: "Sleep", condition: "Shift-work sleep disorder", population: "Adults working nights", demo: true },
    treatments: [
      { label: "usual", displayName: "Usual care" },
      { label: "walk", displayName: "Walking" },
      { label: "light", displayName: "Light sessions" },
    ],
    texts: { shortTakeHtml: "<p>Light may help.</p>", laySummaryHtml: `<p>${summary}</p>` },
    outcomes,
  };
}

const before = version(1, "Light sessions may help people sleep.", [
  outcome(
    ["Ames 2019", "Birch 2021"],
    [
      { treatment: "walk", comparator: "usual", estimate: 0.1, lower: -0.3, upper: 0.5, certainty: "low" },
      { treatment: "light", comparator: "usual", estimate: 0.6, lower: 0.2, upper: 1.0, certainty: "low" },
      { treatment: "light", comparator: "walk", estimate: 0.5, lower: 0.0, upper: 1.0, certainty: "very_low" },
    ],
    [
      { key: "groups.minimal.better.may", treatments: ["light"] },
      { key: "groups.minimal.same.may", treatments: ["walk"] },
    ],
    {},
  ),
]);

// Version 2: a study added; light's estimate moves and its certainty rises; walking's group moves; the
// comparison light vs walking is stored the other way round (walking vs light) with a changed statement.
const after = version(2, "Light sessions probably help people sleep.", [
  outcome(
    ["Ames 2019", "Birch 2021", "Cole 2025"],
    [
      { treatment: "walk", comparator: "usual", estimate: 0.12, lower: -0.26, upper: 0.52, certainty: "low" },
      { treatment: "light", comparator: "usual", estimate: 0.7, lower: 0.4, upper: 1.0, certainty: "moderate" },
      { treatment: "walk", comparator: "light", estimate: -0.5, lower: -1.0, upper: 0.0, certainty: "very_low" },
    ],
    [
      { key: "groups.minimal.better.probably", treatments: ["light"] },
      { key: "groups.minimal.better.may", treatments: ["walk"] },
    ],
    { "walk/light": "statement.veryLow" },
  ),
]);

describe("what changed between two versions", () => {
  const changes = versionChanges(before, after);

  it("lists the texts that changed by field, leaving out the correction note", () => {
    expect(changes.texts).toEqual([{ field: "summary", before: "Light sessions may help people sleep.", after: "Light sessions probably help people sleep." }]);
  });

  it("lists the studies added and removed, each group move, and per comparison what changed", () => {
    expect(changes.outcomes).toHaveLength(1);
    const [sleep] = changes.outcomes;
    expect(sleep!.studies).toEqual({ added: ["Cole 2025"], removed: [] });
    expect(sleep!.groups).toEqual([
      { treatment: "light", from: { key: "groups.minimal.better.may", values: { reference: "usual care" } }, to: { key: "groups.minimal.better.probably", values: { reference: "usual care" } } },
      { treatment: "walk", from: { key: "groups.minimal.same.may", values: { reference: "usual care" } }, to: { key: "groups.minimal.better.may", values: { reference: "usual care" } } },
    ]);
    // Walking vs usual care moved by 0.04 at most, under a tenth of its interval's width (0.8): not listed.
    // Light vs usual care: the lower end moved by 0.2, half of a tenth of 0.8 would be 0.08: listed.
    // Light vs walking, stored the other way round: the same estimate read in the new direction; only its statement changed.
    expect(sleep!.comparisons).toEqual([
      { treatment: "light", comparator: "usual", certainty: { from: "low", to: "moderate" }, estimate: { from: { estimate: 0.6, lower: 0.2, upper: 1.0 }, to: { estimate: 0.7, lower: 0.4, upper: 1.0 } } },
      { treatment: "walk", comparator: "light", statement: { from: statement("statement.low.small.increase", "walk", "light"), to: statement("statement.veryLow", "walk", "light") } },
    ]);
  });

  it("finds nothing between a version and itself, whatever the order of the keys of its stored messages", () => {
    const same = { ...before, outcomes: before.outcomes.map((o) => ({ ...o, groups: o.groups.map((g) => ({ ...g, label: { values: { ...g.label.values }, key: g.label.key } })) })) };
    expect(versionChanges(before, same)).toMatchObject({ texts: [], outcomes: [] });
  });

  it("words the changes with each version's names", () => {
    const view = changesView(changes, before, after);
    expect(view.texts).toEqual([{ field: "summary", name: null }]);
    expect(view.outcomes[0]!.groups.map((g) => g.treatment)).toEqual(["Light sessions", "Walking"]);
    expect(view.outcomes[0]!.comparisons[1]).toMatchObject({ treatment: "Walking", comparator: "Light sessions", statement: statement("statement.veryLow", "walk", "light") });
  });

  it("sums them up in one sentence of each language", () => {
    expect(changeSummary(wordsOf("en", "public"), "en", changes)).toBe(
      "What changed: 1 text rewritten, 1 study added, 2 options moved to another group, certainty changed in 1 comparison, the statement changed in 1 comparison, and the estimate moved in 1 comparison.",
    );
    expect(changeSummary(wordsOf("es", "public"), "es", changes)).toBe(
      "Qué cambió: 1 texto reescrito, 1 estudio añadido, 2 opciones cambiaron de grupo, la certeza cambió en 1 comparación, el enunciado cambió en 1 comparación y la estimación se desplazó en 1 comparación.",
    );
    expect(changeSummary(wordsOf("fr", "public"), "fr", changes)).toBe(
      "Ce qui a changé : 1 texte réécrit, 1 étude ajoutée, 2 options ont changé de groupe, la certitude a changé pour 1 comparaison, l’énoncé a changé pour 1 comparaison et l’estimation s’est déplacée pour 1 comparaison.",
    );
    expect(changeSummary(wordsOf("ar", "public"), "ar", changes)).toBe(
      "ما الذي تغيّر: تغيّر نص واحد وأُضيفت دراسة واحدة وانتقل خياران إلى مجموعة أخرى وتغيّر مستوى اليقين في مقارنة واحدة وتغيّرت العبارة في مقارنة واحدة وتحرّك التقدير في مقارنة واحدة.",
    );
    expect(changeSummary(wordsOf("en", "public"), "en", versionChanges(before, before))).toBe("What changed: no text, study, group, certainty, statement or estimate.");
  });
});

describe("a correction's translation, carried from the last published one", () => {
  it("keeps every field whose source is unchanged, keeps a changed one against its old source, and leaves a new one empty", () => {
    const published = { title: "Dormir tras el turno de noche (ficticio)", summary: "Las sesiones de luz podrían ayudar a dormir.", shortTake: "La luz podría ayudar." };
    const carried = carriedTranslation({ snapshot: before, published }, after);
    expect(carried.published).toEqual({ title: published.title, shortTake: published.shortTake });
    expect(carried.fields.summary).toEqual({ text: published.summary, sourceText: "Light sessions may help people sleep.", sourceHash: sourceHash("Light sessions may help people sleep.") });
    expect(carried.fields.title!.sourceHash).toBe(sourceHash("Sleep after night shifts (fictional)"));
    expect(carried.open).toContain("summary");
    expect(carried.open).toContain("note");
    expect(carried.open).not.toContain("title");
  });
});
