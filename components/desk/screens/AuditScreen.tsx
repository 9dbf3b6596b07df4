// /desk/audit, for administrators: every change, who made it and when, with the record before and
// after; filtered by person, brief and action, fifty at a time.
import { useState } from "react";
import { useTranslation } from "react-i18next";
import { Field, inputClass } from "./forms";
import { useAudit, useBriefs, usePeople } from "../queries";
import { useIntl } from "../../i18n";

export function AuditScreen() {
  const { t } = useTranslation();
  const intl = useIntl();
  const [filter, setFilter] = useState({ person: "", brief: "", action: "" });
  const audit = useAudit(filter);
  const people = usePeople();
  const briefs = useBriefs();
  const entries = audit.data?.pages.flatMap((page) => page.entries) ?? [];
  const actions = audit.data?.pages[0]?.actions ?? [];
  const when = intl.date({ dateStyle: "medium", timeStyle: "medium", timeZone: "UTC" });
  const choose = (name: keyof typeof filter) => (event: React.ChangeEvent<HTMLSelectElement>) => setFilter({ ...filter, [name]: event.target.value });

  return (
    <>
      <h1 className="text-4xl font-semibold tracking-tight">{t("desk.audit.title")}</h1>
      <form aria-label={t("desk.audit.filters")} className="mt-6 grid gap-4 font-sans sm:grid-cols-3" onSubmit={(event) => event.preventDefault()}>
        <Field label={t("desk.audit.person")}>
          <select className={inputClass} value={filter.person} onChange={choose("person")}>
            <option value="">{t("desk.audit.anyone")}</option>
            {people.data?.map((person) => (
              <option key={person.id} value={person.id}>
                {person.displayName}
              </option>
            ))}
          </select>
        </Field>
        <Field label={t("desk.audit.brief")}>
          <select className={inputClass} value={filter.brief} onChange={choose("brief")}>
            <option value="">{t("desk.audit.anyBrief")}</option>
            {briefs.data?.map((brief) => (
              <option key={brief.id} value={brief.id}>
                {brief.title}
              </option>
            ))}
          </select>
        </Field>
        <Field label={t("desk.audit.action")}>
          <select className={inputClass} value={filter.action} onChange={choose("action")}>
            <option value="">{t("desk.audit.anyAction")}</option>
            {actions.map((action) => (
              <option key={action} value={action}>
                {action}
              </option>
            ))}
          </select>
        </Field>
      </form>
      {audit.isError ? <p role="alert">{t("desk.error", { message: audit.error.message })}</p> : null}
      <ol className="mt-6 divide-y divide-rule font-sans text-sm" data-testid="audit">
        {entries.map((entry) => (
          <li key={entry.id} className="py-2">
            <span className="text-muted">{when.format(new Date(entry.at))} UTC</span> · {entry.actorName ?? t("desk.audit.system")} · <strong>{entry.action}</strong> · {entry.entityName ?? <span className="text-muted">{entry.entity}</span>}
            <BeforeAfter before={entry.before} after={entry.after} />
          </li>
        ))}
      </ol>
      {audit.data && entries.length === 0 ? <p className="mt-4">{t("desk.audit.empty")}</p> : null}
      {audit.hasNextPage ? (
        <button type="button" className="mt-4 underline" disabled={audit.isFetchingNextPage} onClick={() => void audit.fetchNextPage()}>
          {t("desk.audit.older")}
        </button>
      ) : null}
    </>
  );
}

/** A value of the record as a person reads it: text as written, lists joined, anything else in short JSON. */
function shown(value: unknown): string {
  if (value === null || value === undefined) return "—";
  if (typeof value === "string") return value;
  if (Array.isArray(value) && value.every((item) => typeof item !== "object")) return value.join(", ");
  return typeof value === "object" ? JSON.stringify(value) : String(value);
}

/** The fields an entry changed, each "field: before → after"; nothing when the entry records no values. */
function BeforeAfter({ before, after }: { before: unknown; after: unknown }) {
  const { t } = useTranslation();
  const record = (value: unknown): Record<string, unknown> => (value && typeof value === "object" && !Array.isArray(value) ? (value as Record<string, unknown>) : {});
  const [was, is] = [record(before), record(after)];
  const fields = [...new Set([...Object.keys(was), ...Object.keys(is)])];
  if (fields.length === 0) return null;
  return (
    <details className="mt-1">
      <summary className="cursor-pointer">{t("desk.audit.beforeAfter")}</summary>
      <dl className="mt-1 grid grid-cols-[max-content_1fr] gap-x-3 gap-y-1 bg-white p-2 text-xs">
        {fields.map((field) => (
          <div key={field} className="contents">
            <dt className="font-semibold">{field}</dt>
            <dd className="break-words">
              {field in was ? (
                <>
                  <del className="text-muted">{shown(was[field])}</del> →{" "}
                </>
              ) : null}
              {field in is ? shown(is[field]) : "—"}
            </dd>
          </div>
        ))}
      </dl>
    </details>
  );
}
