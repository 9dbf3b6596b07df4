import { useTranslation } from "react-i18next";
import { usePageContext } from "vike-react/usePageContext";
import { passwordResetUrl } from "#core/publication/urls";

const knownErrors = new Set(["invalid", "missing", "too-many", "expired"]);

/** A plain HTML form: it posts to the API and works with JavaScript turned off. */
export default function Page() {
  const { t } = useTranslation();
  const pageContext = usePageContext();
  const error = pageContext.urlParsed.search.error;
  const next = pageContext.urlParsed.search.next ?? "/desk";
  const done = pageContext.urlParsed.search.done === "password";
  return (
    <div className="max-w-md">
      <h1 className="text-4xl font-semibold tracking-tight">{t("signIn.title")}</h1>
      <p className="mt-4 text-lg text-muted">{t("signIn.lead")}</p>
      {done ? (
        <p role="status" className="mt-6 border-s-4 border-ink bg-white px-4 py-3 font-sans">
          {t("signIn.done.password")}
        </p>
      ) : null}
      {error && knownErrors.has(error) ? (
        <p role="alert" className="mt-6 border-s-4 border-accent bg-accent-soft px-4 py-3 font-sans">
          {t(`signIn.errors.${error}`)}
        </p>
      ) : null}
      <form method="post" action="/api/session" className="mt-8 space-y-6 font-sans">
        <input type="hidden" name="_csrf" value={pageContext.csrfToken ?? ""} />
        <input type="hidden" name="next" value={next} />
        <label className="block">
          <span className="block text-sm font-semibold">{t("signIn.email")}</span>
          <input
            name="email"
            type="email"
            autoComplete="username"
            required
            className="mt-2 w-full border border-rule bg-white px-3 py-2 text-base"
          />
        </label>
        <label className="block">
          <span className="block text-sm font-semibold">{t("signIn.password")}</span>
          <input
            name="password"
            type="password"
            autoComplete="current-password"
            required
            className="mt-2 w-full border border-rule bg-white px-3 py-2 text-base"
          />
        </label>
        <button type="submit" className="bg-accent px-6 py-2 text-base font-semibold text-white hover:opacity-90">
          {t("signIn.submit")}
        </button>
      </form>
      <p className="mt-6 font-sans text-sm">
        <a href={passwordResetUrl()}>{t("signIn.forgot")}</a>
      </p>
    </div>
  );
}
