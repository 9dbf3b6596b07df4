// Results review: forest plot against the reference, the network, the league table, and plain
// warnings about heterogeneity and incoherence.
import { useTranslation } from "react-i18next";
import { useParams } from "react-router";
import { DeskLink } from "../DeskLink";
import { comparisonOf } from "#core/nma/comparison";
import { ForestPlot } from "../../charts/ForestPlot";
import { LeagueTable } from "../../charts/LeagueTable";
import { NetworkDiagram } from "../../charts/NetworkDiagram";
import { useResult, useTreatmentName } from "../queries";

export function ResultsScreen() {
  const { t } = useTranslation();
  const { briefId = "", outcomeId = "" } = useParams();
  const query = useResult(outcomeId);
  const name = useTreatmentName(briefId);
  if (query.isError) return <p role="alert">{t("desk.error", { message: query.error.message })}</p>;
  if (!query.data) return <p aria-live="polite">{t("desk.loading")}</p>;
  const result = query.data;
  const others = result.treatments.filter((x) => x !== result.reference);
  const forestRows = others.map((treatment) => {
    const c = comparisonOf(result, treatment, result.reference)!;
    return { label: name(treatment), estimate: c.network.estimate, lower: c.network.lower, upper: c.network.upper };
  });
  const incoherent = result.comparisons.filter((c) => c.incoherence && c.incoherence.p < 0.05);
  const { heterogeneity, inconsistency } = result;
  const fixed3 = (x: number) => x.toFixed(3);
  return (
    <>
      <p className="font-sans text-sm">
        <DeskLink to={`/briefs/${briefId}`}>{t("desk.backToBrief")}</DeskLink>
      </p>
      <h1 className="mt-2 text-3xl font-semibold">{t("desk.results")}</h1>
      <p className="mt-2 font-sans text-sm">
        <DeskLink to={`/briefs/${briefId}/outcomes/${outcomeId}/certainty`}>{t("desk.certainty")}</DeskLink>
      </p>
      <section className="mt-6 space-y-2 font-sans text-sm">
        <p>{t("desk.heterogeneity", { tau2: fixed3(result.tau2), i2: (heterogeneity.I2 * 100).toFixed(0), q: heterogeneity.Q.toFixed(2), df: heterogeneity.df })}</p>
        <p>{t("desk.inconsistency", { q: inconsistency.Qbetween.toFixed(2), df: inconsistency.dfBetween, p: inconsistency.pBetween === null ? "—" : inconsistency.pBetween.toPrecision(2) })}</p>
        {heterogeneity.I2 >= 0.5 ? <p role="note" className="border-s-4 border-accent ps-3">{t("desk.highHeterogeneity")}</p> : null}
        {inconsistency.pBetween !== null && inconsistency.pBetween < 0.05 ? <p role="note" className="border-s-4 border-accent ps-3">{t("desk.inconsistencyWarning")}</p> : null}
        {incoherent.length > 0 ? (
          <p role="note" className="border-s-4 border-accent ps-3">
            {t("desk.incoherentPairs", { pairs: incoherent.map((c) => `${name(c.treatment)} vs ${name(c.comparator)}`).join(", ") })}
          </p>
        ) : null}
        {result.excludedStudies.length > 0 ? <p>{t("desk.excluded", { studies: result.excludedStudies.join(", ") })}</p> : null}
      </section>
      <ForestPlot rows={forestRows} measure={result.measure} title={t("desk.forestTitle", { reference: name(result.reference), measure: result.measure })} axis={{ better: result.better, referenceName: name(result.reference) }} />
      <NetworkDiagram
        title={t("desk.networkTitle")}
        nodes={result.treatments.map((id) => ({ id, label: name(id), participants: result.network.participants[id] ?? null }))}
        edges={result.network.edges.map((e) => ({ from: e.treatment, to: e.comparator, studies: e.studies }))}
      />
      <details className="mt-8">
        <summary className="cursor-pointer font-sans font-semibold">{t("desk.leagueTable")}</summary>
        <div className="mt-4">
          <LeagueTable
            treatments={result.treatments.map((id) => ({ id, label: name(id) }))}
            measure={result.measure}
            caption={t("desk.leagueCaption", { measure: result.measure })}
            cell={(row, column) => comparisonOf(result, row, column)?.network ?? null}
          />
        </div>
      </details>
    </>
  );
}
