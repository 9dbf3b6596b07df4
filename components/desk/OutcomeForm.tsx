import { useState } from "react";
import { useTranslation } from "react-i18next";
import type { CreateOutcomeBody } from "#web/api/contract";
import { Field, SubmitRow, formValues, inputClass } from "./forms";

const optionalNumber = (value: string | undefined) => (value && value.trim() !== "" ? Number(value) : null);

export function OutcomeForm({ onSubmit, busy, error }: { onSubmit: (fields: CreateOutcomeBody) => void; busy: boolean; error: string | null }) {
  const { t } = useTranslation();
  const [kind, setKind] = useState<"binary" | "continuous">("binary");
  return (
    <form
      className="grid gap-4 font-sans sm:grid-cols-2"
      aria-label={t("desk.addOutcome")}
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
          thresholdSmall: optionalNumber(v.thresholdSmall),
          thresholdModerate: optionalNumber(v.thresholdModerate),
          thresholdLarge: optionalNumber(v.thresholdLarge),
        });
      }}
    >
      <Field label={t("desk.field.name")}>
        <input name="name" required className={inputClass} />
      </Field>
      <Field label={t("desk.field.kind")}>
        <select name="kind" value={kind} onChange={(e) => setKind(e.target.value as "binary" | "continuous")} className={inputClass}>
          <option value="binary">{t("desk.kind.binary")}</option>
          <option value="continuous">{t("desk.kind.continuous")}</option>
        </select>
      </Field>
      {kind === "binary" ? (
        <Field label={t("desk.field.measure")}>
          <select name="measure" className={inputClass} defaultValue="OR">
            <option value="OR">OR</option>
            <option value="RR">RR</option>
            <option value="RD">RD</option>
          </select>
        </Field>
      ) : (
        <Field label={t("desk.field.unit")}>
          <input name="unit" className={inputClass} />
        </Field>
      )}
      <Field label={t("desk.field.model")}>
        <select name="model" className={inputClass} defaultValue="random">
          <option value="random">{t("desk.model.random")}</option>
          <option value="fixed">{t("desk.model.fixed")}</option>
        </select>
      </Field>
      <Field label={t("desk.field.reference")}>
        <input name="referenceTreatment" required className={inputClass} />
      </Field>
      <Field label={t("desk.field.direction")}>
        <select name="direction" className={inputClass}>
          <option value="higher">{t("desk.direction.higher")}</option>
          <option value="lower">{t("desk.direction.lower")}</option>
        </select>
      </Field>
      {kind === "binary" ? (
        <Field label={t("desk.field.baselineRisk")}>
          <input name="baselineRisk" type="number" step="any" min="0" max="1" className={inputClass} />
        </Field>
      ) : null}
      <p className="text-sm text-muted sm:col-span-2" id="threshold-scale">{t(`desk.thresholdScale.${kind}`)}</p>
      {(["thresholdSmall", "thresholdModerate", "thresholdLarge"] as const).map((name) => (
        <Field key={name} label={`${t(`desk.field.${name}`)} (${t(`desk.thresholdUnit.${kind}`)})`}>
          <input name={name} type="number" step="any" min="0" max={kind === "binary" ? 1000 : undefined} aria-describedby="threshold-scale" className={inputClass} />
        </Field>
      ))}
      <SubmitRow label={t("desk.addOutcome")} busy={busy} error={error} />
    </form>
  );
}
