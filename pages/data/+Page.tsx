import { useTranslation } from "react-i18next";

/** The addresses a data journalist builds on (docs/data.md), with the promise that keeps them stable. */
const reads = [
  { text: "data.releases", address: "/api/releases" },
  { text: "data.snapshot", address: "/api/briefs/{slug}/versions/{number}" },
  { text: "data.openapi", address: "/api/openapi.json" },
] as const;

export default function Page() {
  const { t } = useTranslation();
  return (
    <div className="max-w-2xl">
      <h1 className="text-4xl font-semibold tracking-tight">{t("data.title")}</h1>
      <p className="mt-6 text-lg">{t("data.lead")}</p>
      <h2 className="mt-10 text-2xl font-semibold">{t("data.whatTitle")}</h2>
      <ul className="mt-4 space-y-4">
        {reads.map(({ text, address }) => (
          <li key={address}>
            <p>{t(text)}</p>
            {/* An address reads left to right in every language, and sits under its description (right-aligned in Arabic). */}
            <p className="mt-1 overflow-x-auto font-mono text-sm">
              {address.includes("{") ? <code dir="ltr">GET {address}</code> : <a href={address}><code dir="ltr">GET {address}</code></a>}
            </p>
          </li>
        ))}
      </ul>
      <p className="mt-4">{t("data.files")}</p>
      <h2 className="mt-10 text-2xl font-semibold">{t("data.stabilityTitle")}</h2>
      <p className="mt-4">{t("data.stability")}</p>
      <h2 className="mt-10 text-2xl font-semibold">{t("data.licenseTitle")}</h2>
      <p className="mt-4">{t("data.license")}</p>
    </div>
  );
}
