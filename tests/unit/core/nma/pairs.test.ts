// Pairs of treatments (server/core/nma/pairs.ts): one key for a vs b and b vs a, an interval read the
// other way, and a pair found in a list whichever way it is listed.
import { describe, expect, it } from "vitest";
import { flipInterval, pairFinder, pairKey } from "#core/nma/pairs";

describe("pairs", () => {
  it("have one key whichever way they are named", () => {
    expect(pairKey("light", "usual_care")).toBe(pairKey("usual_care", "light"));
    expect(pairKey("a", "b")).not.toBe(pairKey("a", "c"));
  });

  it("read the other way with the estimate's sign turned and the bounds swapped", () => {
    expect(flipInterval({ estimate: 0.4, lower: 0.2, upper: 0.6, se: 0.1 })).toEqual({ estimate: -0.4, lower: -0.6, upper: -0.2, se: 0.1 });
  });

  it("are found in a list either way, saying when the list holds the other way round", () => {
    const items = [{ treatment: "a", comparator: "b", n: 1 }];
    const find = pairFinder(items);
    expect(find("a", "b")).toEqual({ item: items[0], flipped: false });
    expect(find("b", "a")).toEqual({ item: items[0], flipped: true });
    expect(find("a", "a")).toBeNull();
    expect(find("a", "c")).toBeNull();
  });
});
