import { useTranslation } from "react-i18next";
import { useData } from "vike-react/useData";
import type { Data } from "./+data";

export default function Page() {
  const { t, i18n } = useTranslation();
  const { briefs } = useData<Data>();
  const date = new Intl.DateTimeFormat(i18n.language, { dateStyle: "long", timeZone: "UTC" });
  return (
    <>
      <h1 className="text-4xl leading-tight font-semibold tracking-tight">{t("home.title")}</h1>
      <p className="mt-6 text-xl leading-relaxed text-muted">{t("home.lead")}</p>
      <section aria-labelledby="latest-briefs" className="mt-14">
        <h2 id="latest-briefs" className="border-b border-rule pb-2 font-sans text-sm font-semibold uppercase tracking-wide">
          {t("home.latest")}
        </h2>
        {briefs.length === 0 ? (
          <p className="mt-6 text-lg text-muted">{t("home.empty")}</p>
        ) : (
          <ul className="mt-2 divide-y divide-rule" data-testid="released-briefs">
            {briefs.map((brief) => (
              <li key={brief.slug} className="py-5">
                <p className="font-sans text-xs font-semibold uppercase tracking-wide text-muted">{brief.topic}</p>
                <h3 className="mt-1 text-2xl leading-snug font-semibold">{brief.title}</h3>
                <p className="mt-1 font-sans text-sm text-muted">
                  {t("home.version", { version: brief.version, date: date.format(new Date(brief.releasedAt)) })}
                  {brief.demo ? <span className="ms-3 border border-accent px-2 py-0.5 text-accent">{t("home.demo")}</span> : null}
                </p>
              </li>
            ))}
          </ul>
        )}
      </section>
    </>
  );
}
