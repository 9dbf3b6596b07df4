// Validation of the input formats (METHODS.md §1): each broken rule names the line, column and rule.
import normal from "@stdlib/random-base-normal";
import { parse } from "csv-parse/sync";
import { describe, expect, it } from "vitest";
import { armEffects } from "#core/nma/contrasts";
import { analyse } from "#core/nma/analyse";
import { csvOptions, issueCap, parseDataset, splitPlainCsv, type CsvRecord } from "#core/nma/parse";
import { DatasetError, type DatasetIssue, type Format } from "#core/nma/types";

function issuesOf(run: () => unknown): DatasetIssue[] {
  try {
    run();
  } catch (error) {
    if (error instanceof DatasetError) return error.issues;
    throw error;
  }
  throw new Error("expected a DatasetError");
}

const parseIssues = (text: string | Uint8Array, format: Format = "arm-binary") => issuesOf(() => parseDataset(text, format));

const binaryHeader = "study,treatment,events,total\n";

describe("file-level rules", () => {
  it("rejects an empty file", () => {
    expect(parseIssues("")).toEqual([{ rule: "empty-file", message: "the file is empty" }]);
  });

  it("rejects a header without rows", () => {
    expect(parseIssues(binaryHeader)[0]?.rule).toBe("no-rows");
  });

  it("names the missing and unexpected columns of a wrong header", () => {
    const [issue] = parseIssues("study,treatment,mean,total\nS1,a,1,10\n");
    expect(issue).toMatchObject({ rule: "wrong-header", row: 1 });
    expect(issue?.message).toContain("missing: events");
    expect(issue?.message).toContain("not expected: mean");
  });

  it("rejects a file that is not UTF-8", () => {
    const latin1 = Uint8Array.from([...Buffer.from(binaryHeader), ...Buffer.from("S1,caf"), 0xe9, ...Buffer.from(",1,10\n")]);
    expect(parseIssues(latin1)[0]?.rule).toBe("not-utf8");
  });

  it("accepts a UTF-8 byte-order mark and CRLF line ends", () => {
    const dataset = parseDataset(`\uFEFF${binaryHeader}S1,a,1,10\r\nS1,b,2,10\r\n`.replace("\n", "\r\n"), "arm-binary");
    expect(dataset.studies).toHaveLength(1);
  });

  it("names the line of a row with a stray delimiter", () => {
    expect(parseIssues(`${binaryHeader}S1,a,1,10\nS1,b,2,10,\n`)).toEqual([
      expect.objectContaining({ rule: "field-count", row: 3 }),
    ]);
  });
});

describe("row and study rules", () => {
  it("rejects a treatment listed twice in one study", () => {
    expect(parseIssues(`${binaryHeader}S1,a,1,10\nS1,a,2,10\nS1,b,2,10\n`)).toEqual([
      expect.objectContaining({ rule: "duplicate-treatment", row: 3, column: "treatment", value: "a" }),
    ]);
  });

  it("rejects a study with one arm", () => {
    expect(parseIssues(`${binaryHeader}S1,a,1,10\nS2,a,1,10\nS2,b,1,10\n`)).toEqual([
      expect.objectContaining({ rule: "too-few-arms", row: 2, value: "S1" }),
    ]);
  });

  it("rejects events above the total", () => {
    expect(parseIssues(`${binaryHeader}S1,a,11,10\nS1,b,2,10\n`)).toEqual([
      expect.objectContaining({ rule: "events-exceed-total", row: 2, column: "events" }),
    ]);
  });

  it("rejects negative, fractional and non-finite numbers, naming each", () => {
    const issues = parseIssues(`${binaryHeader}S1,a,-1,10\nS1,b,2.5,10\nS2,a,1,Infinity\nS2,b,1,abc\n`);
    expect(issues.map((i) => [i.row, i.column, i.rule])).toEqual([
      [2, "events", "events-invalid"],
      [3, "events", "events-invalid"],
      [4, "total", "not-a-number"],
      [5, "total", "not-a-number"],
    ]);
  });

  it("rejects sd ≤ 0 and n < 2 for continuous arms", () => {
    const issues = parseIssues("study,treatment,mean,sd,n\nS1,a,1,0,10\nS1,b,1,1,1\n", "arm-continuous");
    expect(issues.map((i) => [i.row, i.column, i.rule])).toEqual([
      [2, "sd", "sd-not-positive"],
      [3, "n", "n-invalid"],
    ]);
  });

  it("reports several problems together, up to the cap", () => {
    const rows = Array.from({ length: issueCap + 10 }, (_, i) => `S${i},a,-1,10\nS${i},b,1,10`).join("\n");
    expect(parseIssues(`${binaryHeader}${rows}\n`)).toHaveLength(issueCap);
  });
});

