import { useTranslation } from "react-i18next";
import { usePageContext } from "vike-react/usePageContext";
import { useIntl } from "#components/i18n";

export default function Page() {
  const { t } = useTranslation();
  const { href } = useIntl();
  const { is404 } = usePageContext();
  return (
    <>
      <h1 className="text-4xl font-semibold">{t(is404 ? "errorPage.notFoundTitle" : "errorPage.errorTitle")}</h1>
      <p className="mt-4 text-lg">{t(is404 ? "errorPage.notFound" : "errorPage.error")}</p>
      <p className="mt-8">
        <a href={href("/")}>{t("errorPage.home")}</a>
      </p>
    </>
  );
}
