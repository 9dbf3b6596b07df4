// A version of a brief, as the public reads it: notices, the editor's texts, the health caution,
// each outcome, how to cite it, the data, and the version history. Rendered from the snapshot only;
// the outcomes come rendered already (RenderedOutcomes.tsx).
import { useTranslation } from "react-i18next";
import type { BriefPageData } from "#web/pages/page-data";
import { HealthCaution } from "../HealthCaution";
import { CiteBlock } from "./CiteBlock";
import { SubscribeForm } from "../SubscribeForm";
import { useUntranslated, VersionBanners, WithdrawnFindings } from "./Notices";
import { RenderedOutcomes } from "./RenderedOutcomes";
import { VersionHistory } from "./VersionHistory";
import { VersionChanges } from "./VersionChanges";
import { downloadUrl, sideBySideUrl, topicUrl } from "#core/publication/urls";
import { useIntl } from "../i18n";

export function BriefPage({ data }: { data: BriefPageData }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const { view, citation } = data;
  // Texts shown in the original (no translation yet, or a passage a correction changed) are marked as English.
  const untranslated = useUntranslated(data.translation);
  const version = { slug: view.slug, version: view.version };
  const date = intl.date({ dateStyle: "long", timeZone: "UTC" });
  return (
    <article data-testid="brief">
      <VersionBanners view={view} translation={data.translation} />
      <header>
        <p className="font-sans text-xs font-semibold uppercase tracking-wide text-muted">
          <a href={intl.href(topicUrl(view.topicSlug))} className="text-muted" lang={untranslated.lang("topic")}>{view.topic}</a> · <span lang={untranslated.lang("condition")}>{view.condition}</span>
          {untranslated.mark("topic") ?? untranslated.mark("condition")}
        </p>
        <h1 className="mt-2 text-4xl leading-tight font-semibold tracking-tight">
          <span lang={untranslated.lang("title")}>{view.title}</span>
          {untranslated.mark("title")}
        </h1>
        <p className="mt-3 text-lg text-muted">
          {t("brief.population", { population: view.population })}
          {untranslated.mark("population")}
        </p>
        <p className="mt-3 font-sans text-sm">
          {view.embargoed ? t("brief.embargoedLine", { version: view.version, date: intl.moment(view.releaseAt, view.timeZone) }) : t("brief.versionLine", { version: view.version, date: date.format(new Date(view.releaseAt)) })}
          {view.history.length > 1 ? (
            <>
              {" · "}
              <a href="#history-title">{t("brief.allVersions", { count: view.history.length })}</a>
            </>
          ) : null}
        </p>
        {view.note ? (
          <p className="mt-2 border-s-4 border-accent ps-3">
            {t("brief.correctionNote", { note: view.note })}
            {untranslated.mark("note")}
          </p>
        ) : null}
      </header>

      {data.changes ? <VersionChanges changes={data.changes} slug={view.slug} /> : null}

      {view.texts.shortTakeHtml ? (
        <section aria-labelledby="short-take" className="mt-10 bg-white p-6">
          <h2 id="short-take" className="font-sans text-sm font-semibold uppercase tracking-wide">
            {t("brief.shortTake")}
            {untranslated.mark("shortTake")}
          </h2>
          <div lang={untranslated.lang("shortTake")} className="prose-brief mt-3" dangerouslySetInnerHTML={{ __html: view.texts.shortTakeHtml }} />
        </section>
      ) : null}
      {view.texts.laySummaryHtml ? (
        <section aria-labelledby="summary" className="mt-10">
          <h2 id="summary" className="font-sans text-sm font-semibold uppercase tracking-wide">
            {t("brief.summary")}
            {untranslated.mark("summary")}
          </h2>
          <div lang={untranslated.lang("summary")} className="prose-brief mt-3 text-lg leading-relaxed" dangerouslySetInnerHTML={{ __html: view.texts.laySummaryHtml }} />
        </section>
      ) : null}

      <div className="mt-10">
        <HealthCaution />
      </div>

      <p className="mt-10 border-s-4 border-rule ps-4 text-muted">{t("brief.notALeaderboard")}</p>

      {view.outcomes.length > 1 ? (
        <nav aria-label={t("brief.outcomesNav")} className="mt-10 font-sans text-sm print:hidden">
          <p className="font-semibold">{t("brief.outcomesNav")}</p>
          <ol className="mt-2 list-decimal ps-6">
            {view.outcomes.map((outcome) => (
              <li key={outcome.index}>
                <a href={`#outcome-${outcome.index + 1}`}>{outcome.name}</a>
              </li>
            ))}
          </ol>
        </nav>
      ) : null}

      <WithdrawnFindings withdrawn={view.withdrawal !== null}>
        <RenderedOutcomes html={data.outcomesHtml} />
      </WithdrawnFindings>
      <p className="hidden font-sans text-sm text-muted print:block">{t("brief.printFolded")}</p>

      {view.withdrawal ? null : (
        // A plain GET form: it works without JavaScript and by keyboard; the server puts the choice in
        // order and redirects to the one address of the side-by-side (server/web/pages/page-data.ts).
        <section aria-labelledby="side-by-side-title" className="mt-16 border-t border-rule pt-6 print:hidden" data-testid="side-by-side-form">
          <h2 id="side-by-side-title" className="text-xl font-semibold">{t("sideBySide.formTitle")}</h2>
          <p className="mt-2">{t("sideBySide.formLead")}</p>
          <form method="get" action={intl.href(sideBySideUrl(version))} className="mt-3 font-sans text-sm">
            <fieldset className="grid gap-2 sm:grid-cols-2">
              <legend className="sr-only">{t("sideBySide.formTitle")}</legend>
              {[...view.treatments]
                .sort((a, b) => a.name.localeCompare(b.name, intl.locale))
                .map((treatment) => (
                  <label key={treatment.id} className="flex items-center gap-2">
                    <input type="checkbox" name="option" value={treatment.id} className="h-4 w-4" />
                    {treatment.name}
                  </label>
                ))}
            </fieldset>
            <button type="submit" className="mt-4 bg-accent px-5 py-2 font-semibold text-white hover:opacity-90">{t("sideBySide.submit")}</button>
          </form>
        </section>
      )}

      <CiteBlock heading={t("cite.brief")} reference={citation.reference} accessed={citation.accessed} permalink={citation.permalink} citing={version} />
      <SubscribeForm topic={view.topic} topicSlug={view.topicSlug} />

      <section aria-labelledby="data-title" className="mt-16 border-t border-rule pt-6 print:hidden">
        <h2 id="data-title" className="text-xl font-semibold">{t("brief.data")}</h2>
        {view.withdrawal ? (
          <p className="mt-2">{t("brief.withdrawn.noData")}</p>
        ) : (
          <>
            <p className="mt-2">{t("brief.dataLead")}</p>
            <ul className="mt-3 space-y-1 font-sans text-sm" data-testid="downloads">
              {(["inputs.csv", "inputs.json", "results.csv", "results.json"] as const).map((file) => (
                <li key={file}>
                  <a href={intl.href(downloadUrl(version, file))}>{t(`brief.download.${file.replace(".", "_")}`)}</a>
                </li>
              ))}
            </ul>
          </>
        )}
      </section>

      <VersionHistory slug={view.slug} history={view.history} current={view.version} />
    </article>
  );
}
