// Reading and validating the three CSV formats of METHODS.md §1. Every broken rule becomes an
// issue naming the line, the column and the rule; up to `issueCap` are reported together.
import { parse } from "csv-parse/sync";
import { pairKey } from "./pairs";
import {
  DatasetError,
  type BinaryArm,
  type ContinuousArm,
  type ContrastRow,
  type DatasetIssue,
  type Format,
  type ParsedDataset,
  type ParsedStudy,
  type RiskOfBias,
} from "./types";

export const issueCap = 50;

const columnsByFormat: Record<Format, string[]> = {
  "arm-binary": ["study", "treatment", "events", "total"],
  "arm-continuous": ["study", "treatment", "mean", "sd", "n"],
  contrast: ["study", "treatment1", "treatment2", "estimate", "se"],
};

/** The optional last column of every format (§1, §13). */
const riskOfBiasColumn = "risk_of_bias";

class IssueList {
  readonly issues: DatasetIssue[] = [];
  add(issue: DatasetIssue): void {
    if (this.issues.length < issueCap) this.issues.push(issue);
  }
  throwIfAny(): void {
    if (this.issues.length > 0) throw new DatasetError(this.issues);
  }
}

function decodeUtf8(input: Uint8Array | string): string {
  if (typeof input === "string") return input;
  try {
    return new TextDecoder("utf-8", { fatal: true }).decode(input);
  } catch {
    throw new DatasetError([{ rule: "not-utf8", message: "the file is not valid UTF-8 text; save it as UTF-8 CSV" }]);
  }
}

/** A record of the file and the line it ends on, as csv-parse gives them with `info`. */
export interface CsvRecord {
  record: string[];
  info: { lines: number };
}

/** Fields trimmed, ragged rows kept (the checks name them), blank lines skipped. */
export const csvOptions = { relax_column_count: true, skip_empty_lines: true, trim: true, info: true } as const;

/**
 * The records of a plain file: no quote, no blank but spaces and tabs, one kind of line break. Such a
 * file is split on its line breaks and commas, with the records csv-parse gives with csvOptions
 * (tests/unit/core/nma/parse.test.ts compares them on generated files), in a fraction of the time a
 * cold process takes to run csv-parse (decision 0049). Null for any other file: csv-parse reads it.
 */
export function splitPlainCsv(text: string): CsvRecord[] | null {
  if (text.includes('"') || /[^\S \t\r\n]/.test(text)) return null;
  const crlf = text.includes("\r");
  if (crlf && /\r(?!\n)|(?<!\r)\n/.test(text)) return null;
  const records: CsvRecord[] = [];
  text.split(crlf ? "\r\n" : "\n").forEach((line, index) => {
    if (line.trim() !== "") records.push({ record: line.split(",").map((field) => field.trim()), info: { lines: index + 1 } });
  });
  return records;
}

