import { useTranslation } from "react-i18next";

export default function Page() {
  const { t } = useTranslation();
  return (
    <>
      <h1 className="text-4xl leading-tight font-semibold tracking-tight">{t("home.title")}</h1>
      <p className="mt-6 text-xl leading-relaxed text-muted">{t("home.lead")}</p>
      <section aria-labelledby="latest-briefs" className="mt-14">
        <h2 id="latest-briefs" className="border-b border-rule pb-2 font-sans text-sm font-semibold uppercase tracking-wide">
          {t("home.latest")}
        </h2>
        <p className="mt-6 text-lg text-muted">{t("home.empty")}</p>
      </section>
    </>
  );
}
