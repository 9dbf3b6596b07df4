// A pictograph of binary comparisons: 100 people with the comparator and 100 with the option, each
// dot filled for those who have the outcome; with the option, the dots between the ends of the 95%
// confidence interval are drawn as a band of half-filled dots, so the uncertainty is seen, not only
// read. Why 100, and the layout: server/core/publication/pictograph.ts. Dots are ink, never coloured
// as better or worse.
import { useTranslation } from "react-i18next";
import { dotCentre, dotGrid, dotStates, halfDot, pictographAlt, type DotState, type PictographInput } from "#core/publication/pictograph";
import { textDirection, useIntl } from "../i18n";

const { columns, step, radius } = dotGrid;

function Grid({ states, label, rtl }: { states: DotState[]; label: string; rtl: boolean }) {
  const size = columns * step;
  return (
    <figure className="m-0">
      <figcaption className="font-sans text-sm font-semibold">{label}</figcaption>
      {/* Filled from the side reading starts, row by row. */}
      <svg viewBox={`0 0 ${size} ${size}`} className="mt-1 h-auto w-36" aria-hidden="true">
        {states.map((state, i) => {
          const { cx, cy } = dotCentre(i, rtl);
          return state === "band" ? (
            <g key={i}>
              <circle cx={cx} cy={cy} r={radius} fill="none" stroke="#1d1a17" strokeWidth={1.2} />
              <path d={halfDot(cx, cy, rtl)} fill="#1d1a17" />
            </g>
          ) : (
            <circle key={i} cx={cx} cy={cy} r={radius} fill={state === "has" ? "#1d1a17" : "none"} stroke="#1d1a17" strokeWidth={1.2} />
          );
        })}
      </svg>
    </figure>
  );
}

/** What each kind of dot means, and what one dot stands for. */
function Legend({ rtl }: { rtl: boolean }) {
  const { t } = useTranslation();
  return (
    <>
      <ul className="mt-2 flex flex-wrap gap-x-5 gap-y-1 font-sans text-xs" aria-hidden="true">
        {(["has", "band", "hasNot"] as const).map((state) => (
          <li key={state} className="flex items-center gap-1.5">
            <svg viewBox="0 0 14 14" className="h-3.5 w-3.5">
              <circle cx={7} cy={7} r={radius} fill={state === "has" ? "#1d1a17" : "none"} stroke="#1d1a17" strokeWidth={1.2} />
              {state === "band" ? <path d={halfDot(7, 7, rtl)} fill="#1d1a17" /> : null}
            </svg>
            {t(`pictograph.${state}`)}
          </li>
        ))}
      </ul>
      <p className="mt-1 font-sans text-xs text-muted" aria-hidden="true">{t("pictograph.note")}</p>
    </>
  );
}

/** The sentence a pictograph says to those who cannot see it: the numbers per 1000, exactly. */
function useAlt() {
  const { t } = useTranslation();
  const { locale } = useIntl();
  return (input: PictographInput) => t("pictograph.alt", pictographAlt(input, locale));
}

/** One comparison: 100 people with the comparator beside 100 with the option (a comparison's page). */
export function Pictograph({ input }: { input: PictographInput }) {
  const { t } = useTranslation();
  const rtl = textDirection(useIntl().locale) === "rtl";
  return (
    <div role="img" aria-label={useAlt()(input)} className="mt-6" data-testid="pictograph">
      <p className="font-sans text-sm text-muted" aria-hidden="true">{t("pictograph.title")}</p>
      <div className="mt-2 flex flex-wrap gap-6" aria-hidden="true">
        <Grid states={dotStates({ estimate: input.comparatorPer1000 })} label={t("pictograph.with", { name: input.comparatorName })} rtl={rtl} />
        <Grid states={dotStates(input.option)} label={t("pictograph.with", { name: input.optionName })} rtl={rtl} />
      </div>
      <Legend rtl={rtl} />
    </div>
  );
}

/**
 * Every option of an outcome against its reference (a brief's page): the reference's 100 people once,
 * then each option's, in the table's order; each option says its own numbers to assistive technology.
 */
export function PictographSet({ outcome, reference, options }: { outcome: string; reference: { name: string; per1000: number }; options: { name: string; per1000: PictographInput["option"] }[] }) {
  const { t } = useTranslation();
  const rtl = textDirection(useIntl().locale) === "rtl";
  const alt = useAlt();
  return (
    <div className="mt-3" data-testid="pictograph-set">
      <p className="font-sans text-sm text-muted">{t("pictograph.title")}</p>
      <div className="mt-2 flex flex-wrap gap-6">
        <div aria-hidden="true">
          <Grid states={dotStates({ estimate: reference.per1000 })} label={t("pictograph.with", { name: reference.name })} rtl={rtl} />
        </div>
        {options.map((option) => (
          <div key={option.name} role="img" aria-label={alt({ outcome, comparatorName: reference.name, comparatorPer1000: reference.per1000, optionName: option.name, option: option.per1000 })}>
            <div aria-hidden="true">
              <Grid states={dotStates(option.per1000)} label={t("pictograph.with", { name: option.name })} rtl={rtl} />
            </div>
          </div>
        ))}
      </div>
      <Legend rtl={rtl} />
    </div>
  );
}
