import { useTranslation } from "react-i18next";
import { useParams } from "react-router";
import { DeskLink } from "../DeskLink";
import { OutcomeForm } from "./OutcomeForm";
import { TreatmentNamesForm } from "./TreatmentNamesForm";
import { ApiError } from "../api";
import { previewMarkdown, useAnalyseAgain, useBrief, useCreateOutcome, useDeleteOutcome, useNameTreatments, useSaveTexts, useUpdateOutcome, useUploadDataset } from "../queries";
import { ReleasePanel } from "./ReleasePanel";
import { TextsForm } from "./TextsForm";
import type { OutcomeSummary } from "#web/api/contract";
import { issueText, UploadForm } from "./UploadForm";

export function BriefScreen({ personId, canAnalyse, canEdit }: { personId: string; canAnalyse: boolean; canEdit: boolean }) {
  const { t } = useTranslation();
  const { briefId = "" } = useParams();
  const brief = useBrief(briefId);
  const createOutcome = useCreateOutcome(briefId);
  const nameTreatments = useNameTreatments(briefId);
  const saveTexts = useSaveTexts(briefId);
  if (brief.isError) return <p role="alert">{t("desk.error", { message: brief.error.message })}</p>;
  if (!brief.data) return <p aria-live="polite">{t("desk.loading")}</p>;
  const { data } = brief;
  return (
    <>
      <p className="font-sans text-sm">
        <DeskLink to="/">{t("desk.briefs")}</DeskLink>
      </p>
      <h1 className="mt-2 text-3xl font-semibold">{data.title}</h1>
      <p className="mt-2 font-sans text-sm text-muted">
        {data.topic} · {data.condition} · {data.population} · {t(`desk.status.${data.status}`)}
      </p>
      <h2 className="mt-10 font-sans text-sm font-semibold uppercase tracking-wide">{t("desk.outcomes")}</h2>
      {data.outcomes.length === 0 ? <p className="mt-3 text-muted">{t("desk.noOutcomes")}</p> : null}
      {data.outcomes.map((outcome) => (
        <OutcomePanel key={outcome.id} briefId={briefId} outcome={outcome} canAnalyse={canAnalyse} />
      ))}
      {canEdit ? (
        <TextsForm
          initial={{ laySummary: data.laySummary, shortTake: data.shortTake }}
          onPreview={previewMarkdown}
          onSave={(texts) => saveTexts.mutate({ rowVersion: data.rowVersion, ...texts })}
          busy={saveTexts.isPending}
          saved={saveTexts.isSuccess}
          error={saveTexts.error instanceof ApiError && saveTexts.error.status === 409 ? t("desk.conflict") : (saveTexts.error?.message ?? null)}
          theirs={saveTexts.error instanceof ApiError && saveTexts.error.status === 409 ? { laySummary: data.laySummary, shortTake: data.shortTake } : null}
        />
      ) : null}
      {canAnalyse && data.treatments.length > 0 ? (
        <TreatmentNamesForm
          treatments={data.treatments}
          busy={nameTreatments.isPending}
          saved={nameTreatments.isSuccess}
          onSave={(names, grammar) => nameTreatments.mutate({ names, grammar })}
        />
      ) : null}
      <ReleasePanel brief={data} personId={personId} canEdit={canEdit} canSubmit={canAnalyse || canEdit} />
      {canAnalyse ? (
        <section className="mt-10 border-t border-rule pt-6">
          <h2 className="mb-4 text-xl font-semibold">{t("desk.addOutcome")}</h2>
          <OutcomeForm label={t("desk.addOutcome")} onSubmit={(fields) => createOutcome.mutate(fields)} busy={createOutcome.isPending} error={createOutcome.error?.message ?? null} />
        </section>
      ) : null}
    </>
  );
}

