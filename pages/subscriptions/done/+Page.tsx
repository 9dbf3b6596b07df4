import { useTranslation } from "react-i18next";
import { usePageContext } from "vike-react/usePageContext";
import { useIntl } from "#components/i18n";

const outcomes = new Set(["sent", "confirmed", "unsubscribed", "invalid", "too-many"]);

/** Where each alerts form lands: what became of the request, in words. */
export default function Page() {
  const { t } = useTranslation();
  const { href } = useIntl();
  const what = String(usePageContext().urlParsed.search.what ?? "");
  return (
    <div className="max-w-md">
      <h1 className="text-4xl font-semibold tracking-tight">{t("subscriptions.doneTitle")}</h1>
      <p role="status" className="mt-6 text-lg">
        {t(`subscriptions.done.${outcomes.has(what) ? what : "invalid"}`)}
      </p>
      <p className="mt-6 font-sans">
        <a href={href("/briefs")}>{t("subscriptions.home")}</a>
      </p>
    </div>
  );
}
