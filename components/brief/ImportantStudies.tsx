// "The studies that matter most for this comparison" (METHODS.md §13): each study's importance in
// words first with its number beside, and its risk of bias in words. Importances are the loss of
// precision without the study (Rücker et al. 2020), not shares: the page says so.
import { useTranslation } from "react-i18next";
import type { ComparisonOutcomeView } from "#core/publication/brief-page";
import { riskOfBiasShareKey } from "#core/nma/risk-of-bias";
import { useIntl } from "../i18n";
import { Term } from "../Term";

/** Our own bands, in plain words (docs/methods.md): how much less precise the estimate would be without the study. */
export function importanceWords(value: number): "only" | "much" | "noticeably" | "somewhat" | "slightly" {
  if (value >= 1 - 1e-9) return "only";
  if (value >= 0.5) return "much";
  if (value >= 0.2) return "noticeably";
  if (value >= 0.05) return "somewhat";
  return "slightly";
}


export function ImportantStudies({ outcome }: { outcome: ComparisonOutcomeView }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const id = `outcome-${outcome.index + 1}-studies`;
  return (
    <section aria-labelledby={id} className="mt-8" data-testid="important-studies">
      <h3 id={id} className="text-xl font-semibold">{t("compare.studies.heading")}</h3>
      {outcome.importance === null ? (
        <p className="mt-2 text-muted">{t("compare.studies.notComputed")}</p>
      ) : outcome.importance.length === 0 ? (
        <p className="mt-2 text-muted">{t("compare.studies.none")}</p>
      ) : (
        <>
          <p className="mt-2">{t("compare.studies.intro")}</p>
          <div className="mt-3 overflow-x-auto">
            <table className="w-full font-sans text-sm">
              <thead>
                <tr className="border-b border-ink">
                  <th scope="col" className="py-2 pe-4 text-start">{t("compare.studies.study")}</th>
                  <th scope="col" className="py-2 pe-4 text-start">{t("compare.studies.withoutIt")}</th>
                  <th scope="col" className="py-2 text-start"><Term term="risk-of-bias">{t("compare.studies.riskOfBias")}</Term></th>
                </tr>
              </thead>
              <tbody>
                {outcome.importance.map((study) => (
                  <tr key={study.study} className="border-b border-rule align-top">
                    <th scope="row" className="py-2 pe-4 text-start font-semibold">{study.study}</th>
                    <td className="py-2 pe-4">
                      {t(`compare.studies.words.${importanceWords(study.value)}`)}{" "}
                      <span className="text-muted tabular-nums">({t("compare.studies.value", { value: study.value >= 0.1 ? intl.number(study.value, 2) : intl.precise(study.value, 2) })})</span>
                    </td>
                    <td className="py-2">{outcome.judged ? t(`riskOfBias.level.${riskOfBiasShareKey(study.riskOfBias)}`) : t("riskOfBias.noJudgements")}</td>
                  </tr>
                ))}
              </tbody>
            </table>
          </div>
          <p className="mt-2 font-sans text-xs text-muted">{t("compare.studies.notPercentages")}</p>
        </>
      )}
    </section>
  );
}
