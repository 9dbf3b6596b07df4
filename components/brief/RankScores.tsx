// Rank scores, collapsed by default and only beside the three reasons they are not proof
// (PRODUCT.md). A <details> element, so it opens without JavaScript. Listed alphabetically.
import { useTranslation } from "react-i18next";
import type { OutcomeView } from "#core/publication/brief-page";
import { rankCautionKeys } from "#core/grade/rank-explainer";
import { useIntl } from "../i18n";
import { WithTerms } from "../Term";

export function RankScores({ scores }: { scores: OutcomeView["rankScores"] }) {
  const { t } = useTranslation();
  const intl = useIntl();
  return (
    <details className="mt-6 border-t border-rule pt-4" data-testid="rank-scores">
      <summary className="cursor-pointer font-sans font-semibold">{t("rankScores.title")}</summary>
      <p className="mt-3"><WithTerms i18nKey="rankScores.intro" terms={{ term: "rank-scores" }} /></p>
      <ol className="mt-3 list-decimal space-y-2 ps-6">
        {rankCautionKeys.map((key) => (
          <li key={key}>{t(key)}</li>
        ))}
      </ol>
      <table className="mt-4 font-sans text-sm">
        <caption className="mb-2 text-start text-muted">{t("brief.rankCaption")}</caption>
        <thead>
          <tr>
            <th scope="col" className="py-1 pe-6 text-start">{t("brief.option")}</th>
            <th scope="col" className="py-1 pe-6 text-end">{t("rankScores.pScore")}</th>
            <th scope="col" className="py-1 text-end">{t("rankScores.sucra", { draws: scores.draws, seed: scores.seed })}</th>
          </tr>
        </thead>
        <tbody>
          {scores.rows.map((row) => (
            <tr key={row.id} className="border-t border-rule">
              <th scope="row" className="py-1 pe-6 text-start font-normal">{row.name}</th>
              <td className="py-1 pe-6 text-end tabular-nums">{intl.number(row.pScore, 2)}</td>
              <td className="py-1 text-end tabular-nums">{intl.number(row.sucra, 2)}</td>
            </tr>
          ))}
        </tbody>
      </table>
    </details>
  );
}
