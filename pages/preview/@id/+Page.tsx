import { useMemo } from "react";
import { I18nextProvider, useTranslation } from "react-i18next";
import { useData } from "vike-react/useData";
import { BriefPage } from "#components/brief/BriefPage";
import { createI18n } from "#components/i18n";
import type { PreviewPageData } from "#web/pages/page-data";

export default function Page() {
  const data = useData<PreviewPageData>();
  const { t } = useTranslation();
  const i18n = useMemo(() => createI18n(data.locale), [data.locale]);
  return (
    <>
      <section role="note" className="mb-8 border-2 border-dashed border-accent p-4 font-sans text-sm" data-testid="preview-banner">
        <p className="font-semibold">{t("preview.title")}</p>
        <p className="mt-1">{t("preview.body")}</p>
        <form method="get" className="mt-3 flex items-end gap-3">
          <label className="block">
            <span className="block font-semibold">{t("preview.locale")}</span>
            <select name="locale" defaultValue={data.locale} className="mt-1 border border-ink bg-white px-2 py-1">
              {data.locales.map((locale) => (
                <option key={locale} value={locale}>{t(`preview.localeName.${locale}`)}</option>
              ))}
            </select>
          </label>
          <button type="submit" className="border border-ink px-3 py-1">{t("preview.show")}</button>
          <a href={`/desk/briefs/${data.briefId}`}>{t("preview.back")}</a>
        </form>
      </section>
      {data.page ? (
        <I18nextProvider i18n={i18n}>
          <BriefPage data={data.page} />
        </I18nextProvider>
      ) : (
        <p role="alert">{t("preview.notReady", { problem: data.problem })}</p>
      )}
    </>
  );
}
