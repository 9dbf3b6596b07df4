// CSV downloads neutralise cells a spreadsheet would run as a formula (OWASP, "CSV Injection":
// prefix a single quote to cells starting with =, +, -, @, tab or carriage return).
import { describe, expect, it } from "vitest";
import { neutralise } from "#web/public/downloads";

describe("neutralising CSV cells", () => {
  it.each(["=SUM(A1:A2)", "+1+1", "-2+3", "@cmd", "\tx", "\rx"])("prefixes %j with a quote", (cell) => {
    expect(neutralise(cell)).toBe(`'${cell}`);
  });

  it("leaves ordinary text and numbers, negative ones included, as they are", () => {
    expect(neutralise("usual_care")).toBe("usual_care");
    expect(neutralise(-0.25)).toBe(-0.25);
    expect(neutralise(null)).toBe(null);
  });
});
