// A list of released briefs: topic, title linked to the latest version, version and date, and
// whether it is fictional demonstration data or withdrawn.
import { useTranslation } from "react-i18next";
import type { ReleasedBrief } from "#core/publication/search";
import { briefUrl, topicUrl } from "#core/publication/urls";
import { useIntl } from "./i18n";

export function BriefList({ briefs, testId = "released-briefs" }: { briefs: ReleasedBrief[]; testId?: string }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const date = intl.date({ dateStyle: "long", timeZone: "UTC" });
  return (
    <ul className="mt-2 divide-y divide-rule" data-testid={testId}>
      {briefs.map((brief) => (
        <li key={brief.slug} className="py-5">
          <p className="font-sans text-xs font-semibold uppercase tracking-wide text-muted">
            <a href={intl.href(topicUrl(brief.topicSlug))} className="text-muted">{brief.topic}</a>
          </p>
          <h3 className="mt-1 text-2xl leading-snug font-semibold">
            <a href={intl.href(briefUrl(brief.slug))} className="text-ink decoration-rule hover:decoration-accent">{brief.title}</a>
          </h3>
          <p className="mt-1 font-sans text-sm text-muted">
            {t("home.version", { version: brief.version, date: date.format(new Date(brief.releaseAt)) })}
            {brief.demo ? <span className="ms-3 border border-accent px-2 py-0.5 text-accent">{t("home.demo")}</span> : null}
            {brief.withdrawn ? <span className="ms-3 border border-ink px-2 py-0.5 text-ink">{t("home.withdrawn")}</span> : null}
          </p>
        </li>
      ))}
    </ul>
  );
}
