import { useTranslation } from "react-i18next";
import { useData } from "vike-react/useData";
import { BriefList } from "#components/BriefList";
import type { Data } from "./+data";
import { searchUrl, topicUrl } from "#core/publication/urls";
import { useIntl } from "#components/i18n";

export default function Page() {
  const { t } = useTranslation();
  const { href } = useIntl();
  const { briefs, topics } = useData<Data>();
  return (
    <>
      <h1 className="text-4xl leading-tight font-semibold tracking-tight">{t("home.title")}</h1>
      <p className="mt-6 text-xl leading-relaxed text-muted">{t("home.lead")}</p>
      <form action={href(searchUrl())} method="get" role="search" className="mt-10 flex flex-wrap gap-3 font-sans">
        <label htmlFor="home-search" className="sr-only">{t("search.label")}</label>
        <input id="home-search" name="q" type="search" placeholder={t("search.placeholder")} className="min-w-0 flex-1 border border-ink bg-white px-3 py-2" />
        <button type="submit" className="bg-accent px-4 py-2 font-semibold text-white">{t("search.submit")}</button>
      </form>
      <section aria-labelledby="latest-briefs" className="mt-14">
        <h2 id="latest-briefs" className="border-b border-rule pb-2 font-sans text-sm font-semibold uppercase tracking-wide">
          {t("home.latest")}
        </h2>
        {briefs.length === 0 ? <p className="mt-6 text-lg text-muted">{t("home.empty")}</p> : <BriefList briefs={briefs} />}
        {briefs.length > 0 ? (
          <p className="mt-4 font-sans text-sm">
            <a href={href(searchUrl())}>{t("home.allBriefs")}</a>
          </p>
        ) : null}
      </section>
      {topics.length > 0 ? (
        <section aria-labelledby="topics" className="mt-14">
          <h2 id="topics" className="border-b border-rule pb-2 font-sans text-sm font-semibold uppercase tracking-wide">{t("home.topics")}</h2>
          <ul className="mt-4 flex flex-wrap gap-3 font-sans" data-testid="topics">
            {topics.map((topic) => (
              <li key={topic.slug}>
                <a href={href(topicUrl(topic.slug))} className="inline-block border border-rule bg-white px-3 py-1 no-underline">
                  {t("home.topic", { name: topic.name, count: topic.count })}
                </a>
              </li>
            ))}
          </ul>
        </section>
      ) : null}
    </>
  );
}
