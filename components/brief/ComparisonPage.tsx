// One comparison in one version, as reporters cite it: per outcome the plain-language statement,
// the relative and absolute effect with 95% CI, the certainty in words with its footnoted reasons,
// and the direct, indirect and network evidence side by side.
import { useTranslation } from "react-i18next";
import type { ComparisonOutcomeView } from "#core/publication/brief-page";
import type { ComparisonPageData } from "#web/pages/page-data";
import { HealthCaution } from "../HealthCaution";
import { CertaintyMark } from "./CertaintyMark";
import { CertaintyPath } from "./CertaintyPath";
import { CiteBlock } from "./CiteBlock";
import { EmbedCode } from "./EmbedCode";
import { ImportantStudies } from "./ImportantStudies";
import { formatInterval } from "#core/publication/effects";
import { WithdrawnFindings, WithinVersionOpening } from "./Notices";
import { Pictograph } from "../charts/Pictograph";
import { comparisonUrl } from "#core/publication/urls";
import { Message } from "../Message";
import { useIntl } from "../i18n";
import { Term } from "../Term";

export function ComparisonPage({ data }: { data: ComparisonPageData }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const { view, citation } = data;
  const at = { slug: view.slug, version: view.version, treatment: view.treatment.id, comparator: view.comparator.id };
  const date = intl.date({ dateStyle: "long", timeZone: "UTC" });
  const versus = t("brief.versus", { treatment: view.treatment.name, comparator: view.comparator.name });
  return (
    <article data-testid="comparison">
      <WithinVersionOpening view={view} translation={data.translation} back={t("compare.back", { title: view.title })} title={versus} />
      <p className="mt-3 font-sans text-sm text-muted">
        {view.embargoed ? t("compare.inEmbargoed", { version: view.version, date: intl.moment(view.releaseAt, view.timeZone) }) : t("compare.inVersion", { version: view.version, date: date.format(new Date(view.releaseAt)) })} ·{" "}
        <a href={intl.href(comparisonUrl({ ...at, treatment: at.comparator, comparator: at.treatment }))}>{t("compare.reverse")}</a>
      </p>
      <WithdrawnFindings withdrawn={view.withdrawal !== null}>
        {view.outcomes.map((outcome) => (
          <OutcomeComparison key={outcome.index} outcome={outcome} names={{ treatment: view.treatment.name, comparator: view.comparator.name }} />
        ))}
      </WithdrawnFindings>
      <div className="mt-12">
        <HealthCaution />
      </div>
      {view.withdrawal ? null : <EmbedCode at={at} permalink={citation.permalink} title={versus} outcomes={view.outcomes.length} />}
      <CiteBlock heading={t("cite.comparison")} reference={citation.reference} accessed={citation.accessed} permalink={citation.permalink} citing={at} />
    </article>
  );
}

