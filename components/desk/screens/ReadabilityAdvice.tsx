// The plain-language check beside a text the public will read (server/core/editorial/readability.ts): a
// reading-ease figure with its formula and source named, the longest sentences, and the terms lay
// readers trip on with a plainer phrasing. Advice only: it never stops anyone from saving.
import { useTranslation } from "react-i18next";
import type { Locale } from "#core/languages/locales";
import { longSentenceWords, readability } from "#core/editorial/readability";

export function ReadabilityAdvice({ text, locale }: { text: string; locale: Locale }) {
  const { t } = useTranslation();
  const report = readability(text, locale);
  if (report.counts.words === 0) return null;
  return (
    <aside className="mt-2 border-s-4 border-rule bg-paper px-3 py-2 font-sans text-sm" aria-label={t("desk.readability.heading")} data-testid="readability">
      <p className="font-semibold">{t("desk.readability.heading")}</p>
      {report.formula && report.score !== null ? (
        <p>
          <span data-testid="readability-score">{t("desk.readability.score", { score: Math.round(report.score), band: t(`desk.readability.band.${report.band}`) })}</span>{" "}
          <span className="text-muted">{t(`desk.readability.formula.${report.formula}`)}</span>
        </p>
      ) : (
        <p>{t("desk.readability.noFormula")}</p>
      )}
      <p className="text-muted">{t("desk.readability.counts", { sentences: report.counts.sentences, words: report.counts.words })}</p>
      {report.longest.length > 0 ? (
        <>
          <p className="mt-1">{t("desk.readability.longest", { limit: longSentenceWords })}</p>
          <ul className="list-disc ps-5">
            {report.longest.map((s) => (
              <li key={s.sentence}>
                <mark className="bg-accent-soft">{s.sentence}</mark> <span className="text-muted">({s.words})</span>
              </li>
            ))}
          </ul>
        </>
      ) : null}
      {report.jargon.length > 0 ? (
        <>
          <p className="mt-1">{t("desk.readability.jargon")}</p>
          <ul className="list-disc ps-5" data-testid="jargon">
            {report.jargon.map((j) => (
              <li key={j.term}>{t("desk.readability.suggestion", { term: j.term, plain: j.plain })}</li>
            ))}
          </ul>
        </>
      ) : null}
      <p className="mt-1 text-xs text-muted">{t("desk.readability.advice")}</p>
    </aside>
  );
}
