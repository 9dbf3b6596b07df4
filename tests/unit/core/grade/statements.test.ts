// The full grid of plain-language statements: 4 certainty levels × 4 magnitudes × benefit or harm,
// against the wording of Santesso et al., GRADE guidelines 26, J Clin Epidemiol 2020;119:126–135
// (the phrases below are recalled from that paper's table of suggested statements; "slightly" stands
// before the verb, our wording, so that a long outcome phrase still reads naturally). "unclear" is
// METHODS.md §10 without thresholds: the 95% CI includes the null, and no trivial band is defined.
import { describe, expect, it } from "vitest";
import { createI18n, locales, type Locale } from "#components/i18n";
import { messageText } from "#components/Message";
import type { Rating } from "#core/grade/certainty";
import { absoluteStatement, magnitudeOf, statementFor, type Magnitude } from "#core/grade/statements";

const wording: Record<Exclude<Rating, "very_low">, Record<Magnitude, { reduce: string; increase: string }>> = {
  high: {
    large: { reduce: "results in a large reduction in pain", increase: "results in a large increase in pain" },
    moderate: { reduce: "reduces pain", increase: "increases pain" },
    small: { reduce: "slightly reduces pain", increase: "slightly increases pain" },
    trivial: { reduce: "results in little to no difference in pain", increase: "results in little to no difference in pain" },
    unclear: { reduce: "does not show a clear difference in pain", increase: "does not show a clear difference in pain" },
  },
  moderate: {
    large: { reduce: "likely results in a large reduction in pain", increase: "likely results in a large increase in pain" },
    moderate: { reduce: "probably reduces pain", increase: "probably increases pain" },
    small: { reduce: "probably slightly reduces pain", increase: "probably slightly increases pain" },
    trivial: { reduce: "probably results in little to no difference in pain", increase: "probably results in little to no difference in pain" },
    unclear: { reduce: "probably does not show a clear difference in pain", increase: "probably does not show a clear difference in pain" },
  },
  low: {
    large: { reduce: "may result in a large reduction in pain", increase: "may result in a large increase in pain" },
    moderate: { reduce: "may reduce pain", increase: "may increase pain" },
    small: { reduce: "may slightly reduce pain", increase: "may slightly increase pain" },
    trivial: { reduce: "may result in little to no difference in pain", increase: "may result in little to no difference in pain" },
    unclear: { reduce: "may not show a clear difference in pain", increase: "may not show a clear difference in pain" },
  },
};

const magnitudes: Magnitude[] = ["large", "moderate", "small", "trivial", "unclear"];
type Grid = Record<Exclude<Rating, "very_low">, Record<Magnitude, { reduce: string; increase: string }>>;

