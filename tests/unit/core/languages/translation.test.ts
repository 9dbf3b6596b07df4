// Translations of a released version (server/core/languages/translation.ts): a field's translation
// remembers the source it was written for, so a changed source is flagged with a word diff, and a
// translation is ready only with every required field filled and none stale.
import { describe, expect, it } from "vitest";
import { fieldViews, sourceHash, storedAfterSave, unfinished, wordDiff, type SourceField } from "#core/languages/translation";

const sources: SourceField[] = [
  { name: "title", kind: "line", text: "Sleeping well after night shifts", html: null },
  { name: "treatmentPhrase:light", kind: "grammar", text: "timed bright-light sessions", html: null, optional: true },
];

describe("a translation's fields", () => {
  it("keep the source each was written for, and a field left alone keeps its own", () => {
    const saved = storedAfterSave(sources, {}, { title: "Dormir bien después del turno de noche" });
    expect(saved).toEqual({ title: { text: "Dormir bien después del turno de noche", sourceHash: sourceHash("Sleeping well after night shifts"), sourceText: "Sleeping well after night shifts" } });
    expect(storedAfterSave(sources, saved, {})).toEqual(saved);
  });

  it("are flagged stale, with the words that changed, when the source changed since", () => {
    const saved = storedAfterSave(sources, {}, { title: "Dormir bien después del turno de noche" });
    const changed = [{ ...sources[0]!, text: "Sleeping well after evening shifts" }, sources[1]!];
    const [title] = fieldViews(changed, saved);
    expect(title!.stale).toBe(true);
    expect(title!.diff).toEqual([
      { text: "Sleeping well after ", change: "same" },
      { text: "night", change: "removed" },
      { text: "evening", change: "added" },
      { text: " shifts", change: "same" },
    ]);
    expect(unfinished(fieldViews(changed, saved))).toEqual({ empty: [], stale: ["title"] });
  });

  it("are unfinished while a required field is empty; an optional one may stay empty", () => {
    expect(unfinished(fieldViews(sources, {}))).toEqual({ empty: ["title"], stale: [] });
  });

  it("diff word by word", () => {
    expect(wordDiff("a b", "a b")).toEqual([{ text: "a b", change: "same" }]);
  });
});
