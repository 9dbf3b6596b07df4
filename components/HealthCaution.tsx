import { useId } from "react";
import { useTranslation } from "react-i18next";

/** The caution PRODUCT.md asks for wherever the product touches health. */
export function HealthCaution() {
  const { t } = useTranslation();
  // A brief shows the caution twice (in the page and in the footer): each needs its own id.
  const titleId = useId();
  return (
    <aside aria-labelledby={titleId} className="border-s-4 border-accent ps-4">
      <h2 id={titleId} className="font-sans text-sm font-semibold uppercase tracking-wide text-accent">
        {t("caution.title")}
      </h2>
      <p className="mt-1 max-w-2xl text-base leading-relaxed">{t("caution.body")}</p>
    </aside>
  );
}
