// The data downloads of a version: its inputs (the parsed studies) and its results, as CSV and
// JSON, from the frozen snapshot. CSV cells that a spreadsheet would run as a formula are
// neutralised (OWASP's advice on CSV injection: prefix a single quote).
import { stringify } from "csv-stringify/sync";
import type { VersionSnapshot } from "#core/snapshot/schema";

/** Text starting with =, +, -, @, a tab or a carriage return gets a leading quote; numbers stay numbers. */
export function neutralise(cell: string | number | null): string | number | null {
  if (typeof cell !== "string") return cell;
  return /^[=+\-@\t\r]/.test(cell) ? `'${cell}` : cell;
}

function csv(header: string[], rows: (string | number | null)[][]): string {
  return stringify([header, ...rows.map((row) => row.map(neutralise))], { cast: { number: (value) => String(value) } });
}

/** A study's risk of bias as the input format writes it (METHODS.md §1); empty when not assessed or not given. */
const riskOfBiasWords = { low: "low", "some-concerns": "some concerns", high: "high" } as const;

export function inputsCsv(snapshot: VersionSnapshot): string {
  const rows = snapshot.outcomes.flatMap((outcome) =>
    outcome.dataset.parsed.studies.flatMap((study) => {
      const rob = study.riskOfBias ? riskOfBiasWords[study.riskOfBias] : null;
      if (study.format === "contrast") {
        return study.contrasts.map((c) => [outcome.name, study.study, c.treatment1, c.treatment2, null, null, null, null, null, c.estimate, c.se, rob]);
      }
      if (study.format === "arm-binary") {
        return study.arms.map((a) => [outcome.name, study.study, a.treatment, null, a.events, a.total, null, null, null, null, null, rob]);
      }
      return study.arms.map((a) => [outcome.name, study.study, a.treatment, null, null, null, a.mean, a.sd, a.n, null, null, rob]);
    }),
  );
  return csv(["outcome", "study", "treatment", "comparator", "events", "total", "mean", "sd", "n", "estimate", "se", "risk_of_bias"], rows);
}

/** What the estimate columns of results.csv are on: the analysis scale (ratios are exponentiated only for display). */
const analysisScale = { OR: "log odds ratio", RR: "log risk ratio", RD: "risk difference", MD: "mean difference" } as const;

export function resultsCsv(snapshot: VersionSnapshot): string {
  const names = new Map(snapshot.treatments.map((t) => [t.label, t.displayName]));
  const rows = snapshot.outcomes.flatMap((outcome) =>
    outcome.pairs.map((pair) => [
      outcome.name,
      pair.treatment,
      names.get(pair.treatment) ?? pair.treatment,
      pair.comparator,
      names.get(pair.comparator) ?? pair.comparator,
      outcome.settings.measure,
      outcome.settings.measure === "MD" && outcome.unit ? `${analysisScale.MD} (${outcome.unit})` : analysisScale[outcome.settings.measure],
      outcome.settings.model,
      pair.network.estimate,
      pair.network.se,
      pair.network.lower,
      pair.network.upper,
      pair.direct?.estimate ?? null,
      pair.direct?.se ?? null,
      pair.direct?.studies ?? null,
      pair.indirect?.estimate ?? null,
      pair.indirect?.se ?? null,
      pair.incoherenceP,
      pair.certainty ?? "not assessed",
      pair.riskOfBias?.low ?? null,
      pair.riskOfBias?.someConcerns ?? null,
      pair.riskOfBias?.high ?? null,
      pair.riskOfBias?.notAssessed ?? null,
      // The studies that matter most (§13), "label:importance" largest first; empty in versions frozen before they were computed.
      pair.importance?.map((s) => `${s.study}:${Number(s.value.toPrecision(6))}`).join("; ") ?? null,
    ]),
  );
  return csv(
    [
      "outcome", "treatment", "treatment_name", "comparator", "comparator_name", "measure", "scale", "model", "estimate", "se", "lower", "upper",
      "direct_estimate", "direct_se", "direct_studies", "indirect_estimate", "indirect_se", "incoherence_p", "certainty",
      "direct_weight_low_risk_of_bias", "direct_weight_some_concerns", "direct_weight_high_risk_of_bias", "direct_weight_not_assessed", "important_studies",
    ],
    rows,
  );
}

export function inputsJson(snapshot: VersionSnapshot): string {
  const outcomes = snapshot.outcomes.map((o) => ({ outcome: o.name, fileName: o.dataset.fileName, sha256: o.dataset.sha256, format: o.dataset.format, studies: o.dataset.parsed.studies }));
  return `${JSON.stringify({ brief: snapshot.brief.slug, version: snapshot.version, treatments: snapshot.treatments, outcomes }, null, 2)}\n`;
}

export function resultsJson(snapshot: VersionSnapshot): string {
  const outcomes = snapshot.outcomes.map((o) => ({ outcome: o.name, settings: o.settings, thresholds: o.thresholds, baselineRisk: o.baselineRisk, result: o.result, certainty: o.certainty, framework: o.framework, groups: o.groups }));
  return `${JSON.stringify({ brief: snapshot.brief.slug, version: snapshot.version, releaseAt: snapshot.releaseAt, outcomes }, null, 2)}\n`;
}

/** The download files of a version, by the name in their URL. */
export const downloads = {
  "inputs.csv": { media: "text/csv; charset=utf-8", build: inputsCsv },
  "inputs.json": { media: "application/json; charset=utf-8", build: inputsJson },
  "results.csv": { media: "text/csv; charset=utf-8", build: resultsCsv },
  "results.json": { media: "application/json; charset=utf-8", build: resultsJson },
} as const;