export function parseDataset(input: Uint8Array | string, format: Format): ParsedDataset {
  const text = decodeUtf8(input).replace(/^\uFEFF/, "");
  if (text.trim() === "") throw new DatasetError([{ rule: "empty-file", message: "the file is empty" }]);
  const nul = text.indexOf("\u0000");
  if (nul >= 0) {
    // A NUL byte is no character of a text file (and PostgreSQL cannot store one): name its line.
    const row = text.slice(0, nul).split("\n").length;
    throw new DatasetError([{ rule: "nul-byte", row, message: "the line holds a NUL byte, which is not text; save the file as UTF-8 CSV" }]);
  }

  let records: CsvRecord[];
  try {
    records = splitPlainCsv(text) ?? (parse(text, csvOptions) as unknown as CsvRecord[]);
  } catch (error) {
    const line = (error as { lines?: number }).lines;
    throw new DatasetError([
      { rule: "malformed-csv", row: line, facts: { detail: (error as Error).message }, message: `the file is not valid CSV (${(error as Error).message})` },
    ]);
  }

  const required = columnsByFormat[format];
  const [headerRecord, ...rows] = records;
  const header = headerRecord!.record.map((name) => name.toLowerCase());
  const judged = header.includes(riskOfBiasColumn);
  const expected = judged ? [...required, riskOfBiasColumn] : required;
  const missing = required.filter((name) => !header.includes(name));
  const unknown = header.filter((name) => !expected.includes(name));
  if (missing.length > 0 || unknown.length > 0 || header.length !== expected.length) {
    throw new DatasetError([
      {
        rule: "wrong-header",
        row: 1,
        facts: { expected: required.join(","), format, missing: missing.join(", ") || "—", unknown: unknown.join(", ") || "—" },
        message:
          `the header must be ${required.join(",")} (and optionally ${riskOfBiasColumn}) for the ${format} format` +
          (missing.length ? `; missing: ${missing.join(", ")}` : "") +
          (unknown.length ? `; not expected: ${unknown.join(", ")}` : ""),
      },
    ]);
  }
  if (rows.length === 0) throw new DatasetError([{ rule: "no-rows", message: "the file has a header but no data rows" }]);

  const issues = new IssueList();
  const byStudy = new Map<string, Record<string, string | number>[]>();
  const faultyStudies = new Set<string>();
  for (const { record, info } of rows) {
    const line = info.lines;
    if (record.length !== expected.length) {
      issues.add({
        rule: "field-count",
        row: line,
        facts: { found: record.length, expected: expected.length },
        message: `the row has ${record.length} fields, the header has ${expected.length} (a stray comma?)`,
      });
      // The study is already at fault; its other rules would only repeat this row's problem.
      if (record[header.indexOf("study")]) faultyStudies.add(record[header.indexOf("study")]!);
      continue;
    }
    const cells: Record<string, string | number> = { row: line };
    header.forEach((name, index) => (cells[name] = record[index]!));
    if (!cells.study) {
      issues.add({ rule: "missing-value", row: line, column: "study", message: "the study label is empty" });
      continue;
    }
    const list = byStudy.get(String(cells.study)) ?? [];
    list.push(cells);
    byStudy.set(String(cells.study), list);
  }

  const studies: ParsedStudy[] = [];
  for (const [study, cells] of byStudy) {
    if (faultyStudies.has(study)) continue;
    const parsed = readStudy(format, study, cells, issues);
    if (!judged) {
      if (parsed) studies.push(parsed);
      continue;
    }
    const riskOfBias = readRiskOfBias(study, cells, issues);
    if (parsed && riskOfBias !== undefined) studies.push({ ...parsed, riskOfBias });
  }
  issues.throwIfAny();
  return judged ? { format, studies, riskOfBiasColumn: true } : { format, studies };
}

/** "low", "some concerns" or "high" in any case and spacing; empty is "not assessed" (null). */
const riskOfBiasWords: Record<string, RiskOfBias | null> = { "": null, low: "low", "some concerns": "some-concerns", high: "high" };

/**
 * One study's risk of bias (§1): a valid value, the same on every row of the study. Undefined when a
 * row breaks the rule (the issue is recorded), so that the study is not kept.
 */
function readRiskOfBias(study: string, cells: Record<string, string | number>[], issues: IssueList): RiskOfBias | null | undefined {
  let found: { value: RiskOfBias | null; raw: string } | undefined;
  for (const cell of cells) {
    const raw = String(cell[riskOfBiasColumn] ?? "");
    const normalised = raw.toLowerCase().replace(/[\s_-]+/g, " ").trim();
    const row = Number(cell.row);
    if (!(normalised in riskOfBiasWords)) {
      issues.add({ rule: "risk-of-bias-invalid", row, column: riskOfBiasColumn, value: raw, message: `"${raw}" is not a risk of bias: write low, some concerns or high, or leave it empty for not assessed` });
      return undefined;
    }
    const value = riskOfBiasWords[normalised]!;
    if (found && found.value !== value) {
      issues.add({
        rule: "risk-of-bias-differs",
        row,
        column: riskOfBiasColumn,
        value: raw,
        facts: { study, first: found.raw || "—" },
        message: `study ${study} has one risk of bias for the whole study, but this row says "${raw}" where an earlier row says "${found.raw}"`,
      });
      return undefined;
    }
    found ??= { value, raw };
  }
  return found?.value ?? null;
}

function readNumber(
  cells: Record<string, string | number>,
  column: string,
  issues: IssueList,
  rule: { test: (value: number) => boolean; rule: string; message: string },
): number | null {
  const raw = String(cells[column] ?? "");
  const row = Number(cells.row);
  const value = raw === "" ? Number.NaN : Number(raw);
  if (!Number.isFinite(value)) {
    issues.add({ rule: "not-a-number", row, column, value: raw, message: `"${raw}" is not a finite number` });
    return null;
  }
  if (!rule.test(value)) {
    issues.add({ rule: rule.rule, row, column, value: raw, message: rule.message });
    return null;
  }
  return value;
}

const finite = { test: () => true, rule: "not-a-number", message: "" };
const positive = (column: string) => ({ test: (v: number) => v > 0, rule: `${column}-not-positive`, message: `${column} must be greater than 0` });

