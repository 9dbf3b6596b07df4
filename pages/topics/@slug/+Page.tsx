import { SubscribeForm } from "#components/SubscribeForm";
import { useTranslation } from "react-i18next";
import { useData } from "vike-react/useData";
import { BriefList } from "#components/BriefList";
import type { Data } from "./+data";
import { searchUrl } from "#core/publication/urls";
import { useIntl } from "#components/i18n";

export default function Page() {
  const { t } = useTranslation();
  const { href } = useIntl();
  const { topic, briefs } = useData<Data>();
  return (
    <>
      <p className="font-sans text-sm">
        <a href={href(searchUrl())}>{t("search.title")}</a>
      </p>
      <h1 className="mt-2 text-4xl leading-tight font-semibold tracking-tight">{t("topic.title", { name: topic.name })}</h1>
      <BriefList briefs={briefs} />
      {topic.count > briefs.length ? (
        <p className="mt-6 font-sans text-sm">
          <a href={href(searchUrl({ topic: topic.slug }))}>{t("topic.all", { count: topic.count })}</a>
        </p>
      ) : null}
      <SubscribeForm topic={topic.name} topicSlug={topic.slug} />
    </>
  );
}
