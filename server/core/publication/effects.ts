// How estimates on the analysis scale read (METHODS.md: ratio measures are exponentiated only for
// display): the one formatter of an effect and of its 95% CI, for pages, charts and the desk, in the
// reader's locale (Intl: a decimal comma in es and fr, Latin digits in ar, decision 0024).
import { intlLocale, type Locale } from "../languages/locales";
import type { Measure } from "../nma/types";
import type { Interval } from "../nma/pairs";

export const isRatio = (measure: Measure) => measure === "OR" || measure === "RR";

export function displayValue(measure: Measure, value: number): number {
  return isRatio(measure) ? Math.exp(value) : value;
}

const formats = new Map<string, Intl.NumberFormat>();

function formatter(locale: Locale, key: string, options: Intl.NumberFormatOptions): Intl.NumberFormat {
  const id = `${locale}/${key}`;
  let format = formats.get(id);
  if (!format) {
    format = new Intl.NumberFormat(intlLocale(locale), { useGrouping: false, signDisplay: "negative", ...options });
    formats.set(id, format);
  }
  return format;
}

/**
 * A true minus sign (U+2212), as typography asks, in text, tables and charts alike. In Arabic, Intl
 * puts a left-to-right mark before a negative number, so the sign stays before the digits inside
 * right-to-left text (decision 0024).
 */
const withMinus = (text: string) => text.replace("-", "\u2212");

/** A number with a fixed count of decimals, as the locale writes it; a value that rounds to zero reads as zero, not "−0.00". */
export function formatNumber(value: number, digits: number, locale: Locale = "en"): string {
  return withMinus(formatter(locale, `f${digits}`, { minimumFractionDigits: digits, maximumFractionDigits: digits }).format(value));
}

/**
 * Decimals of an effect, the same in sentence, table, chart and card (decision 0035): two below 10
 * and one from 10 on, so three significant digits from 1 to 100 ("2.83", "−11.1", "−7.74") and never
 * a long tail of digits near zero. Ratios are shown as ratios.
 */
const effectDecimals = (shown: number) => (Math.abs(shown) < 10 ? 2 : 1);

export function formatEffect(measure: Measure, value: number, locale: Locale = "en"): string {
  const shown = displayValue(measure, value);
  return formatNumber(shown, effectDecimals(shown), locale);
}

/** A tick of a chart's axis: the same decimals at most, without trailing zeros ("−12", "−8", "0.5", "2"). */
export function formatTick(measure: Measure, value: number, locale: Locale = "en"): string {
  const shown = displayValue(measure, value);
  const digits = effectDecimals(shown);
  return withMinus(formatter(locale, `t${digits}`, { maximumFractionDigits: digits }).format(shown));
}

/** "2.83 (1.99 to 4.01)": `to` is the locale's word (brief.to). */
export function formatInterval(measure: Measure, x: Interval, to: string, locale: Locale = "en"): string {
  return `${formatEffect(measure, x.estimate, locale)} (${formatEffect(measure, x.lower, locale)} ${to} ${formatEffect(measure, x.upper, locale)})`;
}