describe("contrast format", () => {
  const header = "study,treatment1,treatment2,estimate,se\n";

  it("requires every pair of a multi-arm study", () => {
    expect(parseIssues(`${header}S1,a,b,0.1,0.2\nS1,a,c,0.3,0.2\n`, "contrast")).toEqual([
      expect.objectContaining({ rule: "incomplete-multi-arm", value: "S1" }),
    ]);
  });

  it("rejects se ≤ 0", () => {
    expect(parseIssues(`${header}S1,a,b,0.1,0\n`, "contrast")).toEqual([
      expect.objectContaining({ rule: "se-not-positive", row: 2, column: "se" }),
    ]);
  });

  it("reconstructs arm effects of a consistent three-arm study by least squares", () => {
    // b − a = 0.5, c − a = 0.8, so c − b = 0.3; arm variances 0.01, 0.02, 0.03 give se² = s_j + s_k.
    const text = `${header}S1,b,a,0.5,${Math.sqrt(0.03)}\nS1,c,a,0.8,${Math.sqrt(0.04)}\nS1,c,b,0.3,${Math.sqrt(0.05)}\n`;
    const [study] = armEffects(parseDataset(text, "contrast").studies, "MD").studies;
    expect(study?.treatments).toEqual(["b", "a", "c"]);
    study!.effects.forEach((value, i) => expect(value).toBeCloseTo([0, -0.5, 0.3][i]!, 12));
    study!.variances.forEach((value, i) => expect(value).toBeCloseTo([0.02, 0.01, 0.03][i]!, 12));
  });

  it("rejects a three-arm study whose comparisons do not add up", () => {
    const text = `${header}S1,b,a,0.5,0.2\nS1,c,a,0.8,0.2\nS1,c,b,0.9,0.2\n`;
    expect(issuesOf(() => armEffects(parseDataset(text, "contrast").studies, "MD"))).toEqual([
      expect.objectContaining({ rule: "inconsistent-multi-arm", value: "S1" }),
    ]);
  });
});

describe("network rules", () => {
  it("names the sub-networks of a disconnected network", () => {
    const dataset = parseDataset(`${binaryHeader}S1,a,1,10\nS1,b,2,10\nS2,c,1,10\nS2,d,2,10\n`, "arm-binary");
    const [issue] = issuesOf(() => analyse(dataset, { measure: "OR", model: "fixed", reference: "a", better: "higher" }));
    expect(issue).toMatchObject({ rule: "disconnected-network" });
    expect(issue?.message).toContain("{a, b} and {c, d}");
  });

  it("excludes and reports a study with no events in any arm (OR), and corrects zero cells elsewhere", () => {
    const dataset = parseDataset(`${binaryHeader}S1,a,0,10\nS1,b,0,12\nS2,a,0,10\nS2,b,3,10\nS3,a,2,10\nS3,b,4,10\n`, "arm-binary");
    const result = analyse(dataset, { measure: "OR", model: "fixed", reference: "a", better: "higher" });
    expect(result.excludedStudies).toEqual(["S1"]);
    expect(result.studies).toBe(2);
    // S2 with 0.5 added to every cell: log((3.5/7.5)/(0.5/10.5)); S3 as it is: log((4/6)/(2/8)).
    const s2 = { y: Math.log(3.5 / 7.5) - Math.log(0.5 / 10.5), v: 1 / 3.5 + 1 / 7.5 + 1 / 0.5 + 1 / 10.5 };
    const s3 = { y: Math.log(4 / 6) - Math.log(2 / 8), v: 1 / 4 + 1 / 6 + 1 / 2 + 1 / 8 };
    const pooled = (s2.y / s2.v + s3.y / s3.v) / (1 / s2.v + 1 / s3.v);
    expect(result.comparisons[0]!.network.estimate).toBeCloseTo(-pooled, 12);
  });

  it("keeps a double-zero study for RD, where the correction enters the variance only", () => {
    const dataset = parseDataset(`${binaryHeader}S1,a,0,10\nS1,b,0,12\nS2,a,1,10\nS2,b,3,10\n`, "arm-binary");
    const result = analyse(dataset, { measure: "RD", model: "fixed", reference: "a", better: "lower" });
    expect(result.excludedStudies).toEqual([]);
    expect(result.studies).toBe(2);
  });

  it("names an unknown reference", () => {
    const dataset = parseDataset(`${binaryHeader}S1,a,1,10\nS1,b,2,10\n`, "arm-binary");
    const [issue] = issuesOf(() => analyse(dataset, { measure: "OR", model: "fixed", reference: "placebo", better: "higher" }));
    expect(issue).toMatchObject({ rule: "unknown-reference", value: "placebo" });
  });
});

