// The press room: embargoed versions (readable by the press before their release) and the latest
// releases, each with its page and its release time.
import { useTranslation } from "react-i18next";
import { useAskEditors, usePressRoom } from "../queries";
import { Field, formValues, inputClass, SubmitRow } from "./forms";
import { versionUrl } from "#core/publication/urls";
import { useIntl } from "../../i18n";

/** The press room's contact form: a question to the editors, who answer by e-mail. */
function AskEditors({ briefs }: { briefs: { slug: string; title: string }[] }) {
  const { t } = useTranslation();
  const ask = useAskEditors();
  return (
    <section className="mt-8 border-t border-rule pt-6">
      <h3 className="mb-3 text-lg font-semibold">{t("desk.pressRoom.ask.title")}</h3>
      <form
        aria-label={t("desk.pressRoom.ask.title")}
        className="grid gap-4 font-sans sm:grid-cols-2"
        onSubmit={(event) => {
          event.preventDefault();
          const form = event.currentTarget;
          const { subject, body, briefSlug } = formValues(form);
          ask.mutate({ subject: subject ?? "", body: body ?? "", briefSlug: briefSlug || null }, { onSuccess: () => form.reset() });
        }}
      >
        <Field label={t("desk.pressRoom.ask.subject")}>
          <input name="subject" required maxLength={200} className={inputClass} />
        </Field>
        <Field label={t("desk.pressRoom.ask.brief")}>
          <select name="briefSlug" className={inputClass}>
            <option value="">{t("desk.pressRoom.ask.none")}</option>
            {[...new Map(briefs.map((brief) => [brief.slug, brief])).values()].map((brief) => (
              <option key={brief.slug} value={brief.slug}>
                {brief.title}
              </option>
            ))}
          </select>
        </Field>
        <div className="sm:col-span-2">
          <Field label={t("desk.pressRoom.ask.body")}>
            <textarea name="body" required rows={4} maxLength={5000} className={inputClass} />
          </Field>
        </div>
        <SubmitRow label={t("desk.pressRoom.ask.send")} busy={ask.isPending} error={ask.error?.message ?? null} />
        {ask.isSuccess ? <p role="status">{t("desk.pressRoom.ask.sent")}</p> : null}
      </form>
    </section>
  );
}

export function PressRoom({ canAsk = false }: { canAsk?: boolean }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const versions = usePressRoom();
  return (
    <section className="mt-10" aria-labelledby="press-room-title" data-testid="press-room">
      <h2 id="press-room-title" className="text-xl font-semibold">{t("desk.pressRoom.title")}</h2>
      <p className="mt-2 text-muted">{t("desk.pressRoom.lead")}</p>
      {/* Times in the reader's browser's time zone, named: the desk renders there. */}
      {versions.isError ? <p role="alert">{t("desk.error", { message: versions.error.message })}</p> : null}
      {versions.data && versions.data.length === 0 ? <p className="mt-3">{t("desk.pressRoom.empty")}</p> : null}
      <ul className="mt-3 divide-y divide-rule">
        {versions.data?.map((entry) => (
          <li key={`${entry.slug}-${entry.number}`} className="py-3">
            <a href={versionUrl({ slug: entry.slug, version: entry.number })} className="text-lg font-semibold">{entry.title}</a>
            <p className="font-sans text-sm">
              {entry.embargoed ? (
                <strong className="text-accent">{t("desk.pressRoom.embargoed", { date: intl.moment(entry.releaseAt) })}</strong>
              ) : (
                t("desk.pressRoom.released", { date: intl.moment(entry.releaseAt) })
              )}
              {" · "}
              {t("desk.pressRoom.version", { version: entry.number })}
            </p>
            {entry.note ? <p className="mt-1 text-sm text-muted">{t("brief.correctionNote", { note: entry.note })}</p> : null}
          </li>
        ))}
      </ul>
      {canAsk ? <AskEditors briefs={versions.data ?? []} /> : null}
    </section>
  );
}
