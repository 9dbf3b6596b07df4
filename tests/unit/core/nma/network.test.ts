// The network's shape (server/core/nma/network.ts, METHODS.md §1): its treatments, and whether the
// studies join them into one network; a disconnected network is refused, naming its parts.
import { describe, expect, it } from "vitest";
import { assertConnected, subNetworks, treatmentsOf } from "#core/nma/network";
import { DatasetError, type ArmEffects } from "#core/nma/types";

const study = (...treatments: string[]): ArmEffects => ({ study: treatments.join("-"), treatments, effects: treatments.map(() => 0), variances: treatments.map(() => 1), participants: treatments.map(() => null) });

describe("the network", () => {
  it("lists its treatments once each, in order", () => {
    expect(treatmentsOf([study("placebo", "walking"), study("walking", "light", "placebo")])).toEqual(["light", "placebo", "walking"]);
  });

  it("is one network when studies join every treatment, through a multi-arm study too", () => {
    const studies = [study("a", "b"), study("c", "d"), study("b", "c", "e")];
    expect(subNetworks(studies)).toEqual([["a", "b", "c", "d", "e"]]);
    expect(() => assertConnected(studies)).not.toThrow();
  });

  it("names its parts, largest first, when nothing joins them", () => {
    const studies = [study("a", "b"), study("b", "c"), study("x", "y")];
    expect(subNetworks(studies)).toEqual([["a", "b", "c"], ["x", "y"]]);
    expect(() => assertConnected(studies)).toThrow(DatasetError);
    expect(() => assertConnected(studies)).toThrow("the network is not connected; its sub-networks are {a, b, c} and {x, y}");
  });
});