// The same grid in Spanish, French and Arabic: our own translations of the published English
// templates above (no published translation of that table is used), written out here as well as in
// locales/, so that a change to either is caught. T, O and C stand for treatment, outcome, comparator.
const same = (text: string) => ({ reduce: text, increase: text });
const grids: Record<Exclude<Locale, "en">, { grid: Grid; sentence: (phrase: string) => string; veryLow: string; absolute: [string, string] }> = {
  es: {
    grid: {
      high: {
        large: { reduce: "T produce una gran reducción de O", increase: "T produce un gran aumento de O" },
        moderate: { reduce: "T reduce O", increase: "T aumenta O" },
        small: { reduce: "T reduce ligeramente O", increase: "T aumenta ligeramente O" },
        trivial: same("T produce poca o ninguna diferencia en O"),
        unclear: same("T no muestra una diferencia clara en O"),
      },
      moderate: {
        large: { reduce: "T probablemente produce una gran reducción de O", increase: "T probablemente produce un gran aumento de O" },
        moderate: { reduce: "T probablemente reduce O", increase: "T probablemente aumenta O" },
        small: { reduce: "T probablemente reduce ligeramente O", increase: "T probablemente aumenta ligeramente O" },
        trivial: same("T probablemente produce poca o ninguna diferencia en O"),
        unclear: same("T probablemente no muestra una diferencia clara en O"),
      },
      low: {
        large: { reduce: "T podría producir una gran reducción de O", increase: "T podría producir un gran aumento de O" },
        moderate: { reduce: "T podría reducir O", increase: "T podría aumentar O" },
        small: { reduce: "T podría reducir ligeramente O", increase: "T podría aumentar ligeramente O" },
        trivial: same("T podría producir poca o ninguna diferencia en O"),
        unclear: same("T podría no mostrar una diferencia clara en O"),
      },
    },
    sentence: (phrase) => `${phrase} en comparación con C.`,
    veryLow: "La evidencia es muy incierta sobre el efecto de T en O en comparación con C.",
    absolute: ["23 menos por cada 1000 (de 40 menos a 4 menos)", "12 más por cada 1000 (de 5 menos a 30 más)"],
  },
  fr: {
    grid: {
      high: {
        large: { reduce: "T entraîne une forte diminution de O", increase: "T entraîne une forte augmentation de O" },
        moderate: { reduce: "T diminue O", increase: "T augmente O" },
        small: { reduce: "T diminue légèrement O", increase: "T augmente légèrement O" },
        trivial: same("T entraîne peu ou pas de différence sur O"),
        unclear: same("T ne montre pas de différence nette sur O"),
      },
      moderate: {
        large: { reduce: "T entraîne probablement une forte diminution de O", increase: "T entraîne probablement une forte augmentation de O" },
        moderate: { reduce: "T diminue probablement O", increase: "T augmente probablement O" },
        small: { reduce: "T diminue probablement légèrement O", increase: "T augmente probablement légèrement O" },
        trivial: same("T n’entraîne probablement que peu ou pas de différence sur O"),
        unclear: same("T ne montre probablement pas de différence nette sur O"),
      },
      low: {
        large: { reduce: "T pourrait entraîner une forte diminution de O", increase: "T pourrait entraîner une forte augmentation de O" },
        moderate: { reduce: "T pourrait diminuer O", increase: "T pourrait augmenter O" },
        small: { reduce: "T pourrait diminuer légèrement O", increase: "T pourrait augmenter légèrement O" },
        trivial: same("T pourrait n’entraîner que peu ou pas de différence sur O"),
        unclear: same("T pourrait ne pas montrer de différence nette sur O"),
      },
    },
    sentence: (phrase) => `${phrase} par rapport à C.`,
    veryLow: "Les données probantes sont très incertaines quant à l’effet de T sur O par rapport à C.",
    absolute: ["23 de moins pour 1000 (de 40 de moins à 4 de moins)", "12 de plus pour 1000 (de 5 de moins à 30 de plus)"],
  },
  ar: {
    grid: {
      high: {
        large: { reduce: "يؤدي T إلى انخفاض كبير في O", increase: "يؤدي T إلى زيادة كبيرة في O" },
        moderate: { reduce: "يخفّض T O", increase: "يزيد T O" },
        small: { reduce: "يخفّض T O قليلًا", increase: "يزيد T O قليلًا" },
        trivial: same("يؤدي T إلى فرق ضئيل أو لا فرق في O"),
        unclear: same("لا يُظهر T فرقًا واضحًا في O"),
      },
      moderate: {
        large: { reduce: "يُرجَّح أن يؤدي T إلى انخفاض كبير في O", increase: "يُرجَّح أن يؤدي T إلى زيادة كبيرة في O" },
        moderate: { reduce: "يُحتمل أن يخفّض T O", increase: "يُحتمل أن يزيد T O" },
        small: { reduce: "يُحتمل أن يخفّض T O قليلًا", increase: "يُحتمل أن يزيد T O قليلًا" },
        trivial: same("يُحتمل أن يؤدي T إلى فرق ضئيل أو لا فرق في O"),
        unclear: same("يُحتمل ألّا يُظهر T فرقًا واضحًا في O"),
      },
      low: {
        large: { reduce: "قد يؤدي T إلى انخفاض كبير في O", increase: "قد يؤدي T إلى زيادة كبيرة في O" },
        moderate: { reduce: "قد يخفّض T O", increase: "قد يزيد T O" },
        small: { reduce: "قد يخفّض T O قليلًا", increase: "قد يزيد T O قليلًا" },
        trivial: same("قد يؤدي T إلى فرق ضئيل أو لا فرق في O"),
        unclear: same("قد لا يُظهر T فرقًا واضحًا في O"),
      },
    },
    sentence: (phrase) => `${phrase} مقارنةً بـC.`,
    veryLow: "الأدلة غير مؤكدة إلى حد كبير بشأن أثر T في O مقارنةً بـC.",
    absolute: ["أقل بـ23 لكل 1000 (من أقل بـ40 إلى أقل بـ4)", "أكثر بـ12 لكل 1000 (من أقل بـ5 إلى أكثر بـ30)"],
  },
};

