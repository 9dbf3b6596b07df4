// How a comparison's certainty was reached, as arithmetic a reader can add up (METHODS.md §8 step 5):
// the direct certainty and its steps, the indirect certainty and its loop, which one the network
// estimate started from, then its own steps down to the published rating.
import { useTranslation } from "react-i18next";
import type { ComparisonOutcomeView } from "#core/publication/brief-page";
import { useIntl } from "../i18n";

type Path = NonNullable<ComparisonOutcomeView["path"]>;

export function CertaintyPath({ outcome, names }: { outcome: ComparisonOutcomeView; names: { treatment: string; comparator: string } }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const path = outcome.path;
  if (!path) return null;
  // Inside a sentence the rating reads in lower case ("Direct certainty: moderate.").
  const rating = (r: Path["rating"]) => t(`certainty.rating.${r}`).toLocaleLowerCase(intl.locale);
  const steps = (list: Path["steps"]) => list.map((step) => <li key={step.domainKey}>{t("compare.downgraded", { domain: t(step.domainKey), count: step.levels })}</li>);
  const { indirect } = path;
  return (
    <section className="mt-6 font-sans text-sm" data-testid="certainty-path">
      <h3 className="font-semibold">{t("compare.path.title")}</h3>
      <ol className="mt-2 space-y-3">
        <li data-testid="path-direct">
          <span className="font-semibold">{t("compare.path.direct")}</span>
          <ul className="mt-1 list-disc space-y-0.5 ps-6">
            {path.direct ? (
              <>
                <li>{t("compare.path.startHigh")}</li>
                {steps(path.direct.steps)}
                <li>{t("compare.path.directRating", { rating: rating(path.direct.rating) })}</li>
              </>
            ) : (
              <li>{outcome.direct ? t("compare.path.directUnrated") : t("compare.path.noDirect")}</li>
            )}
          </ul>
        </li>
        <li data-testid="path-indirect">
          <span className="font-semibold">{t("compare.path.indirect")}</span>
          <ul className="mt-1 list-disc space-y-0.5 ps-6">
            {indirect ? (
              <>
                <li>
                  {indirect.via === null
                    ? t("compare.path.setByAnalysts")
                    : indirect.sides
                      ? t("compare.path.loop", { via: indirect.via.name, ...names, first: rating(indirect.sides[0]), second: rating(indirect.sides[1]) })
                      : t("compare.path.loopShort", { via: indirect.via.name })}
                  {indirect.reason ? ` ${indirect.reason}` : null}
                </li>
                {steps(indirect.steps)}
                <li>{t("compare.path.indirectRating", { rating: rating(indirect.rating) })}</li>
              </>
            ) : (
              <li>{t("compare.path.noIndirect")}</li>
            )}
          </ul>
        </li>
        <li data-testid="path-network">
          <span className="font-semibold">{t("compare.path.network")}</span>
          <ul className="mt-1 list-disc space-y-0.5 ps-6">
            <li>
              {path.took === "direct"
                ? t("compare.path.tookDirect", { rating: rating(path.direct?.rating ?? path.rating) })
                : t("compare.path.tookIndirect", { rating: rating(indirect?.rating ?? path.rating) })}
            </li>
            {steps(path.steps)}
            <li className="font-semibold">{t("compare.path.published", { rating: rating(path.rating) })}</li>
          </ul>
        </li>
      </ol>
    </section>
  );
}
