// The press room: embargoed versions (readable by the press before their release) and the latest
// releases, each with its page and its release time.
import { useTranslation } from "react-i18next";
import { usePressRoom } from "./queries";
import { versionUrl } from "#core/urls";

export function PressRoom() {
  const { t, i18n } = useTranslation();
  const versions = usePressRoom();
  const date = new Intl.DateTimeFormat(i18n.language, { dateStyle: "long", timeStyle: "short", timeZone: "UTC" });
  return (
    <section className="mt-10" aria-labelledby="press-room-title" data-testid="press-room">
      <h2 id="press-room-title" className="text-xl font-semibold">{t("desk.pressRoom.title")}</h2>
      <p className="mt-2 text-muted">{t("desk.pressRoom.lead")}</p>
      {versions.isError ? <p role="alert">{t("desk.error", { message: versions.error.message })}</p> : null}
      {versions.data && versions.data.length === 0 ? <p className="mt-3">{t("desk.pressRoom.empty")}</p> : null}
      <ul className="mt-3 divide-y divide-rule">
        {versions.data?.map((entry) => (
          <li key={`${entry.slug}-${entry.number}`} className="py-3">
            <a href={versionUrl({ slug: entry.slug, version: entry.number })} className="text-lg font-semibold">{entry.title}</a>
            <p className="font-sans text-sm">
              {entry.embargoed ? (
                <strong className="text-accent">{t("desk.pressRoom.embargoed", { date: date.format(new Date(entry.releaseAt)) })}</strong>
              ) : (
                t("desk.pressRoom.released", { date: date.format(new Date(entry.releaseAt)) })
              )}
              {" · "}
              {t("desk.pressRoom.version", { version: entry.number })}
            </p>
            {entry.note ? <p className="mt-1 text-sm text-muted">{t("brief.correctionNote", { note: entry.note })}</p> : null}
          </li>
        ))}
      </ul>
    </section>
  );
}
