import { useId, useState } from "react";
import { useTranslation } from "react-i18next";
import type { CreateOutcomeBody } from "#web/api/contract";
import { Field, SubmitRow, formValues, inputClass } from "./forms";

const optionalNumber = (value: string | undefined) => (value && value.trim() !== "" ? Number(value) : null);

/** A new outcome, or, with `initial`, the settings of one to change (the server re-runs its analysis). */
export function OutcomeForm({
  onSubmit,
  busy,
  error,
  initial,
  label,
}: {
  onSubmit: (fields: CreateOutcomeBody) => void;
  busy: boolean;
  error: string | null;
  initial?: Partial<CreateOutcomeBody>;
  label: string;
}) {
  const { t } = useTranslation();
  const [kind, setKind] = useState<"binary" | "continuous">(initial?.kind ?? "binary");
  const scaleId = useId();
  const value = (name: keyof CreateOutcomeBody) => (initial?.[name] ?? undefined) as string | number | undefined;
  return (
    <form
      className="grid gap-4 font-sans sm:grid-cols-2"
      aria-label={label}
      onSubmit={(event) => {
        event.preventDefault();
        const v = formValues(event.currentTarget);
        onSubmit({
          // The selects offer only the contract's values; the server checks them again.
          name: v.name ?? "",
          kind,
          measure: (kind === "continuous" ? "MD" : v.measure) as CreateOutcomeBody["measure"],
          model: v.model as CreateOutcomeBody["model"],
          referenceTreatment: v.referenceTreatment ?? "",
          direction: v.direction as CreateOutcomeBody["direction"],
          baselineRisk: kind === "binary" ? optionalNumber(v.baselineRisk) : null,
          unit: kind === "continuous" ? v.unit || null : null,
          statementPhrase: v.statementPhrase || null,
          measuresHarm: (event.currentTarget.elements.namedItem("measuresHarm") as HTMLInputElement | null)?.checked ?? false,
          thresholdSmall: optionalNumber(v.thresholdSmall),
          thresholdModerate: optionalNumber(v.thresholdModerate),
          thresholdLarge: optionalNumber(v.thresholdLarge),
        });
      }}
    >
      <Field label={t("desk.field.name")}>
        <input name="name" required defaultValue={value("name")} className={inputClass} />
      </Field>
      <Field label={t("desk.field.kind")}>
        <select name="kind" value={kind} onChange={(e) => setKind(e.target.value as "binary" | "continuous")} className={inputClass}>
          <option value="binary">{t("desk.kind.binary")}</option>
          <option value="continuous">{t("desk.kind.continuous")}</option>
        </select>
      </Field>
      {kind === "binary" ? (
        <Field label={t("desk.field.measure")}>
          <select name="measure" className={inputClass} defaultValue={value("measure") ?? "OR"}>
            <option value="OR">OR</option>
            <option value="RR">RR</option>
            <option value="RD">RD</option>
          </select>
        </Field>
      ) : (
        <Field label={t("desk.field.unit")}>
          <input name="unit" defaultValue={value("unit")} className={inputClass} />
        </Field>
      )}
      <Field label={t("desk.field.model")}>
        <select name="model" className={inputClass} defaultValue={value("model") ?? "random"}>
          <option value="random">{t("desk.model.random")}</option>
          <option value="fixed">{t("desk.model.fixed")}</option>
        </select>
      </Field>
      <Field label={t("desk.field.statementPhrase")}>
        <input name="statementPhrase" defaultValue={value("statementPhrase")} placeholder={t("desk.statementPhraseHint")} title={t("desk.statementPhraseHint")} className={inputClass} />
      </Field>
      <label className="flex items-center gap-2 text-sm sm:col-span-2">
        <input type="checkbox" name="measuresHarm" defaultChecked={initial?.measuresHarm ?? false} />
        {t("desk.field.measuresHarm")}
      </label>
      <Field label={t("desk.field.reference")}>
        <input name="referenceTreatment" required defaultValue={value("referenceTreatment")} className={inputClass} />
      </Field>
      <Field label={t("desk.field.direction")}>
        <select name="direction" className={inputClass} defaultValue={value("direction")}>
          <option value="higher">{t("desk.direction.higher")}</option>
          <option value="lower">{t("desk.direction.lower")}</option>
        </select>
      </Field>
      {kind === "binary" ? (
        <Field label={t("desk.field.baselineRisk")}>
          <input name="baselineRisk" type="number" step="any" min="0" max="1" defaultValue={value("baselineRisk")} className={inputClass} />
        </Field>
      ) : null}
      <p className="text-sm text-muted sm:col-span-2" id={scaleId}>{t(`desk.thresholdScale.${kind}`)}</p>
      {(["thresholdSmall", "thresholdModerate", "thresholdLarge"] as const).map((name) => (
        <Field key={name} label={`${t(`desk.field.${name}`)} (${t(`desk.thresholdUnit.${kind}`)})`}>
          <input name={name} type="number" step="any" min="0" max={kind === "binary" ? 1000 : undefined} defaultValue={value(name)} aria-describedby={scaleId} className={inputClass} />
        </Field>
      ))}
      <SubmitRow label={label} busy={busy} error={error} />
    </form>
  );
}