const english = {
  grid: Object.fromEntries(Object.entries(wording).map(([c, row]) => [c, Object.fromEntries(Object.entries(row).map(([m, p]) => [m, { reduce: `T ${p.reduce.replace("pain", "O")}`, increase: `T ${p.increase.replace("pain", "O")}` }]))])) as Grid,
  sentence: (phrase: string) => `${phrase} compared with C.`,
  veryLow: "The evidence is very uncertain about the effect of T on O compared with C.",
  absolute: ["23 fewer per 1000 (from 40 fewer to 4 fewer)", "12 more per 1000 (from 5 fewer to 30 more)"] as [string, string],
};

describe.each(locales)("statements in %s", (locale) => {
  const { t } = createI18n(locale);
  // Frozen versions hold "40 fewer" as a value: pages say it in the reader's language (components/Message.tsx).
  const say = (s: { key: string; values: Record<string, string | number> }) => messageText(t, locale, s);
  const expected = locale === "en" ? english : grids[locale];

  // A statement says which way the outcome moved; whether that is good news is the outcome's
  // direction, which the page shows beside it (and harm outcomes name the harm). So each direction once.
  for (const [change, estimate] of [["reduce", -0.5], ["increase", 0.5]] as const) {
    for (const certainty of ["high", "moderate", "low"] as const) {
      for (const magnitude of magnitudes) {
        it(`${certainty} certainty, ${magnitude}, the outcome ${change === "reduce" ? "lower" : "higher"}`, () => {
          const statement = statementFor({ treatment: "T", comparator: "C", outcome: "O", estimate, certainty, magnitude });
          expect(say(statement)).toBe(expected.sentence(expected.grid[certainty][magnitude][change]));
        });
      }
    }
    it(`very low certainty, any magnitude, the outcome ${change === "reduce" ? "lower" : "higher"}`, () => {
      for (const magnitude of magnitudes) {
        const statement = statementFor({ treatment: "T", comparator: "C", outcome: "O", estimate, certainty: "very_low", magnitude });
        expect(say(statement)).toBe(expected.veryLow);
      }
    });
  }

  it("states the absolute effect per 1000 with its interval", () => {
    expect(say(absoluteStatement({ estimate: -23.4, lower: -40.2, upper: -3.6 }))).toBe(expected.absolute[0]);
    expect(say(absoluteStatement({ estimate: 12.2, lower: -5.1, upper: 30 }))).toBe(expected.absolute[1]);
  });
});

describe("magnitude from the outcome's thresholds", () => {
  const thresholds = { small: 0.1, moderate: 0.3, large: 0.6 };
  it("classifies the absolute size of the point estimate", () => {
    expect([0.05, -0.1, 0.29, -0.3, 0.59, 0.6, -2].map((x) => magnitudeOf(x, thresholds))).toEqual([
      "trivial", "small", "small", "moderate", "moderate", "large", "large",
    ]);
  });
});
