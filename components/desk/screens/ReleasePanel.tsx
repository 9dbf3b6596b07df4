// Review and release of a brief in the desk: the review history with its comments, submit / return /
// approve, the preview, publish now or at an embargo time (with a correction note after version 1),
// and withdrawal. The server decides what is allowed; this panel offers what the person's roles may do.
import { useState } from "react";
import { useTranslation } from "react-i18next";
import { buttonClass, Field, formValues, inputClass } from "./forms";
import { useDraftChanges, usePublish, useReadiness, useReschedule, useReviews, useReviewStep, useWithdraw } from "../queries";
import { VersionChanges } from "../../brief/VersionChanges";
import type { BriefDetail, ReviewBody } from "#web/api/contract";
import { previewUrl } from "#core/publication/urls";
import { useIntl } from "../../i18n";

export function ReleasePanel({ brief, personId, canEdit, canSubmit }: { brief: BriefDetail; personId: string; canEdit: boolean; canSubmit: boolean }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const reviews = useReviews(brief.id);
  const readiness = useReadiness(brief.id);
  const review = useReviewStep(brief.id);
  const publish = usePublish(brief.id);
  const withdraw = useWithdraw(brief.id);
  const reschedule = useReschedule(brief.id, brief.latestVersion);
  // Before a correction, the editor reads what it would change, computed as the page will show it.
  const changes = useDraftChanges(brief.id, brief.latestVersion > 0 && brief.status !== "withdrawn");
  const [schedule, setSchedule] = useState(false);
  const date = intl.date({ dateStyle: "medium", timeStyle: "short" });
  const zoned = intl.date({ dateStyle: "full", timeStyle: "long" });
  const withdrawn = brief.status === "withdrawn";
  // A brief with a version is released, whatever step its next version is at: a correction needs its note.
  const published = brief.latestVersion > 0;
  const warnings = readiness.data?.warnings ?? [];
  const latestStep = reviews.data?.steps[0];
  const mySubmissionAwaits = brief.status === "in_review" && latestStep?.decision === "submitted" && latestStep.actorId === personId;
  const approval = reviews.data?.approval ?? "none";
  const error = review.error ?? publish.error ?? withdraw.error ?? reschedule.error;
  // Where the brief stands: an approval speaks for itself; without one, scheduled, submitted or out.
  const approvalLine =
    approval !== "none"
      ? t(`desk.release.approval.${approval}`)
      : brief.embargoedUntil && brief.status === "scheduled"
        ? t("desk.release.approval.scheduled", { version: brief.latestVersion, at: zoned.format(new Date(brief.embargoedUntil)) })
        : brief.status === "in_review"
          ? t("desk.release.approval.submitted")
          : published
            ? t("desk.release.approval.released", { version: brief.latestVersion })
            : t("desk.release.approval.none");

  return (
    <section className="mt-10 border-t border-rule pt-6" aria-labelledby="release-title" data-testid="release">
      <h2 id="release-title" className="text-xl font-semibold">{t("desk.release.title")}</h2>
      <p className="mt-2 font-sans text-sm">
        {approvalLine} ·{" "}
        <a href={previewUrl(brief.id)} target="_blank" rel="noreferrer">{t("desk.release.preview")}</a>
      </p>
      {error ? <p role="alert" className="mt-3 font-sans text-sm text-accent">{t("desk.error", { message: error.message })}</p> : null}
      {publish.data ? (
        <p role="status" className="mt-3 font-sans text-sm">
          {t("desk.release.published", { version: publish.data.version })} <a href={publish.data.url}>{publish.data.url}</a>
        </p>
      ) : null}

      {brief.embargoedUntil && canEdit ? (
        <form
          className="mt-4 grid gap-2 border-s-4 border-accent ps-4 font-sans text-sm"
          aria-label={t("desk.release.rescheduleTitle")}
          data-testid="embargo"
          onSubmit={(event) => {
            event.preventDefault();
            const { releaseAt } = formValues(event.currentTarget);
            if (!releaseAt) return;
            const when = new Date(releaseAt);
            if (!window.confirm(t("desk.release.confirmSchedule", { at: zoned.format(when) }))) return;
            reschedule.mutate({ releaseAt: when.toISOString() });
          }}
        >
          <p className="font-semibold">{t("desk.release.embargoedUntil", { at: zoned.format(new Date(brief.embargoedUntil)) })}</p>
          <Field label={t("desk.release.newReleaseAt")}>
            <input type="datetime-local" name="releaseAt" required className={inputClass} />
          </Field>
          <div>
            <button type="submit" className="border border-ink px-5 py-2 font-semibold" disabled={reschedule.isPending}>{t("desk.release.rescheduleButton")}</button>
          </div>
        </form>
      ) : null}

      {readiness.data ? (
        <div className="mt-4 font-sans text-sm" data-testid="readiness">
          <h3 className="font-semibold">{t("readiness.title")}</h3>
          {readiness.data.blocking.length === 0 ? (
            <p className="mt-1">{t("readiness.ready")}</p>
          ) : (
            <ul className="mt-1 list-disc ps-6 text-accent">
              {readiness.data.blocking.map((item, i) => (
                <li key={i}>{t(item.key, item.values)}</li>
              ))}
            </ul>
          )}
          {warnings.length > 0 ? (
            <>
              <h3 className="mt-3 font-semibold">{t("readiness.warningsTitle")}</h3>
              <ul className="mt-1 list-disc ps-6">
                {warnings.map((item, i) => (
                  <li key={i}>{t(item.key, item.values)}</li>
                ))}
              </ul>
            </>
          ) : null}
        </div>
      ) : null}

      {changes.data?.changes ? <VersionChanges changes={changes.data.changes} slug={null} /> : null}

      {!withdrawn ? (
        <form
          className="mt-5 grid gap-3 font-sans"
          onSubmit={(event) => {
            event.preventDefault();
            const submitter = (event.nativeEvent as SubmitEvent).submitter as HTMLButtonElement | null;
            const form = event.currentTarget;
            const { comment } = formValues(form);
            const acknowledgeWarnings = (form.elements.namedItem("acknowledgeWarnings") as HTMLInputElement | null)?.checked ?? false;
            review.mutate({ decision: submitter?.value as ReviewBody["decision"], comment: comment || undefined, acknowledgeWarnings }, { onSuccess: () => form.reset() });
          }}
        >
          <Field label={t("desk.release.comment")}>
            <textarea name="comment" rows={3} className={inputClass} />
          </Field>
          {canEdit && brief.status === "in_review" && warnings.length > 0 ? (
            <label className="flex items-center gap-2 text-sm">
              <input type="checkbox" name="acknowledgeWarnings" />
              {t("readiness.acknowledge")}
            </label>
          ) : null}
          <div className="flex flex-wrap gap-3">
            {canSubmit && (brief.status !== "in_review" || approval === "stale") ? (
              <button type="submit" name="decision" value="submitted" className={buttonClass} disabled={review.isPending}>{t("desk.release.submit")}</button>
            ) : null}
            {mySubmissionAwaits ? (
              <button type="submit" name="decision" value="recalled" className="border border-ink px-5 py-2 font-semibold" disabled={review.isPending}>{t("desk.release.recall")}</button>
            ) : null}
            {canEdit && brief.status === "in_review" && !mySubmissionAwaits ? (
              <>
                <button type="submit" name="decision" value="approved" className={buttonClass} disabled={review.isPending}>{t("desk.release.approve")}</button>
                <button type="submit" name="decision" value="returned" className="border border-ink px-5 py-2 font-semibold" disabled={review.isPending}>{t("desk.release.return")}</button>
              </>
            ) : null}
          </div>
        </form>
      ) : null}

      {canEdit && !withdrawn ? (
        <form
          className="mt-6 grid gap-3 border-t border-rule pt-5 font-sans"
          onSubmit={(event) => {
            event.preventDefault();
            const { releaseAt, note } = formValues(event.currentTarget);
            const when = schedule && releaseAt ? new Date(releaseAt) : null;
            // A published version is frozen for good: the editor confirms, with the time zone of an embargo spelled out.
            const question = when ? t("desk.release.confirmSchedule", { at: zoned.format(when) }) : t("desk.release.confirmPublish");
            if (!window.confirm(question)) return;
            publish.mutate({ releaseAt: when?.toISOString(), note: note || undefined });
          }}
        >
          <label className="flex items-center gap-2 text-sm">
            <input type="checkbox" checked={schedule} onChange={(e) => setSchedule(e.target.checked)} />
            {t("desk.release.schedule")}
          </label>
          {schedule ? (
            <Field label={t("desk.release.releaseAt")}>
              <input type="datetime-local" name="releaseAt" required className={inputClass} />
            </Field>
          ) : null}
          {published ? (
            <Field label={t("desk.release.note")}>
              <textarea name="note" rows={2} required className={inputClass} />
            </Field>
          ) : null}
          <div>
            <button type="submit" className={buttonClass} disabled={publish.isPending || approval !== "current"}>
              {schedule ? t("desk.release.scheduleButton") : published ? t("desk.release.correct") : t("desk.release.publish")}
            </button>
          </div>
        </form>
      ) : null}

      {canEdit && published && !withdrawn ? (
        // Withdrawal is open in every released state, a correction under review included.
        <details className="mt-6 border-t border-rule pt-5 font-sans">
          <summary className="cursor-pointer font-semibold">{t("desk.release.withdraw")}</summary>
          <form
            className="mt-3 grid gap-3"
            onSubmit={(event) => {
              event.preventDefault();
              if (!window.confirm(t("desk.release.confirmWithdraw"))) return;
              withdraw.mutate({ reason: formValues(event.currentTarget).reason ?? "" });
            }}
          >
            <Field label={t("desk.release.withdrawReason")}>
              <textarea name="reason" rows={2} required className={inputClass} />
            </Field>
            <div>
              <button type="submit" className="border border-ink px-5 py-2 font-semibold" disabled={withdraw.isPending}>{t("desk.release.withdrawButton")}</button>
            </div>
          </form>
        </details>
      ) : null}

      {reviews.data && reviews.data.steps.length > 0 ? (
        <>
          <h3 className="mt-6 font-sans text-sm font-semibold uppercase tracking-wide">{t("desk.release.history")}</h3>
          <ol className="mt-2 space-y-2 font-sans text-sm" data-testid="review-history">
            {reviews.data.steps.map((step) => (
              <li key={`${step.createdAt}-${step.decision}`}>
                <span className="font-semibold">{t(`desk.release.step.${step.decision}`, { name: step.actorName })}</span>{" "}
                <span className="text-muted">{date.format(new Date(step.createdAt))}</span>
                {step.comment ? <p className="mt-1 border-s-2 border-rule ps-3">{step.comment}</p> : null}
              </li>
            ))}
          </ol>
        </>
      ) : null}
    </section>
  );
}
