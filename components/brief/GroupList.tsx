// The groups of an outcome (METHODS.md §9): what the evidence supports, with certainty in words.
// Never a ranking: treatments within a group are listed alphabetically.
import { useTranslation } from "react-i18next";
import type { OutcomeView } from "#core/publication/brief-page";
import { Message } from "../Message";
import { Term } from "../Term";

export function GroupList({ outcome }: { outcome: OutcomeView }) {
  const { t } = useTranslation();
  return (
    <>
      <p className="mt-2 text-muted">{t(`brief.framework.${outcome.framework}`, { reference: outcome.reference.name })}</p>
      {outcome.thresholds ? (
        <p className="mt-2 text-muted" data-testid="thresholds">
          {t(`brief.thresholds.${outcome.thresholds.unit}`, {
            reference: outcome.reference.name,
            baseline: outcome.thresholds.baselinePer1000,
            unit: outcome.unit ?? "",
            small: outcome.thresholds.small ?? t("brief.thresholds.notSet"),
            moderate: outcome.thresholds.moderate ?? t("brief.thresholds.notSet"),
            large: outcome.thresholds.large ?? t("brief.thresholds.notSet"),
          })}
        </p>
      ) : null}
      <ol className="mt-4 space-y-4" data-testid="groups">
        {outcome.groups.map((group) => (
          <li
            key={`${group.level}-${group.firmness}`}
            className={`border-s-4 bg-white p-4 ${group.firmness === "firm" ? "border-accent" : group.firmness === "may" ? "border-accent/50 border-dashed" : group.firmness === "not-assessed" ? "border-rule border-dotted" : "border-rule"}`}
          >
            <h4 className="text-lg font-semibold"><Message message={group.label} /></h4>
            {group.label.key === "groups.referenceOnly" ? null : (
              <p className="font-sans text-xs uppercase tracking-wide text-muted"><Term term="certainty">{t(`brief.firmness.${group.firmness}`)}</Term></p>
            )}
            <ul className="mt-2 flex flex-wrap gap-x-4 gap-y-1">
              {group.treatments.map((treatment) => (
                <li key={treatment.id}>{treatment.name}</li>
              ))}
            </ul>
          </li>
        ))}
      </ol>
    </>
  );
}
