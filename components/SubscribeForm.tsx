// "E-mail alerts on this topic": a plain form on topic and brief pages. It carries no CSRF token, so
// it can sit on shared cached pages (server/web/api/subscriptions.ts says why that is safe).
import { useTranslation } from "react-i18next";
import { useIntl } from "./i18n";

/** `topic` in the reader's words; the form sends its slug (the same in every language) and the reader's language, for the e-mails. */
export function SubscribeForm({ topic, topicSlug }: { topic: string; topicSlug: string }) {
  const { t } = useTranslation();
  const { locale } = useIntl();
  return (
    <section aria-labelledby="alerts-title" className="mt-12 border-t border-rule pt-6 print:hidden" data-testid="subscribe">
      <h2 id="alerts-title" className="text-lg font-semibold">{t("subscriptions.formTitle", { topic })}</h2>
      <p className="mt-1 font-sans text-sm text-muted">{t("subscriptions.formLead")}</p>
      <form method="post" action="/api/subscriptions" className="mt-3 flex flex-wrap items-end gap-3 font-sans">
        <input type="hidden" name="topic" value={topicSlug} />
        <input type="hidden" name="locale" value={locale} />
        <label className="min-w-0 flex-1">
          <span className="block text-sm font-semibold">{t("subscriptions.email")}</span>
          <input name="email" type="email" required autoComplete="email" className="mt-1 w-full border border-rule bg-white px-3 py-2" />
        </label>
        <button type="submit" className="border border-ink px-4 py-2 font-semibold">{t("subscriptions.submit")}</button>
      </form>
    </section>
  );
}
