// How a pictograph of 100 people is laid out (components/charts/Pictograph.tsx on the pages, the embed
// card's SVG in server/web/public/embed.ts): which dots are filled, which stand for the 95% confidence
// interval, and where each dot sits. 100 rather than 1000: a phone shows 100 dots at a size that can be
// counted (icon arrays of 100 are common practice in risk communication); each dot stands for 10 of
// the "per 1000" figures, which the text alternative states exactly.
import type { Locale } from "../languages/locales";
import { formatNumber } from "./effects";

export const dotGrid = { columns: 10, step: 14, radius: 5 } as const;

/** Dots of 100 that have the outcome (per 1000 ÷ 10, rounded), kept within 0 to 100. */
export const dotsOf = (per1000: number) => Math.min(100, Math.max(0, Math.round(per1000 / 10)));

export type DotState = "has" | "band" | "hasNot";

/** How each of the 100 dots is drawn: has the outcome, within the interval's band, or not. */
export function dotStates(per1000: { estimate: number; lower?: number; upper?: number }): DotState[] {
  const low = dotsOf(Math.min(per1000.lower ?? per1000.estimate, per1000.estimate));
  const high = dotsOf(Math.max(per1000.upper ?? per1000.estimate, per1000.estimate));
  return Array.from({ length: 100 }, (_, i) => (i < low ? "has" : i < high ? "band" : "hasNot"));
}

/** Where dot i sits: filled row by row from the side reading starts (the right in Arabic). */
export function dotCentre(i: number, rtl: boolean): { cx: number; cy: number } {
  const { columns, step } = dotGrid;
  const column = i % columns;
  return { cx: (rtl ? columns - 1 - column : column) * step + step / 2, cy: Math.floor(i / columns) * step + step / 2 };
}

/** The half of a band dot that is filled: the half nearer where reading starts. */
export const halfDot = (cx: number, cy: number, rtl: boolean) => `M ${cx} ${cy - dotGrid.radius} A ${dotGrid.radius} ${dotGrid.radius} 0 0 ${rtl ? 1 : 0} ${cx} ${cy + dotGrid.radius} Z`;

/** One comparison as 100 people with each of its two sides: the comparator's risk and the option's, with its 95% CI, per 1000. */
export interface PictographInput {
  outcome: string;
  comparatorName: string;
  optionName: string;
  comparatorPer1000: number;
  option: { estimate: number; lower: number; upper: number };
}

/** The values of the sentence a pictograph says to those who cannot see it (pictograph.alt): the numbers per 1000, exactly. */
export function pictographAlt(input: PictographInput, locale: Locale) {
  const n = (value: number) => formatNumber(Math.round(value), 0, locale);
  return {
    outcome: input.outcome,
    comparator: n(input.comparatorPer1000),
    comparatorName: input.comparatorName,
    estimate: n(input.option.estimate),
    optionName: input.optionName,
    lower: n(input.option.lower),
    upper: n(input.option.upper),
  };
}
