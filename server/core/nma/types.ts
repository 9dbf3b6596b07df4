// The engine's vocabulary. Estimates are on the analysis scale (log OR, log RR, RD or MD).

export const formats = ["arm-binary", "arm-continuous", "contrast"] as const;
export type Format = (typeof formats)[number];

export const measures = ["OR", "RR", "RD", "MD"] as const;
export type Measure = (typeof measures)[number];

export type Model = "fixed" | "random";

/** The overall judgements of RoB 2 (Sterne et al., BMJ 2019;366:l4898), as the optional `risk_of_bias` column gives them (§1). */
export const riskOfBiasLevels = ["low", "some-concerns", "high"] as const;
export type RiskOfBias = (typeof riskOfBiasLevels)[number];
export type Better = "higher" | "lower";

/** One problem with the input, naming the line of the file (the header is line 1) and the column. */
export interface DatasetIssue {
  /** A stable key for the interface to translate, e.g. "events-exceed-total". */
  rule: string;
  message: string;
  row?: number;
  column?: string;
  value?: string;
  /** What else the message says (counts, names), for the interface to say in the reader's language. */
  facts?: Record<string, string | number>;
}

export class DatasetError extends Error {
  constructor(readonly issues: DatasetIssue[]) {
    super(issues.map(formatIssue).join("; "));
    this.name = "DatasetError";
  }
}

export function formatIssue(issue: DatasetIssue): string {
  const where = [issue.row !== undefined ? `line ${issue.row}` : null, issue.column ? `column ${issue.column}` : null]
    .filter(Boolean)
    .join(", ");
  return where ? `${where}: ${issue.message}` : issue.message;
}

export interface BinaryArm {
  treatment: string;
  events: number;
  total: number;
  row: number;
}

export interface ContinuousArm {
  treatment: string;
  mean: number;
  sd: number;
  n: number;
  row: number;
}

export interface ContrastRow {
  treatment1: string;
  treatment2: string;
  estimate: number;
  se: number;
  row: number;
}

/** Where the file has a `risk_of_bias` column, each study's judgement (null: not assessed); absent without the column. */
interface Judged {
  riskOfBias?: RiskOfBias | null;
}

export type ParsedStudy =
  | ({ format: "arm-binary"; study: string; arms: BinaryArm[] } & Judged)
  | ({ format: "arm-continuous"; study: string; arms: ContinuousArm[] } & Judged)
  | ({ format: "contrast"; study: string; contrasts: ContrastRow[] } & Judged);

export interface ParsedDataset {
  format: Format;
  studies: ParsedStudy[];
  /** Whether the file had the `risk_of_bias` column (absent in data sets stored before it existed). */
  riskOfBiasColumn?: boolean;
}

/** A study reduced to arm effects θ and variances v (METHODS.md §2), in the order of the file. */
export interface ArmEffects {
  study: string;
  treatments: string[];
  effects: number[];
  variances: number[];
  /** Participants per arm, where the format has them (for the network diagram). */
  participants: (number | null)[];
  /** The study's risk of bias (null: not assessed), where the file has the column. */
  riskOfBias?: RiskOfBias | null;
}

export interface Estimate {
  estimate: number;
  se: number;
}

export interface AnalysisOptions {
  measure: Measure;
  model: Model;
  reference: string;
  better: Better;
  draws?: number;
  seed?: number;
}
