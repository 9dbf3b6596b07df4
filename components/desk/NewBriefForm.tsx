import { useTranslation } from "react-i18next";
import { Field, buttonClass, formValues, inputClass } from "./forms";

export function NewBriefForm({ onCreate, busy, error }: { onCreate: (fields: { title: string; topic: string; condition: string; population: string }) => void; busy: boolean; error: string | null }) {
  const { t } = useTranslation();
  return (
    <form
      className="grid gap-4 font-sans sm:grid-cols-2"
      aria-label={t("desk.newBrief")}
      onSubmit={(event) => {
        event.preventDefault();
        const v = formValues(event.currentTarget);
        onCreate({ title: v.title ?? "", topic: v.topic ?? "", condition: v.condition ?? "", population: v.population ?? "" });
      }}
    >
      {(["title", "topic", "condition", "population"] as const).map((name) => (
        <Field key={name} label={t(`desk.field.${name}`)}>
          <input name={name} required className={inputClass} />
        </Field>
      ))}
      <div className="sm:col-span-2">
        <button type="submit" disabled={busy} className={buttonClass}>
          {busy ? t("desk.saving") : t("desk.create")}
        </button>
        {error ? <p role="alert" className="mt-2 text-accent">{t("desk.error", { message: error })}</p> : null}
      </div>
    </form>
  );
}
