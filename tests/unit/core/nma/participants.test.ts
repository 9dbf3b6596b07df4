// Participants behind a direct comparison (server/core/nma/participants.ts): the people in the two
// arms of every study that compares them, counted by hand here, leaving out studies the analysis left out.
import { describe, expect, it } from "vitest";
import { directParticipants } from "#core/nma/participants";
import type { ParsedStudy } from "#core/nma/types";

const binary = (study: string, arms: [string, number, number][]): ParsedStudy => ({ format: "arm-binary", study, arms: arms.map(([treatment, events, total], row) => ({ treatment, events, total, row })) });
const studies = [binary("s1", [["a", 5, 100], ["b", 8, 120]]), binary("s2", [["a", 2, 40], ["b", 3, 60], ["c", 4, 50]]), binary("s3", [["a", 0, 30], ["b", 0, 30]]), binary("s4", [["a", 1, 10], ["c", 2, 10]])];

describe("participants of a direct comparison", () => {
  it("add the two arms of each study that compares them, never a third arm: 220 + 100 + 60 = 380 for a vs b", () => {
    expect(directParticipants(studies, [], "a", "b")).toBe(380);
    // A study the analysis left out (no events in any arm) counts nobody.
    expect(directParticipants(studies, ["s3"], "a", "b")).toBe(320);
  });

  it("are none for a pair no study compares, and unknown for data given as contrasts", () => {
    expect(directParticipants(studies, [], "b", "d")).toBe(0);
    expect(directParticipants([{ format: "contrast", study: "k", contrasts: [] }], [], "a", "b")).toBeNull();
  });
});
