import { useTranslation } from "react-i18next";
import type { CreateBriefBody } from "#web/api/contract";
import { Field, SubmitRow, formValues, inputClass } from "./forms";

export function NewBriefForm({ onCreate, busy, error }: { onCreate: (fields: CreateBriefBody) => void; busy: boolean; error: string | null }) {
  const { t } = useTranslation();
  return (
    <form
      className="grid gap-4 font-sans sm:grid-cols-2"
      aria-label={t("desk.newBrief")}
      onSubmit={(event) => {
        event.preventDefault();
        const v = formValues(event.currentTarget);
        onCreate({ title: v.title ?? "", topic: v.topic ?? "", condition: v.condition ?? "", population: v.population ?? "", authorTeam: v.authorTeam || null });
      }}
    >
      {(["title", "topic", "condition", "population"] as const).map((name) => (
        <Field key={name} label={t(`desk.field.${name}`)}>
          <input name={name} required className={inputClass} />
        </Field>
      ))}
      <Field label={t("desk.field.authorTeam")}>
        <input name="authorTeam" className={inputClass} />
      </Field>
      <SubmitRow label={t("desk.create")} busy={busy} error={error} />
    </form>
  );
}
