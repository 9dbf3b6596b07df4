// The editor's texts read against the findings (server/core/editorial/claims.ts): each warning names the text,
// the sentence, the treatment as matched and why. Findings here are invented for the test.
import { describe, expect, it } from "vitest";
import { createI18n } from "#components/i18n";
import { textClaims, type ClaimFacts } from "#core/editorial/claims";
import type { Rating } from "#core/grade/certainty";

const treatments = [
  { label: "usual", displayName: "Usual care" },
  { label: "combined", displayName: "Light sessions with nap schedule" },
  { label: "k", displayName: "Sleep aid K (fictional)" },
  { label: "m", displayName: "Sleep aid M (fictional)" },
  { label: "nap", displayName: "Planned-nap schedule" },
];
const outcome = (certainty: Record<string, Rating | null>, level: Record<string, number>): ClaimFacts["outcomes"][number] => ({
  name: "Good sleep",
  reference: "usual",
  certainty: new Map(Object.entries(certainty)),
  level: new Map(Object.entries(level)),
});
// Combined: very low certainty, listed apart (level 0); K: moderate, a benefit; M: low, not shown to differ; nap: low, a benefit.
const findings = [outcome({ combined: "very_low", k: "moderate", m: "low", nap: "low" }, { usual: 0, combined: 0, k: 2, m: 0, nap: 1 })];
const check = (shortTake: string, laySummary = "") => textClaims({ texts: [{ field: "shortTake", markdown: shortTake }, { field: "laySummary", markdown: laySummary }], treatments, outcomes: findings });
const say = (item: { key: string; values: Record<string, string | number> }) => createI18n("en").t(item.key, item.values);

describe("a certainty word beside a treatment", () => {
  it("is flagged where it differs from the computed certainty against the reference", () => {
    const items = check("- Light sessions with nap schedule and sleep aid K probably help people sleep well: a large benefit compared with usual care (moderate certainty).");
    expect(items.map((i) => [i.key, i.values.treatment])).toEqual([
      ["readiness.claim.certainty", "Light sessions with nap schedule"],
      // It also calls that option a benefit, which its group (listed apart, very uncertain) does not show.
      ["readiness.claim.noDifference", "Light sessions with nap schedule"],
    ]);
    expect(say(items[0]!)).toBe(
      "The short take gives Light sessions with nap schedule “Moderate” certainty in “Light sessions with nap schedule and sleep aid K probably help people sleep well: a large…”, but against the reference the analysis rates it Very low.",
    );
  });

  it("matches names as readers write them: without “(fictional)”, in any case, with or without accents", () => {
    expect(check("SLEEP AÍD K may help (low certainty).").map((i) => i.values.treatment)).toEqual(["Sleep aid K (fictional)"]);
    expect(check("Sleep aid K probably helps (moderate certainty).")).toEqual([]);
  });

  it("reads “very low certainty” as very low, not as low", () => {
    expect(check("The evidence on light sessions with nap schedule is of very low certainty.")).toEqual([]);
  });
});

describe("rank claims and rank scores used as evidence", () => {
  it("flags “the best”, “ranked first” and a SUCRA beside a treatment", () => {
    const items = check("Sleep aid M is the best treatment (high certainty): it ranked first, with the highest SUCRA.");
    expect(items.map((i) => i.key)).toEqual(["readiness.claim.certainty", "readiness.claim.rank"]);
    expect(say(items[1]!)).toBe(
      "The short take makes a rank claim (“best”) about Sleep aid M (fictional) in “Sleep aid M is the best treatment (high certainty): it ranked first, with the highest SUC…”: rank scores are not proof; say what the groups and their certainty support.",
    );
  });

  it("leaves a caution about rank scores that names no treatment", () => {
    expect(check('Scores that place options "first" or "last" are not proof: read the groups and the certainty instead.')).toEqual([]);
  });
});

describe("benefit claimed where the group shows no difference", () => {
  it("flags a treatment called helpful whose group is not shown to differ, in either text", () => {
    const items = check("", "Sleep aid M helps people sleep.");
    expect(items).toHaveLength(1);
    expect(say(items[0]!)).toBe("The plain-language summary says Sleep aid M (fictional) “helps” in “Sleep aid M helps people sleep.”, but its group does not show it to differ from the reference.");
  });

  it("does not read a negated sentence as a claim", () => {
    expect(check("Sleep aid M did not show a clear benefit.")).toEqual([]);
  });

  it("flags “every option gives some benefit” when some are not shown to differ", () => {
    const items = check("- Every option in this fictional network gives some benefit compared with usual care.");
    expect(items.map((i) => i.key)).toEqual(["readiness.claim.every"]);
    expect(say(items[0]!)).toBe(
      "The short take says every option gives a benefit in “Every option in this fictional network gives some benefit compared with usual care.”, but 2 options are not shown to differ from the reference: Light sessions with nap schedule, Sleep aid M (fictional).",
    );
  });
});
