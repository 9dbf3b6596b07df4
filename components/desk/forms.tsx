// Small form pieces the desk's screens share.
import type { ReactNode } from "react";

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
