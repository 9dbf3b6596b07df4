// Small form pieces the desk's screens share.
import type { ReactNode } from "react";
import { useTranslation } from "react-i18next";

export function Field({ label, children }: { label: string; children: ReactNode }) {
  return (
    <label className="block">
      <span className="block text-sm font-semibold">{label}</span>
      <span className="mt-1 block">{children}</span>
    </label>
  );
}

export const inputClass = "w-full border border-rule bg-white px-3 py-2 text-base";
export const buttonClass = "bg-accent px-5 py-2 font-semibold text-white hover:opacity-90 disabled:opacity-50";

/** Reads a form's fields into an object of strings. */
export function formValues(form: HTMLFormElement): Record<string, string> {
  return Object.fromEntries([...new FormData(form).entries()].filter(([, v]) => typeof v === "string")) as Record<string, string>;
}

/** A form's submit button, showing that it is saving, and the error of the last attempt. */
export function SubmitRow({ label, busy, error }: { label: string; busy: boolean; error: string | null }) {
  const { t } = useTranslation();
  return (
    <div className="sm:col-span-2">
      <button type="submit" disabled={busy} className={buttonClass}>
        {busy ? t("desk.saving") : label}
      </button>
      {error ? (
        <p role="alert" className="mt-2 text-accent">
          {t("desk.error", { message: error })}
        </p>
      ) : null}
    </div>
  );
}
