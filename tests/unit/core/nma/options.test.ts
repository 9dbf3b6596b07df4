// Which measures go with which input format (server/core/nma/options.ts, METHODS.md §2).
import { describe, expect, it } from "vitest";
import { measuresByFormat } from "#core/nma/options";

describe("measures by format", () => {
  it("binary arms take odds ratios, risk ratios and risk differences; continuous arms mean differences; contrasts any scale", () => {
    expect(measuresByFormat).toEqual({ "arm-binary": ["OR", "RR", "RD"], "arm-continuous": ["MD"], contrast: ["OR", "RR", "RD", "MD"] });
  });
});
