// One outcome of a version: the groups first (what the evidence supports), then each option against
// the reference as a forest plot with its table, the network of trials, the league table on demand,
// the rank-score explainer, and the methods of this outcome.
import { useTranslation } from "react-i18next";
import type { OutcomeView } from "#core/publication/brief-page";
import { ForestPlot } from "../charts/ForestPlot";
import { LeagueTable } from "../charts/LeagueTable";
import { NetworkDiagram } from "../charts/NetworkDiagram";
import { PictographSet } from "../charts/Pictograph";
import { CertaintyMark } from "./CertaintyMark";
import { formatInterval } from "#core/publication/effects";
import { GroupList } from "./GroupList";
import { RankScores } from "./RankScores";
import { RiskOfBiasEvidence } from "./RiskOfBiasEvidence";
import { flipInterval, pairFinder } from "#core/nma/pairs";
import { comparisonUrl, type VersionAddress } from "#core/publication/urls";
import { Message } from "../Message";
import { useIntl } from "../i18n";
import { Term, WithTerms } from "../Term";

/**
 * Up to this many options, a binary outcome offers each as 100 people beside the reference's 100. With
 * more, a wall of grids no longer helps a reader compare (each comparison's page still has its own).
 */
const pictographsUpTo = 8;

export function OutcomeSection({ outcome, version, nameMark = null }: { outcome: OutcomeView; version: VersionAddress; nameMark?: React.ReactNode }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const id = `outcome-${outcome.index + 1}`;
  const to = t("brief.to");
  const compareHref = (treatment: string, comparator: string) => intl.href(comparisonUrl({ ...version, treatment, comparator }));
  const findPair = pairFinder(outcome.pairs);
  const leagueCell = (row: string, column: string) => {
    const found = findPair(row, column);
    return found ? (found.flipped ? flipInterval(found.item) : found.item) : null;
  };
  const asPeople = outcome.effects.flatMap((e) => (e.absolute ? [{ name: e.name, per1000: e.absolute.treatmentPer1000, baseline: e.absolute.baselinePer1000 }] : []));
  // Effects per 1000 people exist for binary outcomes only.
  const binary = asPeople.length > 0;
  return (
    <section aria-labelledby={id} className="mt-16 border-t-2 border-ink pt-6" data-testid="outcome">
      <h2 id={id} className="text-3xl leading-tight font-semibold">
        {outcome.name}
        {nameMark}
      </h2>
      <p className="mt-2 font-sans text-sm text-muted">
        {t("brief.outcomeFacts", {
          measure: t(`brief.measure.${outcome.measure}`),
          model: t(`brief.model.${outcome.model}`),
          reference: outcome.reference.name,
          direction: t(`brief.better.${outcome.better}`),
        })}
        {outcome.unit ? ` ${t("brief.unit", { unit: outcome.unit })}` : null}
      </p>

      <h3 className="mt-8 text-xl font-semibold">{t("brief.supports")}</h3>
      <GroupList outcome={outcome} />

      <h3 className="mt-10 text-xl font-semibold">{t("brief.againstReference", { reference: outcome.reference.name })}</h3>
      <p className="mt-2 font-sans text-sm text-muted">
        <WithTerms i18nKey="brief.effectsKey" terms={{ network: "network-estimate", ci: "confidence-interval", certainty: "certainty" }} />
      </p>
      <ForestPlot
        rows={outcome.effects.map((e) => ({ label: e.name, ...e.network }))}
        measure={outcome.measure}
        title={t("brief.forestTitle", { reference: outcome.reference.name, measure: t(`brief.measure.${outcome.measure}`) })}
        axis={{ better: outcome.better, referenceName: outcome.reference.name, unit: outcome.unit }}
      />
      {/* On a phone, one card per option; from the sm breakpoint, the table. Only one is displayed, so assistive technology reads it once. */}
      <ul className="space-y-3 font-sans text-sm sm:hidden">
        {outcome.effects.map((effect) => (
          <li key={effect.id} className="border-b border-rule pb-3">
            <p className="font-semibold">{effect.name}</p>
            <p className="tabular-nums">{`${outcome.measure} ${formatInterval(outcome.measure, effect.network, to, intl.locale)}`}</p>
            {effect.absolute ? <p><Message message={effect.absolute.statement} /></p> : null}
            <p className="flex justify-between gap-4">
              <CertaintyMark rating={effect.certainty} />
              <a href={compareHref(effect.id, outcome.reference.id)} aria-label={t("brief.compareLabel", { treatment: effect.name, comparator: outcome.reference.name })}>
                {t("brief.details")}
              </a>
            </p>
          </li>
        ))}
      </ul>
      <div className="hidden overflow-x-auto sm:block">
        <table className="w-full font-sans text-sm" data-testid="effects-table">
          {/* Said above the chart in words for every reader (with the glossary's links); here for assistive technology. */}
          <caption className="sr-only">{t("brief.effectsCaption", { reference: outcome.reference.name })}</caption>
          <thead>
            <tr className="border-b border-ink">
              <th scope="col" className="py-2 pe-4 text-start">{t("brief.option")}</th>
              <th scope="col" className="py-2 pe-4 text-start">{t("brief.relative", { measure: outcome.measure })}</th>
              {binary ? <th scope="col" className="py-2 pe-4 text-start">{t("brief.absoluteHeading")}</th> : null}
              <th scope="col" className="py-2 pe-4 text-start">{t("brief.certainty")}</th>
              <th scope="col" className="py-2 text-start"><span className="sr-only">{t("brief.details")}</span></th>
            </tr>
          </thead>
          <tbody>
            {outcome.effects.map((effect) => (
              <tr key={effect.id} className="border-b border-rule align-top">
                <th scope="row" className="py-2 pe-4 text-start font-semibold">{effect.name}</th>
                <td className="py-2 pe-4 tabular-nums">{formatInterval(outcome.measure, effect.network, to, intl.locale)}</td>
                {binary ? (
                  <td className="py-2 pe-4">
                    {effect.absolute ? <Message message={effect.absolute.statement} /> : "—"}
                  </td>
                ) : null}
                <td className="py-2 pe-4"><CertaintyMark rating={effect.certainty} /></td>
                <td className="py-2">
                  <a href={compareHref(effect.id, outcome.reference.id)} aria-label={t("brief.compareLabel", { treatment: effect.name, comparator: outcome.reference.name })}>
                    {t("brief.details")}
                  </a>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
      </div>
      {binary && outcome.methods.baselineRisk !== null ? (
        <p className="mt-2 font-sans text-xs text-muted"><WithTerms i18nKey="brief.baseline" values={{ count: Math.round(outcome.methods.baselineRisk * 1000), reference: outcome.reference.name }} terms={{ per1000: "per-1000" }} /></p>
      ) : null}

      {binary && asPeople.length <= pictographsUpTo ? (
        <details className="mt-4" data-testid="as-people">
          <summary className="cursor-pointer font-sans text-sm font-semibold">{t("brief.asPeople")}</summary>
          <PictographSet outcome={outcome.name} reference={{ name: outcome.reference.name, per1000: asPeople[0]!.baseline }} options={asPeople} />
        </details>
      ) : null}

      {outcome.methods.I2 >= 0.5 || (outcome.methods.pBetween !== null && outcome.methods.pBetween < 0.05) || outcome.incoherentPairs > 0 ? (
        // Heterogeneity and incoherence in words where readers look, not only as numbers in the methods.
        <div className="mt-6 border-s-4 border-rule ps-4" data-testid="evidence-cautions">
          {outcome.methods.I2 >= 0.5 ? <p>{t("brief.plainWarnings.heterogeneity", { I2: Math.round(outcome.methods.I2 * 100) })}</p> : null}
          {outcome.methods.pBetween !== null && outcome.methods.pBetween < 0.05 ? <p className="mt-2">{t("brief.plainWarnings.inconsistency", { p: intl.precise(outcome.methods.pBetween, 2) })}</p> : null}
          {outcome.incoherentPairs > 0 ? <p className="mt-2">{t("brief.plainWarnings.incoherence", { count: outcome.incoherentPairs })}</p> : null}
        </div>
      ) : null}

      <h3 className="mt-10 text-xl font-semibold">{t("brief.network")}</h3>
      <p className="mt-2">{t("brief.networkSummary", { studies: outcome.methods.studies, options: outcome.network.nodes.length, pairs: outcome.network.edges.length })}</p>
      <figure className="mt-4 overflow-x-auto">
        <NetworkDiagram title={t("brief.networkTitle")} nodes={outcome.network.nodes.map((n) => ({ id: n.id, label: n.name, participants: n.participants }))} edges={outcome.network.edges} />
        <figcaption className="mt-2 font-sans text-xs text-muted">{t("brief.networkCaption")}</figcaption>
      </figure>
      <details className="mt-3">
        <summary className="cursor-pointer font-sans text-sm font-semibold">{t("brief.networkTable")}</summary>
        <table className="mt-3 font-sans text-sm">
          <thead>
            <tr className="border-b border-ink">
              <th scope="col" className="py-1 pe-6 text-start">{t("brief.directPair")}</th>
              <th scope="col" className="py-1 text-end">{t("brief.studies")}</th>
            </tr>
          </thead>
          <tbody>
            {outcome.network.edges.map((edge) => (
              <tr key={`${edge.from}-${edge.to}`} className="border-b border-rule">
                <th scope="row" className="py-1 pe-6 text-start font-normal">
                  {t("brief.versus", { treatment: outcome.network.nodes.find((n) => n.id === edge.from)?.name, comparator: outcome.network.nodes.find((n) => n.id === edge.to)?.name })}
                </th>
                <td className="py-1 text-end tabular-nums">{edge.studies}</td>
              </tr>
            ))}
          </tbody>
        </table>
      </details>

      <RiskOfBiasEvidence outcome={outcome} />

      <details className="mt-6 border-t border-rule pt-4" data-testid="league">
        <summary className="cursor-pointer font-sans font-semibold">{t("brief.leagueTable")}</summary>
        <div className="mt-4">
          <LeagueTable
            treatments={outcome.network.nodes.map((n) => ({ id: n.id, label: n.name }))}
            cell={leagueCell}
            href={compareHref}
            measure={outcome.measure}
            caption={t("brief.leagueCaption", { measure: t(`brief.measure.${outcome.measure}`) })}
          />
        </div>
      </details>

      <RankScores scores={outcome.rankScores} />

      <details className="mt-6 border-t border-rule pt-4">
        <summary className="cursor-pointer font-sans font-semibold">{t("brief.methods")}</summary>
        <dl className="mt-3 grid grid-cols-[max-content_1fr] gap-x-6 gap-y-1 font-sans text-sm">
          <dt className="text-muted">{t("brief.methodsList.studies")}</dt>
          <dd>{outcome.methods.studies}</dd>
          {outcome.methods.excludedStudies.length > 0 ? (
            <>
              <dt className="text-muted">{t("brief.methodsList.excluded")}</dt>
              <dd>{outcome.methods.excludedStudies.join(", ")}</dd>
            </>
          ) : null}
          <dt className="text-muted">{t("brief.methodsList.model")}</dt>
          <dd>{t(`brief.model.${outcome.model}`)}</dd>
          <dt className="text-muted"><Term term="heterogeneity">{t("brief.methodsList.heterogeneity")}</Term></dt>
          <dd>{`τ² = ${intl.number(outcome.methods.tau2, 3)}; I² = ${intl.number(outcome.methods.I2 * 100, 0)}%; Q = ${intl.number(outcome.methods.Q, 2)} (df ${outcome.methods.df})`}</dd>
          <dt className="text-muted"><Term term="incoherence">{t("brief.methodsList.incoherence")}</Term></dt>
          <dd>{`Q = ${intl.number(outcome.methods.Qbetween, 2)} (df ${outcome.methods.dfBetween})${outcome.methods.pBetween === null ? "" : `; p = ${intl.precise(outcome.methods.pBetween, 2)}`}`}</dd>
          <dt className="text-muted">{t("brief.methodsList.data")}</dt>
          <dd className="break-all">{`${outcome.methods.fileName} · SHA-256 ${outcome.methods.sha256}`}</dd>
          <dt className="text-muted">{t("brief.methodsList.engine")}</dt>
          <dd>{outcome.methods.engineVersion}</dd>
        </dl>
        <p className="mt-3 text-sm">{t(`brief.methodsText.${outcome.framework}`)}</p>
      </details>
    </section>
  );
}
