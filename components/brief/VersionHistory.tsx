// Every version of a brief with its release date and correction note; the one shown is marked.
import { useTranslation } from "react-i18next";
import type { VersionEntry } from "#core/publication/brief-page";
import { versionUrl } from "#core/publication/urls";
import { useIntl } from "../i18n";

export function VersionHistory({ slug, history, current }: { slug: string; history: VersionEntry[]; current: number }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const date = intl.date({ dateStyle: "long", timeZone: "UTC" });
  return (
    <section aria-labelledby="history-title" className="mt-16 border-t border-rule pt-6" data-testid="history">
      <h2 id="history-title" className="text-xl font-semibold">{t("brief.history")}</h2>
      <ol className="mt-3 space-y-3">
        {history.map((entry) => (
          <li key={entry.number}>
            {entry.number === current ? (
              <strong aria-current="page">{t("brief.versionLine", { version: entry.number, date: date.format(new Date(entry.releaseAt)) })}</strong>
            ) : (
              <a href={intl.href(versionUrl({ slug, version: entry.number }))}>{t("brief.versionLine", { version: entry.number, date: date.format(new Date(entry.releaseAt)) })}</a>
            )}
            {entry.embargoed ? <span className="ms-2 font-sans text-xs text-accent">{t("brief.embargoedShort")}</span> : null}
            {entry.note ? <p className="mt-1 text-muted">{t("brief.correctionNote", { note: entry.note })}</p> : null}
          </li>
        ))}
      </ol>
    </section>
  );
}