function OutcomeComparison({ outcome, names }: { outcome: ComparisonOutcomeView; names: { treatment: string; comparator: string } }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const to = t("brief.to");
  const id = `outcome-${outcome.index + 1}`;
  const unit = outcome.unit ? ` ${outcome.unit}` : "";
  const notePrefix = `${id}-note-`;
  return (
    <section aria-labelledby={id} className="mt-12 border-t-2 border-ink pt-6" data-testid="comparison-outcome">
      <h2 id={id} className="text-2xl font-semibold">{outcome.name}</h2>
      <p className="mt-4 text-xl leading-relaxed" data-testid="statement">
        {outcome.statement ? <Message message={outcome.statement} /> : t("compare.noStatement")}
      </p>
      <dl className="mt-6 grid gap-x-8 gap-y-3 sm:grid-cols-[max-content_1fr]">
        <dt className="font-sans text-sm font-semibold">
          <Term term="confidence-interval">{t("compare.relative", { measure: t(`brief.measure.${outcome.measure}`) })}</Term>
        </dt>
        <dd className="tabular-nums">
          {formatInterval(outcome.measure, outcome.network, to, intl.locale)}
          {unit}
        </dd>
        {outcome.absolute ? (
          <>
            <dt className="font-sans text-sm font-semibold">
              <Term term="per-1000">{t("compare.absolute")}</Term>
            </dt>
            <dd>
              <Message message={outcome.absolute.statement} />
              <span className="block font-sans text-sm text-muted">
                {t("compare.risks", {
                  comparator: Math.round(outcome.absolute.baselinePer1000),
                  treatment: Math.round(outcome.absolute.treatmentPer1000.estimate),
                })}
              </span>
            </dd>
          </>
        ) : null}
        <dt className="font-sans text-sm font-semibold">
          <Term term="certainty">{t("brief.certainty")}</Term>
        </dt>
        <dd>
          <CertaintyMark rating={outcome.certainty} />
          {outcome.footnotes.map((_, i) => (
            <sup key={i} className="ms-1">
              <a href={`#${notePrefix}${i + 1}`} aria-label={t("compare.footnote", { number: i + 1 })}>{i + 1}</a>
            </sup>
          ))}
        </dd>
      </dl>

      {outcome.absolute ? (
        <Pictograph
          input={{
            outcome: outcome.name,
            comparatorName: names.comparator,
            optionName: names.treatment,
            comparatorPer1000: outcome.absolute.baselinePer1000,
            option: outcome.absolute.treatmentPer1000,
          }}
        />
      ) : null}

      <div className="mt-6 overflow-x-auto">
        <table className="w-full font-sans text-sm" data-testid="evidence-table">
          <caption className="mb-2 text-start text-muted">{t("compare.evidenceCaption")}</caption>
          <thead>
            <tr className="border-b border-ink">
              <th scope="col" className="py-2 pe-4 text-start">{t("compare.evidence")}</th>
              <th scope="col" className="py-2 pe-4 text-start">{t("compare.estimate", { measure: outcome.measure })}</th>
              <th scope="col" className="py-2 pe-4 text-end">{t("brief.studies")}</th>
              <th scope="col" className="py-2 text-end">{t("compare.participants")}</th>
            </tr>
          </thead>
          <tbody>
            <tr className="border-b border-rule">
              <th scope="row" className="py-2 pe-4 text-start font-normal"><Term term="direct-estimate">{t("compare.direct")}</Term></th>
              <td className="py-2 pe-4 tabular-nums">{outcome.direct ? formatInterval(outcome.measure, outcome.direct, to, intl.locale) : t("compare.noDirect")}</td>
              <td className="py-2 pe-4 text-end tabular-nums">{outcome.direct?.studies ?? 0}</td>
              <td className="py-2 text-end tabular-nums">{outcome.direct?.participants ?? "—"}</td>
            </tr>
            <tr className="border-b border-rule">
              <th scope="row" className="py-2 pe-4 text-start font-normal"><Term term="indirect-estimate">{t("compare.indirect")}</Term></th>
              <td className="py-2 pe-4 tabular-nums">{outcome.indirect ? formatInterval(outcome.measure, outcome.indirect, to, intl.locale) : t("compare.noIndirect")}</td>
              <td className="py-2 pe-4 text-end">—</td>
              <td className="py-2 text-end">—</td>
            </tr>
            <tr className="border-b border-rule font-semibold">
              <th scope="row" className="py-2 pe-4 text-start"><Term term="network-estimate">{t("compare.network")}</Term></th>
              <td className="py-2 pe-4 tabular-nums">{formatInterval(outcome.measure, outcome.network, to, intl.locale)}</td>
              <td className="py-2 pe-4 text-end">—</td>
              <td className="py-2 text-end">—</td>
            </tr>
          </tbody>
        </table>
      </div>

      <CertaintyPath outcome={outcome} names={names} />

      {outcome.footnotes.length > 0 ? (
        <ol className="mt-4 list-decimal space-y-1 ps-6 text-sm" aria-label={t("compare.footnotes")}>
          {outcome.footnotes.map((note, i) => (
            <li key={i} id={`${notePrefix}${i + 1}`}>
              {note.levels > 0 ? t("compare.downgraded", { domain: t(note.domainKey), count: note.levels }) : `${t(note.domainKey)}.`}
              {note.reason ? ` ${note.reason}` : note.because ? <> <Message message={note.because} /></> : null}
            </li>
          ))}
        </ol>
      ) : null}

      <ImportantStudies outcome={outcome} />
    </section>
  );
}
