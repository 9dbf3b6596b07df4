import { useTranslation } from "react-i18next";

/** The caution PRODUCT.md asks for wherever the product touches health. */
export function HealthCaution() {
  const { t } = useTranslation();
  return (
    <aside aria-labelledby="health-caution-title" className="border-s-4 border-accent ps-4">
      <h2 id="health-caution-title" className="font-sans text-sm font-semibold uppercase tracking-wide text-accent">
        {t("caution.title")}
      </h2>
      <p className="mt-1 max-w-2xl text-base leading-relaxed">{t("caution.body")}</p>
    </aside>
  );
}
