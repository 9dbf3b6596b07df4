import { useTranslation } from "react-i18next";
import { useData } from "vike-react/useData";
import { BriefList } from "#components/BriefList";
import type { Data } from "./+data";
import { searchUrl } from "#core/publication/urls";
import { useIntl } from "#components/i18n";

export default function Page() {
  const { t } = useTranslation();
  const { href } = useIntl();
  const { briefs, total, page, pages, topics, q, topic } = useData<Data>();
  const filtered = q !== "" || topic !== "";
  return (
    <>
      <h1 className="text-4xl leading-tight font-semibold tracking-tight">{t("search.title")}</h1>
      <form action={href(searchUrl())} method="get" role="search" className="mt-8 grid gap-4 font-sans sm:grid-cols-[1fr_auto_auto] sm:items-end">
        <div>
          <label htmlFor="q" className="block text-sm font-semibold">{t("search.label")}</label>
          <input id="q" name="q" type="search" defaultValue={q} placeholder={t("search.placeholder")} className="mt-1 w-full border border-ink bg-white px-3 py-2" />
        </div>
        <div>
          <label htmlFor="topic" className="block text-sm font-semibold">{t("search.topic")}</label>
          <select id="topic" name="topic" defaultValue={topic} className="mt-1 border border-ink bg-white px-3 py-2">
            <option value="">{t("search.allTopics")}</option>
            {topics.map((item) => (
              <option key={item.slug} value={item.slug}>{item.name}</option>
            ))}
          </select>
        </div>
        <button type="submit" className="bg-accent px-4 py-2 font-semibold text-white">{t("search.submit")}</button>
      </form>
      <p className="mt-8 font-sans text-sm text-muted" role="status">
        {filtered ? t("search.found", { count: total }) : t("search.all", { count: total })}
      </p>
      {briefs.length === 0 ? <p className="mt-4 text-lg">{t("search.none")}</p> : <BriefList briefs={briefs} testId="search-results" />}
      {pages > 1 ? (
        <nav aria-label={t("search.pages")} className="mt-6 flex flex-wrap items-center gap-4 font-sans text-sm">
          {page > 1 ? <a href={href(searchUrl({ q, topic, page: page - 1 }))} rel="prev">{t("search.previous")}</a> : null}
          <span aria-current="page">{t("search.pageOf", { page, pages })}</span>
          {page < pages ? <a href={href(searchUrl({ q, topic, page: page + 1 }))} rel="next">{t("search.next")}</a> : null}
        </nav>
      ) : null}
    </>
  );
}
