import { useTranslation } from "react-i18next";
import { usePageContext } from "vike-react/usePageContext";

const knownErrors = new Set(["missing", "too-many", "expired"]);

/** Asks for a reset link: a plain HTML form that works with JavaScript turned off. */
export default function Page() {
  const { t } = useTranslation();
  const pageContext = usePageContext();
  const { error, sent } = pageContext.urlParsed.search;
  return (
    <div className="max-w-md">
      <h1 className="text-4xl font-semibold tracking-tight">{t("account.reset.title")}</h1>
      <p className="mt-4 text-lg text-muted">{t("account.reset.lead")}</p>
      {sent ? (
        <p role="status" className="mt-6 border-s-4 border-ink bg-white px-4 py-3 font-sans">
          {t("account.reset.sent")}
        </p>
      ) : null}
      {error && knownErrors.has(error) ? (
        <p role="alert" className="mt-6 border-s-4 border-accent bg-accent-soft px-4 py-3 font-sans">
          {t(`account.errors.${error}`)}
        </p>
      ) : null}
      <form method="post" action="/api/password-reset" className="mt-8 space-y-6 font-sans">
        <input type="hidden" name="_csrf" value={pageContext.csrfToken ?? ""} />
        <label className="block">
          <span className="block text-sm font-semibold">{t("account.reset.email")}</span>
          <input name="email" type="email" autoComplete="username" required className="mt-2 w-full border border-rule bg-white px-3 py-2 text-base" />
        </label>
        <button type="submit" className="bg-accent px-6 py-2 text-base font-semibold text-white hover:opacity-90">
          {t("account.reset.submit")}
        </button>
      </form>
    </div>
  );
}
