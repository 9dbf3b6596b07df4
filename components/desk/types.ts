// What the desk receives from the API (docs/api.md).
import type { DatasetIssue, Format, Measure } from "../../server/nma/types";

export interface BriefSummary {
  id: string;
  slug: string;
  title: string;
  topic: string;
  status: string;
  rowVersion: number;
}

export interface OutcomeSummary {
  id: string;
  name: string;
  kind: "binary" | "continuous";
  measure: Measure;
  model: "fixed" | "random";
  referenceTreatment: string;
  direction: "higher" | "lower";
  analysis: { state: "no-data" | "current" | "stale"; fileName?: string; sha256?: string; engineVersion?: string | null };
}

export interface BriefDetail extends BriefSummary {
  condition: string;
  population: string;
  laySummary: string;
  keyMessages: string;
  outcomes: OutcomeSummary[];
  treatments: { label: string; displayName: string }[];
}

export interface UploadReport {
  valid: boolean;
  studies?: number;
  treatments?: string[];
  excludedStudies?: string[];
  issues?: DatasetIssue[];
}

export type { Format };
