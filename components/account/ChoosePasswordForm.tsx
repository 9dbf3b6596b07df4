// Choosing a password from a one-time link (an invitation or a reset): a plain HTML form that posts to
// the API and works with JavaScript turned off.
import { useTranslation } from "react-i18next";
import { useData } from "vike-react/useData";
import { usePageContext } from "vike-react/usePageContext";
import { passwordResetUrl } from "#core/publication/urls";

const knownErrors = new Set(["password", "link", "too-many", "expired"]);

export function ChoosePasswordForm({ title }: { title: string }) {
  const { t } = useTranslation();
  const pageContext = usePageContext();
  const error = pageContext.urlParsed.search.error;
  const token = String(pageContext.routeParams.token ?? "");
  // Checked when the page was made: a used or expired link offers the way to a new one, not a form.
  const { usable } = useData<{ usable: boolean }>();
  if (!usable) {
    return (
      <div className="max-w-md">
        <h1 className="text-4xl font-semibold tracking-tight">{title}</h1>
        <p role="alert" className="mt-6 border-s-4 border-accent bg-accent-soft px-4 py-3 font-sans" data-testid="link-unusable">
          {t("account.errors.link")} <a href={passwordResetUrl()}>{t("signIn.forgot")}</a>
        </p>
      </div>
    );
  }
  return (
    <div className="max-w-md">
      <h1 className="text-4xl font-semibold tracking-tight">{title}</h1>
      <p className="mt-4 text-lg text-muted">{t("account.choose.lead")}</p>
      {error && knownErrors.has(error) ? (
        <p role="alert" className="mt-6 border-s-4 border-accent bg-accent-soft px-4 py-3 font-sans">
          {t(`account.errors.${error}`)} {error === "link" ? <a href={passwordResetUrl()}>{t("signIn.forgot")}</a> : null}
        </p>
      ) : null}
      <form method="post" action="/api/account/password" className="mt-8 space-y-6 font-sans">
        <input type="hidden" name="_csrf" value={pageContext.csrfToken ?? ""} />
        <input type="hidden" name="token" value={token} />
        <input type="hidden" name="from" value={pageContext.urlPathname} />
        <label className="block">
          <span className="block text-sm font-semibold">{t("account.choose.password")}</span>
          <input name="password" type="password" autoComplete="new-password" minLength={12} required className="mt-2 w-full border border-rule bg-white px-3 py-2 text-base" />
        </label>
        <button type="submit" className="bg-accent px-6 py-2 text-base font-semibold text-white hover:opacity-90">
          {t("account.choose.submit")}
        </button>
      </form>
    </div>
  );
}