function readTreatment(cells: Record<string, string | number>, column: string, issues: IssueList): string | null {
  const name = String(cells[column] ?? "");
  if (name === "") {
    issues.add({ rule: "missing-value", row: Number(cells.row), column, message: `the ${column} is empty` });
    return null;
  }
  return name;
}

function readStudy(
  format: Format,
  study: string,
  cells: Record<string, string | number>[],
  issues: IssueList,
): ParsedStudy | null {
  const before = issues.issues.length;
  const firstRow = Number(cells[0]!.row);
  if (format === "contrast") return readContrastStudy(study, cells, issues);

  const seen = new Set<string>();
  const arms: (BinaryArm | ContinuousArm)[] = [];
  for (const cell of cells) {
    const row = Number(cell.row);
    const treatment = readTreatment(cell, "treatment", issues);
    if (treatment === null) continue;
    if (seen.has(treatment)) {
      issues.add({ rule: "duplicate-treatment", row, column: "treatment", value: treatment, facts: { study }, message: `treatment "${treatment}" appears twice in study ${study}` });
      continue;
    }
    seen.add(treatment);
    if (format === "arm-binary") {
      const total = readNumber(cell, "total", issues, { test: (v) => Number.isInteger(v) && v >= 1, rule: "total-invalid", message: "total must be a whole number of at least 1" });
      const events = readNumber(cell, "events", issues, { test: (v) => Number.isInteger(v) && v >= 0, rule: "events-invalid", message: "events must be a whole number of at least 0" });
      if (total === null || events === null) continue;
      if (events > total) {
        issues.add({ rule: "events-exceed-total", row, column: "events", value: String(events), facts: { events, total }, message: `events (${events}) exceed total (${total})` });
        continue;
      }
      arms.push({ treatment, events, total, row });
    } else {
      const mean = readNumber(cell, "mean", issues, finite);
      const sd = readNumber(cell, "sd", issues, positive("sd"));
      const n = readNumber(cell, "n", issues, { test: (v) => Number.isInteger(v) && v >= 2, rule: "n-invalid", message: "n must be a whole number of at least 2" });
      if (mean === null || sd === null || n === null) continue;
      arms.push({ treatment, mean, sd, n, row });
    }
  }
  if (seen.size < 2) {
    issues.add({ rule: "too-few-arms", row: firstRow, column: "study", value: study, message: `study ${study} has fewer than 2 distinct treatments` });
  }
  if (issues.issues.length > before) return null;
  return format === "arm-binary"
    ? { format, study, arms: arms as BinaryArm[] }
    : { format, study, arms: arms as ContinuousArm[] };
}

function readContrastStudy(study: string, cells: Record<string, string | number>[], issues: IssueList): ParsedStudy | null {
  const before = issues.issues.length;
  const contrasts: ContrastRow[] = [];
  const pairs = new Set<string>();
  const treatments: string[] = [];
  for (const cell of cells) {
    const row = Number(cell.row);
    const treatment1 = readTreatment(cell, "treatment1", issues);
    const treatment2 = readTreatment(cell, "treatment2", issues);
    const estimate = readNumber(cell, "estimate", issues, finite);
    const se = readNumber(cell, "se", issues, positive("se"));
    if (treatment1 === null || treatment2 === null || estimate === null || se === null) continue;
    if (treatment1 === treatment2) {
      issues.add({ rule: "same-treatment", row, column: "treatment2", value: treatment2, facts: { treatment: treatment1 }, message: `a comparison of "${treatment1}" with itself` });
      continue;
    }
    const pair = pairKey(treatment1, treatment2);
    if (pairs.has(pair)) {
      issues.add({ rule: "duplicate-comparison", row, column: "treatment1", facts: { treatment1, treatment2, study }, message: `the comparison ${treatment1} vs ${treatment2} appears twice in study ${study}` });
      continue;
    }
    pairs.add(pair);
    for (const t of [treatment1, treatment2]) if (!treatments.includes(t)) treatments.push(t);
    contrasts.push({ treatment1, treatment2, estimate, se, row });
  }
  if (issues.issues.length > before) return null;
  const k = treatments.length;
  if (contrasts.length !== (k * (k - 1)) / 2) {
    issues.add({
      rule: "incomplete-multi-arm",
      row: Number(cells[0]!.row),
      column: "study",
      value: study,
      facts: { treatments: k, pairs: (k * (k - 1)) / 2, listed: contrasts.length },
      message: `study ${study} has ${k} treatments, so it must list all ${(k * (k - 1)) / 2} pairs; it lists ${contrasts.length}`,
    });
    return null;
  }
  return { format: "contrast", study, contrasts };
}
