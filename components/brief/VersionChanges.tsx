// "What changed since version n": computed from the two frozen versions (server/core/snapshot/changes.ts),
// worded from each as the reader reads it. On a corrected version's page, and in the desk before a
// correction is published. Lists facts only; it never ranks the options.
import { useTranslation } from "react-i18next";
import type { ChangesView } from "#core/snapshot/changes";
import { formatInterval } from "#core/publication/effects";
import { changesUrl } from "#core/publication/urls";
import { Message } from "../Message";
import { useIntl } from "../i18n";

export function VersionChanges({ changes, slug }: { changes: ChangesView; slug: string | null }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const versus = (c: { treatment: string; comparator: string }) => t("brief.versus", { treatment: c.treatment, comparator: c.comparator });
  const nothing = changes.texts.length === 0 && changes.outcomes.length === 0;
  const percent = new Intl.NumberFormat(intl.locale === "ar" ? "ar-u-nu-latn" : intl.locale, { style: "percent" }).format(changes.tolerance);
  return (
    <section aria-labelledby="changes-title" className="mt-10 border-s-4 border-accent bg-white p-6" data-testid="version-changes">
      {/* Without a slug it is the desk's preview of a draft, not a published version. */}
      <h2 id="changes-title" className="text-xl font-semibold">{t(slug ? "changes.title" : "changes.draftTitle", { version: changes.from })}</h2>
      <p className="mt-1 font-sans text-sm text-muted">{t(slug ? "changes.lead" : "changes.draftLead", { version: changes.from })}</p>
      {nothing ? <p className="mt-3">{t("changes.nothing")}</p> : null}
      {changes.texts.length > 0 ? (
        <p className="mt-3">
          {t("changes.texts", { fields: new Intl.ListFormat(intl.locale, { type: "conjunction" }).format(changes.texts.map((text) => t(`changes.field.${text.field}`, { name: text.name ?? "" }))) })}
        </p>
      ) : null}
      {changes.outcomes.map((outcome) => (
        <div key={`${outcome.name}-${outcome.anchor}`} className="mt-4">
          <h3 className="font-sans text-sm font-semibold">{outcome.anchor === null ? outcome.name : <a href={`#outcome-${outcome.anchor + 1}`}>{outcome.name}</a>}</h3>
          <ul className="mt-1 list-disc space-y-1 ps-6">
            {outcome.presence ? <li>{t(outcome.presence === "added" ? "changes.outcomeAdded" : "changes.outcomeRemoved")}</li> : null}
            {outcome.studies.added.length > 0 ? <li>{t("changes.studiesAdded", { count: outcome.studies.added.length, names: outcome.studies.added.join(", ") })}</li> : null}
            {outcome.studies.removed.length > 0 ? <li>{t("changes.studiesRemoved", { count: outcome.studies.removed.length, names: outcome.studies.removed.join(", ") })}</li> : null}
            {outcome.groups.map((move) => (
              <li key={`group-${move.treatment}`} data-testid="group-moved">
                {move.from && move.to ? (
                  <GroupWords which="changes.groupMoved" treatment={move.treatment} from={move.from} to={move.to} />
                ) : move.to ? (
                  <GroupWords which="changes.groupAdded" treatment={move.treatment} to={move.to} />
                ) : (
                  <GroupWords which="changes.groupRemoved" treatment={move.treatment} from={move.from!} />
                )}
              </li>
            ))}
            {outcome.comparisons.flatMap((c) => {
              const key = `${c.treatment}-${c.comparator}`;
              const items = [];
              if (c.presence) items.push(<li key={`${key}-presence`}>{t(c.presence === "added" ? "changes.comparisonAdded" : "changes.comparisonRemoved", { comparison: versus(c) })}</li>);
              if (c.certainty) {
                const rating = (r: string | null) => (r ? t(`certainty.rating.${r}`) : t("changes.unrated"));
                items.push(<li key={`${key}-certainty`}>{t("changes.certainty", { comparison: versus(c), from: rating(c.certainty.from), to: rating(c.certainty.to) })}</li>);
              }
              if (c.statement !== undefined && c.statement !== null) {
                const [before, after] = t("changes.statement", { comparison: versus(c), to: "\uE004" }).split("\uE004");
                items.push(
                  <li key={`${key}-statement`} data-testid="statement-changed">
                    {before}
                    <Message message={c.statement} />
                    {after}
                  </li>,
                );
              }
              if (c.estimate) {
                const to = t("brief.to");
                items.push(
                  <li key={`${key}-estimate`}>
                    {t("changes.estimate", { comparison: versus(c), from: formatInterval(outcome.measure, c.estimate.from, to, intl.locale), to: formatInterval(outcome.measure, c.estimate.to, to, intl.locale), measure: outcome.measure })}
                  </li>,
                );
              }
              return items;
            })}
          </ul>
        </div>
      ))}
      <p className="mt-4 font-sans text-sm text-muted">{t("changes.tolerance", { percent })}</p>
      {slug ? (
        <p className="mt-1 font-sans text-sm print:hidden">
          <a href={changesUrl({ slug, version: changes.to })}>{t("changes.download")}</a>
        </p>
      ) : null}
    </section>
  );
}

/** A group move in words, each group's label a generated sentence of its own. */
function GroupWords({ which, treatment, from, to }: { which: string; treatment: string; from?: { key: string; values: Record<string, string | number> }; to?: { key: string; values: Record<string, string | number> } }) {
  const { t } = useTranslation();
  // The sentence is split where the labels go, so each label keeps its own isolated names.
  const parts = t(which, { treatment: "\uE001", from: "\uE002", to: "\uE003" }).split(/([\uE001-\uE003])/u);
  return (
    <>
      {parts.map((part, i) =>
        part === "\uE001" ? <bdi key={i}>{treatment}</bdi> : part === "\uE002" && from ? <Message key={i} message={from} /> : part === "\uE003" && to ? <Message key={i} message={to} /> : part,
      )}
    </>
  );
}
