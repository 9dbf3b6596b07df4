// The reader's side-by-side: the 2 to 4 options they chose, in their order, each against the reference
// in every outcome (effect, per 1000, certainty, group), then every pair among them with its statement,
// linked to its comparison page. Never ordered by any score; the rank caution stays.
import { useTranslation } from "react-i18next";
import type { SideBySidePageData } from "#web/pages/page-data";
import { formatInterval } from "#core/publication/effects";
import { comparisonUrl, versionUrl } from "#core/publication/urls";
import { HealthCaution } from "../HealthCaution";
import { Message } from "../Message";
import { useIntl } from "../i18n";
import { CertaintyMark } from "./CertaintyMark";
import { Term } from "../Term";
import { WithdrawnFindings, WithinVersionOpening } from "./Notices";
import { CiteBlock } from "./CiteBlock";

export function SideBySidePage({ data }: { data: SideBySidePageData }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const { view } = data;
  const version = { slug: view.slug, version: view.version };
  const list = new Intl.ListFormat(intl.locale, { type: "conjunction" }).format(view.options.map((o) => o.name));
  return (
    <article data-testid="side-by-side">
      <WithinVersionOpening view={view} translation={data.translation} back={t("sideBySide.back", { title: view.title })} title={t("sideBySide.heading", { options: list })} />
      <p className="mt-3 text-lg text-muted">{t("sideBySide.lead", { reference: view.outcomes[0]?.reference.name ?? "" })}</p>
      <p className="mt-6 border-s-4 border-rule ps-4 text-muted">{t("brief.notALeaderboard")}</p>

      <WithdrawnFindings withdrawn={view.withdrawal !== null}>
        {view.outcomes.map((outcome) => (
          <section key={outcome.index} aria-labelledby={`outcome-${outcome.index + 1}`} className="mt-12 border-t-2 border-ink pt-6" data-testid="side-by-side-outcome">
            <h2 id={`outcome-${outcome.index + 1}`} className="text-2xl font-semibold">{outcome.name}</h2>
            <div className="mt-4 overflow-x-auto" tabIndex={0} role="region" aria-labelledby={`outcome-${outcome.index + 1}`}>
              <table className="w-full font-sans text-sm">
                <thead>
                  <tr className="border-b border-ink text-start">
                    <th scope="col" className="py-2 pe-3 text-start">{t("sideBySide.option")}</th>
                    <th scope="col" className="py-2 pe-3 text-start"><Term term="confidence-interval">{t("sideBySide.effect", { measure: outcome.measure })}</Term></th>
                    <th scope="col" className="py-2 pe-3 text-start"><Term term="per-1000">{t("sideBySide.per1000")}</Term></th>
                    <th scope="col" className="py-2 pe-3 text-start"><Term term="certainty">{t("sideBySide.certainty")}</Term></th>
                    <th scope="col" className="py-2 text-start">{t("sideBySide.group")}</th>
                  </tr>
                </thead>
                <tbody>
                  {outcome.rows.map((row) => (
                    <tr key={row.option.id} className="border-b border-rule align-top">
                      <th scope="row" className="py-2 pe-3 text-start font-semibold">{row.option.name}</th>
                      {row.isReference || !row.effect ? (
                        <td colSpan={3} className="py-2 pe-3 text-muted">{t(row.isReference ? "sideBySide.isReference" : "sideBySide.notStudied")}</td>
                      ) : (
                        <>
                          <td className="py-2 pe-3 tabular-nums">
                            {formatInterval(outcome.measure, row.effect.network, t("brief.to"), intl.locale)}
                            {outcome.unit ? ` ${outcome.unit}` : ""}
                          </td>
                          <td className="py-2 pe-3">{row.effect.absolute ? <Message message={row.effect.absolute.statement} /> : "—"}</td>
                          <td className="py-2 pe-3">
                            <CertaintyMark rating={row.effect.certainty} />
                          </td>
                        </>
                      )}
                      <td className="py-2">{row.group ? <Message message={row.group} /> : "—"}</td>
                    </tr>
                  ))}
                </tbody>
              </table>
            </div>
            {outcome.pairs.length > 0 ? (
              <>
                <h3 className="mt-6 font-sans text-sm font-semibold uppercase tracking-wide">{t("sideBySide.between")}</h3>
                <ul className="mt-2 space-y-3">
                  {outcome.pairs.map((pair) => (
                    <li key={`${pair.a.id}-${pair.b.id}`} data-testid="side-by-side-pair">
                      <a href={intl.href(comparisonUrl({ ...version, treatment: pair.a.id, comparator: pair.b.id }))} className="font-sans text-sm font-semibold">
                        {t("brief.versus", { treatment: pair.a.name, comparator: pair.b.name })}
                      </a>
                      <p className="mt-1">{pair.statement ? <Message message={pair.statement} /> : t("compare.noStatement")}</p>
                      <CertaintyMark rating={pair.certainty} />
                    </li>
                  ))}
                </ul>
              </>
            ) : null}
          </section>
        ))}
      </WithdrawnFindings>

      <div className="mt-12">
        <HealthCaution />
      </div>
      <p className="mt-6 font-sans text-sm print:hidden">
        <a href={`${intl.href(versionUrl(version))}#side-by-side-title`}>{t("sideBySide.changeChoice")}</a>
      </p>
      <CiteBlock heading={t("cite.brief")} reference={data.citation.reference} accessed={data.citation.accessed} permalink={data.citation.permalink} citing={version} />
    </article>
  );
}
