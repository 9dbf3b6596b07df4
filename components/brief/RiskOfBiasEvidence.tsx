// How much of an outcome's evidence comes from studies at each risk of bias (METHODS.md §13): a table
// in words and numbers, and a bar whose parts differ by pattern and label as well as shade, so that
// colour is never the only cue.
import { useTranslation } from "react-i18next";
import type { OutcomeView } from "#core/publication/brief-page";
import { useIntl } from "../i18n";
import { WithTerms } from "../Term";

const levels = ["low", "someConcerns", "high", "notAssessed"] as const;

/** One fill per level: solid, stripes, cross-hatch, empty; the SVG's patterns are named per outcome. */
const fills: Record<(typeof levels)[number], string> = { low: "solid", someConcerns: "stripes", high: "hatch", notAssessed: "none" };

export function RiskOfBiasEvidence({ outcome }: { outcome: OutcomeView }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const summary = outcome.riskOfBias;
  if (!summary) return null;
  const id = `outcome-${outcome.index + 1}-rob`;
  // Participants where the format has arm sizes; else studies.
  const basis = summary.participants ? "participants" : "studies";
  const amounts = summary.participants ?? summary.studies;
  const total = levels.reduce((sum, level) => sum + amounts[level], 0);
  const percent = (level: (typeof levels)[number]) => (total > 0 ? (100 * amounts[level]) / total : 0);
  const label = levels.map((level) => `${t(`riskOfBias.level.${level}`)} ${intl.number(percent(level), 0)}%`).join(", ");
  // Where each part starts: the shares of the levels before it.
  const starts = levels.map((_, i) => levels.slice(0, i).reduce((sum, level) => sum + percent(level), 0));
  return (
    <section aria-labelledby={id} className="mt-10" data-testid="risk-of-bias">
      <h3 id={id} className="text-xl font-semibold">{t("riskOfBias.heading")}</h3>
      <p className="mt-2"><WithTerms i18nKey="riskOfBias.intro" terms={{ term: "risk-of-bias" }} /></p>
      <svg viewBox="0 0 100 8" preserveAspectRatio="none" className="mt-4 h-8 w-full max-w-2xl border border-ink" role="img" aria-label={t(`riskOfBias.barLabel.${basis}`, { summary: label })}>
        <defs>
          <pattern id={`${id}-stripes`} width="2" height="2" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="1" height="2" className="fill-ink" />
          </pattern>
          <pattern id={`${id}-hatch`} width="2" height="2" patternUnits="userSpaceOnUse" patternTransform="rotate(45)">
            <rect width="0.6" height="2" className="fill-accent" />
            <rect width="2" height="0.6" className="fill-accent" />
          </pattern>
        </defs>
        {levels.map((level, i) => {
          const width = percent(level);
          const start = starts[i];
          if (width === 0) return null;
          const fill = fills[level];
          return (
            <rect
              key={level}
              x={start}
              width={width}
              height="8"
              className={fill === "solid" ? "fill-ink" : fill === "none" ? "fill-white" : undefined}
              fill={fill === "stripes" || fill === "hatch" ? `url(#${id}-${fill})` : undefined}
              stroke="currentColor"
              strokeWidth="0.15"
              vectorEffect="non-scaling-stroke"
            />
          );
        })}
      </svg>
      {/* On a phone the columns come closer and the headings wrap; a table wider still scrolls in its own box. */}
      {/* Focusable, so that a keyboard can scroll it when a phone makes it wider than the screen. */}
      <div className="mt-3 overflow-x-auto" tabIndex={0} role="region" aria-labelledby={id}>
        <table className="font-sans text-sm">
          <thead>
            <tr className="border-b border-ink">
              <th scope="col" className="py-1 pe-3 sm:pe-6 text-start">{t("riskOfBias.column.level")}</th>
              <th scope="col" className="py-1 pe-3 sm:pe-6 text-end">{t("brief.studies")}</th>
              {summary.participants ? <th scope="col" className="py-1 pe-3 sm:pe-6 text-end">{t("compare.participants")}</th> : null}
              <th scope="col" className="py-1 text-end">{t(`riskOfBias.column.${basis}Share`)}</th>
            </tr>
          </thead>
          <tbody>
            {levels.map((level) => (
              <tr key={level} className="border-b border-rule">
                <th scope="row" className="py-1 pe-3 sm:pe-6 text-start font-normal">
                  <span aria-hidden="true" className={`me-2 inline-block h-3 w-5 border border-ink align-middle rob-swatch-${fills[level]}`} />
                  {t(`riskOfBias.level.${level}`)}
                </th>
                <td className="py-1 pe-3 sm:pe-6 text-end tabular-nums">{summary.studies[level]}</td>
                {summary.participants ? <td className="py-1 pe-3 sm:pe-6 text-end tabular-nums">{intl.number(summary.participants[level], 0)}</td> : null}
                <td className="py-1 text-end tabular-nums">{`${intl.number(percent(level), 0)}%`}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
    </section>
  );
}
