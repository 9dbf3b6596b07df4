// A pictograph of one binary comparison: 100 people with the comparator and 100 with the option, each
// dot filled for those who have the outcome; with the option, the dots between the ends of the 95%
// confidence interval are drawn as a band of half-filled dots, so the uncertainty is seen, not only read.
// 100 rather than 1000: a phone shows 100 dots at a size that can be counted (icon arrays of 100 are
// common practice in risk communication); each dot stands for 10 of the page's "per 1000" figures,
// which the text alternative states exactly. Dots are ink, never coloured as better or worse.
import { useTranslation } from "react-i18next";
import { textDirection, useIntl } from "../i18n";

export interface PictographInput {
  outcome: string;
  comparatorName: string;
  optionName: string;
  comparatorPer1000: number;
  option: { estimate: number; lower: number; upper: number };
}

const columns = 10;
const step = 14;
const radius = 5;

/** Dots of 100 that have the outcome (per 1000 ÷ 10, rounded), kept within 0 to 100. */
export const dotsOf = (per1000: number) => Math.min(100, Math.max(0, Math.round(per1000 / 10)));

/** How each of the 100 dots is drawn: has the outcome, within the interval's band, or not. */
export function dotStates(per1000: { estimate: number; lower?: number; upper?: number }): ("has" | "band" | "hasNot")[] {
  const low = dotsOf(Math.min(per1000.lower ?? per1000.estimate, per1000.estimate));
  const high = dotsOf(Math.max(per1000.upper ?? per1000.estimate, per1000.estimate));
  return Array.from({ length: 100 }, (_, i) => (i < low ? "has" : i < high ? "band" : "hasNot"));
}

function Grid({ states, label, rtl }: { states: ReturnType<typeof dotStates>; label: string; rtl: boolean }) {
  const size = columns * step;
  return (
    <figure className="m-0">
      <figcaption className="font-sans text-sm font-semibold">{label}</figcaption>
      {/* Filled from the side reading starts, row by row. */}
      <svg viewBox={`0 0 ${size} ${size}`} className="mt-1 h-auto w-36" aria-hidden="true">
        {states.map((state, i) => {
          const column = i % columns;
          const cx = (rtl ? columns - 1 - column : column) * step + step / 2;
          const cy = Math.floor(i / columns) * step + step / 2;
          return state === "band" ? (
            <g key={i}>
              <circle cx={cx} cy={cy} r={radius} fill="none" stroke="#1d1a17" strokeWidth={1.2} />
              <path d={`M ${cx} ${cy - radius} A ${radius} ${radius} 0 0 ${rtl ? 1 : 0} ${cx} ${cy + radius} Z`} fill="#1d1a17" />
            </g>
          ) : (
            <circle key={i} cx={cx} cy={cy} r={radius} fill={state === "has" ? "#1d1a17" : "none"} stroke="#1d1a17" strokeWidth={1.2} />
          );
        })}
      </svg>
    </figure>
  );
}

export function Pictograph({ input }: { input: PictographInput }) {
  const { t } = useTranslation();
  const intl = useIntl();
  const rtl = textDirection(intl.locale) === "rtl";
  const n = (value: number) => intl.number(Math.round(value), 0);
  const alt = t("pictograph.alt", {
    outcome: input.outcome,
    comparator: n(input.comparatorPer1000),
    comparatorName: input.comparatorName,
    estimate: n(input.option.estimate),
    optionName: input.optionName,
    lower: n(input.option.lower),
    upper: n(input.option.upper),
  });
  return (
    <div role="img" aria-label={alt} className="mt-6" data-testid="pictograph">
      <p className="font-sans text-sm text-muted" aria-hidden="true">{t("pictograph.title")}</p>
      <div className="mt-2 flex flex-wrap gap-6" aria-hidden="true">
        <Grid states={dotStates({ estimate: input.comparatorPer1000 })} label={t("pictograph.with", { name: input.comparatorName })} rtl={rtl} />
        <Grid states={dotStates(input.option)} label={t("pictograph.with", { name: input.optionName })} rtl={rtl} />
      </div>
      <ul className="mt-2 flex flex-wrap gap-x-5 gap-y-1 font-sans text-xs" aria-hidden="true">
        {(["has", "band", "hasNot"] as const).map((state) => (
          <li key={state} className="flex items-center gap-1.5">
            <svg viewBox="0 0 14 14" className="h-3.5 w-3.5">
              <circle cx={7} cy={7} r={radius} fill={state === "has" ? "#1d1a17" : "none"} stroke="#1d1a17" strokeWidth={1.2} />
              {state === "band" ? <path d={`M 7 2 A 5 5 0 0 ${rtl ? 1 : 0} 7 12 Z`} fill="#1d1a17" /> : null}
            </svg>
            {t(`pictograph.${state}`)}
          </li>
        ))}
      </ul>
      <p className="mt-1 font-sans text-xs text-muted" aria-hidden="true">{t("pictograph.note")}</p>
    </div>
  );
}
