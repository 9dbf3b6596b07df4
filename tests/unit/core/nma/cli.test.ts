// The command line of METHODS.md §11: JSON on stdout and exit 0; bad input exit 1 with one line; bad arguments exit 2.
import { spawnSync } from "node:child_process";
import { existsSync, mkdtempSync, readFileSync, writeFileSync } from "node:fs";
import { tmpdir } from "node:os";
import path from "node:path";
import { describe, expect, it } from "vitest";

const root = path.resolve(__dirname, "../../../..");
const hasselblad = path.resolve(root, "tests/fixtures/reference/hasselblad1998.csv");

/** As `npm run nma` runs it: the prebuilt bundle, built first when missing or stale. */
function nma(args: string[]) {
  const result = spawnSync(process.execPath, [path.join(root, "scripts/nma.cjs"), ...args], { encoding: "utf8" });
  return { code: result.status, stdout: result.stdout, stderr: result.stderr };
}

const base = ["--format", "arm-binary", "--measure", "OR", "--model", "random", "--reference", "no_contact", "--better", "higher"];

describe("npm run nma", () => {
  it("prints one JSON object with the fields of the contract", () => {
    const { code, stdout, stderr } = nma(["--input", hasselblad, ...base, "--draws", "500", "--seed", "3"]);
    expect(stderr).toBe("");
    expect(code).toBe(0);
    const result = JSON.parse(stdout);
    expect(result).toMatchObject({ reference: "no_contact", measure: "OR", model: "random", studies: 24, excludedStudies: [] });
    expect(result.tau2).toBeCloseTo(0.450230095693024, 5); // metafor 3.8-1, tests/fixtures/reference
    expect(result.ranking).toMatchObject({ draws: 500, seed: 3 });
    expect(Object.keys(result.comparisons[0])).toEqual(expect.arrayContaining(["treatment", "comparator", "network", "direct", "indirect", "incoherence"]));
    expect(Object.keys(result.inconsistency)).toEqual(expect.arrayContaining(["Qwithin", "dfWithin", "Qbetween", "dfBetween", "pBetween"]));
  }, 30_000);

  it("matches the §13 reference values on the file with a risk-of-bias column (metafor 3.8-1 + base R)", () => {
    const file = path.resolve(root, "tests/fixtures/reference/hasselblad1998-rob.csv");
    const expected = JSON.parse(readFileSync(path.resolve(root, "tests/fixtures/reference/hasselblad1998-rob.expected.json"), "utf8"));
    for (const model of ["fixed", "random"] as const) {
      const { code, stdout } = nma(["--input", file, ...base.slice(0, 5), model, ...base.slice(6), "--draws", "200"]);
      expect(code).toBe(0);
      const result = JSON.parse(stdout);
      for (const pair of expected[model].comparisons) {
        const actual = result.comparisons.find((c: { treatment: string; comparator: string }) => c.treatment === pair.treatment && c.comparator === pair.comparator);
        expect(actual.importance.map((s: { study: string }) => s.study)).toEqual(pair.importance.map((s: { study: string }) => s.study));
        pair.importance.forEach((s: { value: number }, i: number) => expect(Math.abs(actual.importance[i].value - s.value) / s.value).toBeLessThan(model === "fixed" ? 1e-6 : 1e-4));
        expect(Object.keys(actual.riskOfBias).sort()).toEqual(["high", "low", "notAssessed", "someConcerns", "suggestedLevels"]);
        expect(actual.riskOfBias.suggestedLevels).toBe(pair.riskOfBias.suggestedLevels);
      }
    }
  }, 30_000);

  it("exits 1 with a one-line reason for bad input", () => {
    const folder = mkdtempSync(path.join(tmpdir(), "nma-cli-"));
    const file = path.join(folder, "bad.csv");
    writeFileSync(file, "study,treatment,events,total\nS1,a,12,10\nS1,b,1,10\n");
    const { code, stdout, stderr } = nma(["--input", file, ...base.slice(0, 6), "--reference", "a", "--better", "higher"]);
    expect(code).toBe(1);
    expect(stdout).toBe("");
    expect(stderr).toBe("line 2, column events: events (12) exceed total (10)\n");
  }, 30_000);

  it("exits 1 when the file cannot be read", () => {
    const { code, stderr } = nma(["--input", "/nonexistent.csv", ...base]);
    expect(code).toBe(1);
    expect(stderr).toBe("cannot read /nonexistent.csv: ENOENT\n");
  }, 30_000);

  it("exits 2 for bad arguments, naming them", () => {
    expect(nma(["--input", hasselblad, ...base.slice(0, 8), "--better", "sideways"])).toMatchObject({ code: 2, stderr: "--better must be higher or lower\n" });
    expect(nma(["--input", hasselblad, "--format", "arm-continuous", "--measure", "OR", "--model", "fixed", "--reference", "x", "--better", "higher"]).code).toBe(2);
    expect(nma(["--input", hasselblad, ...base, "--unknown", "1"]).code).toBe(2);
    // The generator takes a 32-bit seed other than 0.
    expect(nma(["--input", hasselblad, ...base, "--seed", "0"])).toMatchObject({ code: 2, stderr: "--seed must be from 1 to 4294967295\n" });
    expect(nma(["--input", hasselblad, ...base, "--seed", "4294967296"])).toMatchObject({ code: 2, stderr: "--seed must be from 1 to 4294967295\n" });
  }, 30_000);

  it("answers the same through the code cache its first successful run writes", () => {
    const args = ["--input", hasselblad, ...base, "--draws", "300"];
    const first = nma(args);
    expect(first.code).toBe(0);
    expect(existsSync(path.join(root, "dist/cli/nma.cjs.cache"))).toBe(true);
    const second = nma(args);
    expect(second).toEqual(first);
  }, 30_000);
});
