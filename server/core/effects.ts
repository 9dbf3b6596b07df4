// How estimates on the analysis scale read (METHODS.md: ratio measures are exponentiated only for
// display): the one formatter of an effect and of its 95% CI, for pages, charts and the desk, in the
// reader's locale (Intl: a decimal comma in es and fr, Latin digits in ar, decision 0024).
import { intlLocale, type Locale } from "./locales";
import type { Measure } from "./nma/types";
import type { Interval } from "./pairs";

export const isRatio = (measure: Measure) => measure === "OR" || measure === "RR";

export function displayValue(measure: Measure, value: number): number {
  return isRatio(measure) ? Math.exp(value) : value;
}

const formats = new Map<string, Intl.NumberFormat>();

/** A number with a fixed count of decimals, as the locale writes it; a value that rounds to zero reads as zero, not "-0.00". */
export function formatNumber(value: number, digits: number, locale: Locale = "en"): string {
  const key = `${locale}/${digits}`;
  let format = formats.get(key);
  if (!format) {
    format = new Intl.NumberFormat(intlLocale(locale), { minimumFractionDigits: digits, maximumFractionDigits: digits, useGrouping: false, signDisplay: "negative" });
    formats.set(key, format);
  }
  return format.format(value);
}

export function formatEffect(measure: Measure, value: number, locale: Locale = "en"): string {
  const shown = displayValue(measure, value);
  const digits = isRatio(measure) || Math.abs(shown) < 10 ? 2 : 1;
  return formatNumber(shown, digits, locale);
}

/** "2.83 (1.99 to 4.01)": `to` is the locale's word (brief.to). */
export function formatInterval(measure: Measure, x: Interval, to: string, locale: Locale = "en"): string {
  return `${formatEffect(measure, x.estimate, locale)} (${formatEffect(measure, x.lower, locale)} ${to} ${formatEffect(measure, x.upper, locale)})`;
}