function OutcomePanel({ briefId, outcome, canAnalyse }: { briefId: string; outcome: OutcomeSummary; canAnalyse: boolean }) {
  const { t, i18n } = useTranslation();
  const upload = useUploadDataset(briefId, outcome.id);
  const update = useUpdateOutcome(briefId, outcome.id);
  const remove = useDeleteOutcome(briefId, outcome.id);
  const analyseAgain = useAnalyseAgain(briefId, outcome.id);
  return (
    <section className="mt-4 border border-rule bg-white p-5" aria-label={outcome.name}>
      <h3 className="text-xl font-semibold">{outcome.name}</h3>
      <p className="mt-1 font-sans text-sm text-muted">
        {outcome.measure} · {t(`desk.model.${outcome.model}`)} · {outcome.referenceTreatment} · {t(`desk.direction.${outcome.direction}`)}
      </p>
      <p className="mt-2 font-sans text-sm" data-testid="analysis-state">
        {t(`desk.analysis.${outcome.analysis.state}`, { file: outcome.analysis.fileName })}
        {outcome.analysis.state !== "no-data" ? (
          <>
            {" · "}
            <DeskLink to={`/briefs/${briefId}/outcomes/${outcome.id}`}>{t("desk.results")}</DeskLink>
          </>
        ) : null}
        {canAnalyse && outcome.analysis.state === "stale" ? (
          <>
            {" · "}
            <button type="button" className="text-accent underline" disabled={analyseAgain.isPending} onClick={() => analyseAgain.mutate()}>
              {analyseAgain.isPending ? t("desk.saving") : t("desk.analysis.runAgain")}
            </button>
          </>
        ) : null}
      </p>
      {analyseAgain.isSuccess ? <p role="status" className="mt-1 font-sans text-sm">{t("desk.analysis.ranAgain")}</p> : null}
      {outcome.analysis.pending?.state === "analysing" ? (
        <p role="status" className="mt-1 font-sans text-sm" data-testid="analysing">{t("desk.analysis.analysing", { file: outcome.analysis.pending.fileName })}</p>
      ) : null}
      {outcome.analysis.pending?.state === "refused" ? (
        <div role="alert" className="mt-2 border-s-4 border-accent bg-accent-soft px-4 py-3 font-sans text-sm" data-testid="upload-refused">
          <p>{t("desk.analysis.refused", { file: outcome.analysis.pending.fileName })}</p>
          <ul className="mt-1 list-disc ps-6">
            {outcome.analysis.pending.issues.slice(0, 10).map((issue, i) => (
              <li key={i}>{issueText(t, i18n, issue)}</li>
            ))}
          </ul>
        </div>
      ) : null}
      {analyseAgain.error ? <p role="alert" className="mt-1 font-sans text-sm text-accent">{t("desk.error", { message: analyseAgain.error.message })}</p> : null}
      {canAnalyse ? (
        <details className="mt-4 font-sans">
          <summary className="cursor-pointer font-semibold">{t("desk.editOutcome")}</summary>
          <div className="mt-3">
            <OutcomeForm
              label={t("desk.saveOutcome")}
              initial={outcome}
              busy={update.isPending}
              error={update.error instanceof ApiError && update.error.status === 409 ? t("desk.conflict") : (update.error?.message ?? null)}
              onSubmit={(fields) => update.mutate({ ...fields, rowVersion: outcome.rowVersion })}
            />
            <button
              type="button"
              className="mt-4 border border-ink px-5 py-2 font-semibold"
              disabled={remove.isPending}
              onClick={() => {
                if (window.confirm(t("desk.deleteOutcomeConfirm", { name: outcome.name }))) remove.mutate();
              }}
            >
              {t("desk.deleteOutcome")}
            </button>
            {remove.error ? <p role="alert" className="mt-2 text-accent">{t("desk.error", { message: remove.error.message })}</p> : null}
          </div>
        </details>
      ) : null}
      {canAnalyse ? (
        <div className="mt-4">
          <UploadForm
            kind={outcome.kind}
            busy={upload.isPending}
            report={upload.data}
            error={upload.error?.message ?? null}
            onUpload={(file, format) => upload.mutate({ file, format })}
          />
        </div>
      ) : null}
    </section>
  );
}
