// A stored analysis result is read in this engine's shape only when this engine version wrote it
// (server/core/nma/stored-result.ts); another version's result counts as none until analysed again.
import { readFileSync } from "node:fs";
import path from "node:path";
import { describe, expect, it } from "vitest";
import { analyse, engineVersion } from "#core/nma/analyse";
import { parseDataset } from "#core/nma/parse";
import { readStoredResult } from "#core/nma/stored-result";

const csv = readFileSync(path.resolve(__dirname, "../../../fixtures/reference/hasselblad1998.csv"));

describe("a stored result", () => {
  const result = analyse(parseDataset(csv, "arm-binary"), { measure: "OR", model: "fixed", reference: "no_contact", better: "higher" });

  it("is read as it was written when this engine version wrote it", () => {
    expect(readStoredResult({ engineVersion, result: JSON.parse(JSON.stringify(result)) })).toEqual(JSON.parse(JSON.stringify(result)));
  });

  it("is no result when another engine version wrote it, whatever its shape", () => {
    expect(readStoredResult({ engineVersion: "0.9.0", result })).toBeNull();
    expect(readStoredResult({ engineVersion: "0.9.0", result: { treatments: "an older shape" } })).toBeNull();
  });
});
