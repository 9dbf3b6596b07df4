import { useTranslation } from "react-i18next";
import { DeskLink } from "../DeskLink";
import type { BriefSummary } from "#web/api/contract";

export function BriefList({ briefs }: { briefs: BriefSummary[] }) {
  const { t } = useTranslation();
  if (briefs.length === 0) return <p className="text-muted">{t("desk.noBriefs")}</p>;
  return (
    <ul className="divide-y divide-rule border-y border-rule">
      {briefs.map((brief) => (
        <li key={brief.id} className="flex items-baseline justify-between gap-4 py-3">
          <DeskLink to={`/briefs/${brief.id}`} className="text-lg">
            {brief.title}
          </DeskLink>
          <span className="font-sans text-sm text-muted">
            {brief.topic} · {t(`desk.status.${brief.status}`)}
          </span>
        </li>
      ))}
    </ul>
  );
}