describe("the optional risk_of_bias column (METHODS.md §1, §13)", () => {
  const header = "study,treatment,events,total,risk_of_bias\n";

  it("reads low, some concerns and high in any case, and empty as not assessed", () => {
    const dataset = parseDataset(`${header}S1,a,1,10,Low\nS1,b,2,10,LOW\nS2,a,1,10,Some Concerns\nS2,b,2,10,some concerns\nS3,a,1,10,high\nS3,b,2,10,High\nS4,a,1,10,\nS4,b,2,10,\n`, "arm-binary");
    expect(dataset.riskOfBiasColumn).toBe(true);
    expect(dataset.studies.map((s) => s.riskOfBias)).toEqual(["low", "some-concerns", "high", null]);
  });

  it("is optional in every format, and absent without the column", () => {
    expect(parseDataset("study,treatment,mean,sd,n,risk_of_bias\nS1,a,1,1,10,high\nS1,b,2,1,10,high\n", "arm-continuous").studies[0]?.riskOfBias).toBe("high");
    expect(parseDataset("study,treatment1,treatment2,estimate,se,risk_of_bias\nS1,a,b,0.2,0.1,low\n", "contrast").studies[0]?.riskOfBias).toBe("low");
    const plain = parseDataset(`${binaryHeader}S1,a,1,10\nS1,b,2,10\n`, "arm-binary");
    expect(plain.riskOfBiasColumn).toBeUndefined();
    expect(plain.studies[0]).not.toHaveProperty("riskOfBias");
  });

  it("names the row of a value that is not a risk of bias", () => {
    expect(parseIssues(`${header}S1,a,1,10,low\nS1,b,2,10,unclear\n`)).toEqual([
      expect.objectContaining({ rule: "risk-of-bias-invalid", row: 3, column: "risk_of_bias", value: "unclear" }),
    ]);
  });

  it("refuses a study whose rows disagree, naming the row and the study", () => {
    const [issue] = parseIssues(`${header}S1,a,1,10,low\nS1,b,2,10,high\n`);
    expect(issue).toMatchObject({ rule: "risk-of-bias-differs", row: 3, column: "risk_of_bias", value: "high", facts: { study: "S1", first: "low" } });
    expect(issue?.message).toContain("study S1");
  });

  it("keeps the judgement through the engine: studies left out carry none", () => {
    const dataset = parseDataset(`${header}S1,a,1,10,low\nS1,b,2,10,low\nS2,a,0,10,high\nS2,b,0,10,high\n`, "arm-binary");
    const { studies, excluded } = armEffects(dataset.studies, "OR");
    expect(studies.map((s) => [s.study, s.riskOfBias])).toEqual([["S1", "low"]]);
    expect(excluded).toEqual([{ study: "S2", reason: "no-events" }]);
  });
});

describe("the plain files read without csv-parse", () => {
  const csvParse = (text: string) => (parse(text, csvOptions) as unknown as CsvRecord[]).map(({ record, info }) => ({ record, info: { lines: info.lines } }));

  it("give csv-parse's records and lines, on 3 000 generated files of fields, blanks and blank lines", () => {
    // A seeded generator of small files from the characters that matter: fields, commas, blanks, breaks.
    const uniform = normal.factory(0, 1, { seed: 5 }).PRNG as () => number;
    const pick = <T,>(items: readonly T[]) => items[Math.floor(uniform() * items.length)]!;
    for (let file = 0; file < 3000; file++) {
      const lineBreak = pick(["\n", "\r\n"]);
      const lines = Array.from({ length: 1 + Math.floor(uniform() * 6) }, () =>
        Array.from({ length: Math.floor(uniform() * 12) }, () => pick(["a", "b1", "S 2", ",", ",", " ", "\t", "-0.5"])).join(""),
      );
      const text = lines.join(lineBreak) + pick(["", lineBreak, lineBreak + lineBreak]);
      expect(splitPlainCsv(text), JSON.stringify(text)).toEqual(csvParse(text));
    }
  });

  it("are only those without quotes, other blanks or mixed line breaks", () => {
    expect(splitPlainCsv('a,"b"\n')).toBeNull();
    expect(splitPlainCsv("a,\u00a0b\n")).toBeNull();
    expect(splitPlainCsv("a,b\vc\n")).toBeNull();
    expect(splitPlainCsv("a,b\r\nc,d\n")).toBeNull();
    expect(splitPlainCsv("a,b\rc,d\r")).toBeNull();
    expect(splitPlainCsv("a, b\r\n\r\n c,d\r\n")).toEqual([
      { record: ["a", "b"], info: { lines: 1 } },
      { record: ["c", "d"], info: { lines: 3 } },
    ]);
  });
});
