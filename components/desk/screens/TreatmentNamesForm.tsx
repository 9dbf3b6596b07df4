import { useTranslation } from "react-i18next";
import { buttonClass, inputClass } from "./forms";

export function TreatmentNamesForm({
  treatments,
  onSave,
  busy,
  saved,
}: {
  treatments: { label: string; displayName: string; phrase?: string | null; number?: "singular" | "plural" }[];
  onSave: (names: Record<string, string>, grammar: Record<string, { phrase: string | null; number: "singular" | "plural" }>) => void;
  busy: boolean;
  saved: boolean;
}) {
  const { t } = useTranslation();
  return (
    <section className="mt-10 border-t border-rule pt-6">
      <h2 className="text-xl font-semibold">{t("desk.treatmentNames")}</h2>
      <p className="mt-1 text-muted">{t("desk.treatmentNamesLead")}</p>
      <form
        aria-label={t("desk.treatmentNames")}
        className="mt-4 font-sans"
        onSubmit={(event) => {
          event.preventDefault();
          const data = new FormData(event.currentTarget);
          onSave(
            Object.fromEntries(treatments.map((tr) => [tr.label, String(data.get(tr.label) ?? "").trim() || tr.label])),
            Object.fromEntries(
              treatments.map((tr) => [tr.label, { phrase: String(data.get(`${tr.label}.phrase`) ?? "").trim() || null, number: data.get(`${tr.label}.number`) === "plural" ? "plural" : "singular" }]),
            ),
          );
        }}
      >
        <table className="w-full max-w-3xl text-sm">
          <thead>
            <tr>
              <th scope="col" className="py-1 text-start">{t("desk.label")}</th>
              <th scope="col" className="py-1 text-start">{t("desk.displayName")}</th>
              <th scope="col" className="py-1 text-start">{t("desk.phrase")}</th>
              <th scope="col" className="py-1 text-start">{t("desk.grammaticalNumber")}</th>
            </tr>
          </thead>
          <tbody>
            {treatments.map((tr) => (
              <tr key={tr.label}>
                <td className="py-1 pe-4 font-mono">{tr.label}</td>
                <td className="py-1">
                  <input name={tr.label} defaultValue={tr.displayName} aria-label={`${t("desk.displayName")}: ${tr.label}`} className={inputClass} />
                </td>
                <td className="py-1 ps-2">
                  <input name={`${tr.label}.phrase`} defaultValue={tr.phrase ?? ""} placeholder={t("desk.phraseHint")} aria-label={`${t("desk.phrase")}: ${tr.label}`} className={inputClass} />
                </td>
                <td className="py-1 ps-2">
                  <select name={`${tr.label}.number`} defaultValue={tr.number ?? "singular"} aria-label={`${t("desk.grammaticalNumber")}: ${tr.label}`} className={inputClass}>
                    <option value="singular">{t("desk.number.singular")}</option>
                    <option value="plural">{t("desk.number.plural")}</option>
                  </select>
                </td>
              </tr>
            ))}
          </tbody>
        </table>
        <button type="submit" disabled={busy} className={`${buttonClass} mt-4`}>
          {busy ? t("desk.saving") : t("desk.saveNames")}
        </button>
        {saved ? <p role="status" className="mt-2">{t("desk.saved")}</p> : null}
      </form>
    </section>
  );
}
