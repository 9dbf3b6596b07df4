import type { i18n, TFunction } from "i18next";
import { useTranslation } from "react-i18next";
import { buttonClass, Field, inputClass } from "./forms";
import type { DatasetIssue, Format } from "#core/nma/types";
import type { UploadReport } from "#web/api/contract";

/** A problem of an upload in the reader's language, from its rule and facts; the engine's English for a rule without words. */
export function issueText(t: TFunction, i18n: i18n, issue: DatasetIssue): string {
  const key = `desk.rule.${issue.rule}`;
  const context = typeof issue.facts?.reason === "string" ? issue.facts.reason : undefined;
  if (!i18n.exists(context ? `${key}_${context}` : key)) return issue.message;
  return t(key, { ...issue, ...issue.facts, context });
}

export function UploadForm({
  kind,
  onUpload,
  busy,
  report,
  error,
}: {
  kind: "binary" | "continuous";
  onUpload: (file: File, format: Format) => void;
  busy: boolean;
  report: UploadReport | undefined;
  error: string | null;
}) {
  const { t, i18n } = useTranslation();
  const formats: Format[] = kind === "binary" ? ["arm-binary", "contrast"] : ["arm-continuous", "contrast"];
  return (
    <div className="font-sans">
      <form
        className="flex flex-wrap items-end gap-4"
        aria-label={t("desk.upload")}
        onSubmit={(event) => {
          event.preventDefault();
          const data = new FormData(event.currentTarget);
          const file = data.get("file");
          if (file instanceof File && file.size > 0) onUpload(file, data.get("format") as Format);
        }}
      >
        <Field label={t("desk.field.file")}>
          <input name="file" type="file" accept=".csv,text/csv" required className="text-sm" />
        </Field>
        <Field label={t("desk.field.format")}>
          <select name="format" className={inputClass}>
            {formats.map((f) => (
              <option key={f} value={f}>
                {f}
              </option>
            ))}
          </select>
        </Field>
        <button type="submit" disabled={busy} className={buttonClass}>
          {busy ? t("desk.saving") : t("desk.uploadSubmit")}
        </button>
      </form>
      {error ? <p role="alert" className="mt-2 text-accent">{t("desk.error", { message: error })}</p> : null}
      {report?.valid && "analysing" in report ? (
        <p role="status" className="mt-3" data-testid="upload-analysing">
          {t("desk.analysis.queued", { file: report.fileName })}
        </p>
      ) : null}
      {report?.valid && !("analysing" in report) ? (
        <p role="status" className="mt-3">
          {t("desk.uploadValid", { studies: report.studies, treatments: report.treatments?.length })}
          {report.excludedStudies?.length ? ` ${t("desk.excluded", { studies: report.excludedStudies.join(", ") })}` : null}
          {report.riskOfBias ? <span className="block" data-testid="risk-of-bias-counts">{t("desk.riskOfBias.counts", report.riskOfBias)}</span> : null}
        </p>
      ) : null}
      {report && !report.valid ? (
        <div role="alert" className="mt-3 border-s-4 border-accent bg-accent-soft px-4 py-3">
          <p>{t("desk.uploadInvalid")}</p>
          <ul className="mt-2 list-disc ps-6 text-sm" data-testid="validation-report">
            {report.issues?.map((issue, i) => (
              <li key={i}>
                {issue.row !== undefined ? `${issue.column ? t("desk.issueWhere", { row: issue.row, column: issue.column }) : t("desk.issueWhereRow", { row: issue.row })}: ` : ""}
                {issueText(t, i18n, issue)}
              </li>
            ))}
          </ul>
        </div>
      ) : null}
    </div>
  );
}
