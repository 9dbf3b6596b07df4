// Certainty in words first, then Fairweigh's four-step mark: four rising steps, as many filled as
// the rating is high. The mark repeats the words for the eye and is hidden from screen readers;
// colour never carries the meaning alone.
import { useTranslation } from "react-i18next";
import { certaintySteps, type Rating } from "#core/grade/certainty";

export function CertaintyMark({ rating }: { rating: Rating | null }) {
  const { t } = useTranslation();
  if (rating === null) return <span className="text-muted">{t("certainty.notAssessed")}</span>;
  const filled = certaintySteps(rating);
  return (
    <span className="inline-flex items-baseline gap-2 whitespace-nowrap" data-certainty={rating}>
      <span>{t(`certainty.rating.${rating}`)}</span>
      <svg viewBox="0 0 26 12" width="26" height="12" aria-hidden="true" className="self-center">
        {[0, 1, 2, 3].map((i) => (
          <rect
            key={i}
            x={i * 7}
            y={9 - i * 3}
            width={5}
            height={3 + i * 3}
            fill={i < filled ? "var(--color-accent)" : "none"}
            stroke="var(--color-accent)"
            strokeWidth={1}
          />
        ))}
      </svg>
    </span>
  );
}
