// The notices above a version's content: fictional data, the language of its texts, withdrawal,
// embargo, a newer version.
import { useTranslation } from "react-i18next";
import type { BriefHeader, PageState } from "#core/publication/brief-page";
import { briefUrl, versionUrl } from "#core/publication/urls";
import { useIntl } from "../i18n";

/**
 * The opening of a page within a version (one comparison, the reader's side-by-side): the version's
 * notices, the way back to the version's page, and the page's title.
 */
export function WithinVersionOpening({ view, translation, back, title }: { view: BriefHeader & PageState; translation: TranslationState; back: string; title: string }) {
  const intl = useIntl();
  return (
    <>
      <VersionBanners view={view} translation={translation} />
      <p className="font-sans text-sm">
        <a href={intl.href(versionUrl({ slug: view.slug, version: view.version }))}>{back}</a>
      </p>
      <h1 className="mt-3 text-4xl leading-tight font-semibold tracking-tight">{title}</h1>
    </>
  );
}

/** Everything shown above a version's content, for its brief page and its comparison pages. */
export function VersionBanners({ view, translation }: { view: BriefHeader & PageState; translation: TranslationState }) {
  return (
    <>
      {view.demo ? <DemoBanner /> : null}
      {translation ? <TranslationNotice translation={translation} /> : null}
      <VersionNotices
        withdrawal={view.withdrawal}
        embargoed={view.embargoed}
        releaseAt={view.releaseAt}
        timeZone={view.timeZone}
        version={view.version}
        latestVersion={view.latestVersion}
        latestHref={briefUrl(view.slug)}
      />
    </>
  );
}

/** null on English pages; otherwise when the version's texts were published in the reader's language, if they were. */
export type TranslationState = { locale: string; publishedAt: string | null; open: string[] } | null;

/**
 * A translated page says when its translation was published; a page whose texts are not translated
 * yet says so in the reader's language, before the original texts (the generated sentences, groups and
 * cautions are always in the reader's language).
 */
function TranslationNotice({ translation }: { translation: NonNullable<TranslationState> }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const date = intl.date({ dateStyle: "long", timeZone: "UTC" });
  return (
    <p role="note" className="mb-8 border-s-4 border-rule bg-white p-4 font-sans text-sm" data-testid="translation-notice">
      {!translation.publishedAt
        ? t("brief.translation.none")
        : translation.open.length > 0
          ? t("brief.translation.partial", { date: date.format(new Date(translation.publishedAt)) })
          : t("brief.translation.published", { date: date.format(new Date(translation.publishedAt)) })}
    </p>
  );
}

function DemoBanner() {
  const { t } = useTranslation();
  return (
    <p role="note" className="mb-8 border border-accent px-4 py-3 font-sans text-sm text-accent" data-testid="demo-banner">
      <strong className="font-semibold">{t("brief.demo.title")}</strong> {t("brief.demo.body")}
    </p>
  );
}

function VersionNotices({
  withdrawal,
  embargoed,
  releaseAt,
  timeZone,
  version,
  latestVersion,
  latestHref,
}: {
  withdrawal: { at: string; reason: string } | null;
  embargoed: boolean;
  releaseAt: string;
  timeZone: string;
  version: number;
  latestVersion: number;
  latestHref: string;
}) {
  const { t } = useTranslation();
  const intl = useIntl();
  const when = intl.date({ dateStyle: "long", timeStyle: "short", timeZone: "UTC" });
  const release = intl.moment(releaseAt, timeZone);
  return (
    <>
      {withdrawal ? (
        <section role="alert" aria-labelledby="withdrawn-title" className="mb-8 border-s-4 border-ink bg-white p-4" data-testid="withdrawn">
          <h2 id="withdrawn-title" className="font-sans text-sm font-semibold uppercase tracking-wide">
            {t("brief.withdrawn.title", { date: when.format(new Date(withdrawal.at)) })}
          </h2>
          <p className="mt-1">{withdrawal.reason}</p>
          <p className="mt-1 text-sm text-muted">{t("brief.withdrawn.kept")}</p>
        </section>
      ) : null}
      {embargoed ? (
        <p role="note" className="mb-8 border-s-4 border-accent bg-white p-4 font-sans text-sm" data-testid="embargo">
          {t("brief.embargo", { date: release })}
        </p>
      ) : null}
      {version < latestVersion ? (
        <p role="note" className="mb-8 border-s-4 border-rule bg-white p-4 font-sans text-sm">
          {t("brief.olderVersion", { version, latest: latestVersion })} <a href={intl.href(latestHref)}>{t("brief.readLatest")}</a>
        </p>
      ) : null}
    </>
  );
}

/**
 * The findings of a withdrawn brief, kept for the record: under a label that stays in view while they
 * scroll past, inside a hatched margin, so that no one reads or screenshots them as current.
 */
export function WithdrawnFindings({ withdrawn, children }: { withdrawn: boolean; children: React.ReactNode }) {
  const { t } = useTranslation();
  if (!withdrawn) return <>{children}</>;
  return (
    <div className="withdrawn-findings mt-10 border-s-8 ps-4" data-testid="withdrawn-findings">
      <p className="sticky top-0 z-10 border-b-2 border-ink bg-white py-2 font-sans text-sm font-semibold">{t("brief.withdrawn.findings")}</p>
      {children}
    </div>
  );
}


/**
 * Where a passage of a partly translated version is shown in the original: its language set, and a
 * mark saying it is not yet translated (docs/brief-lifecycle.md). Nothing on a page in the original's language.
 */
export function useUntranslated(translation: TranslationState) {
  const { t } = useTranslation();
  const open = new Set(translation?.publishedAt ? translation.open : []);
  return {
    /** The lang attribute of a field's text: "en" where it is shown in the original. */
    lang: (field: string) => (translation && (!translation.publishedAt || open.has(field)) ? "en" : undefined),
    /** The mark after a field shown in the original though the rest is translated. */
    mark: (field: string) =>
      open.has(field) ? (
        <span className="ms-2 inline-block border border-ink px-1.5 align-middle font-sans text-xs font-normal" data-testid="not-translated">
          {t("brief.translation.passage")}
        </span>
      ) : null,
  };
}
