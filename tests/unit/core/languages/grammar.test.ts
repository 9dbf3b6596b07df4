// Statements with real names, as the site renders them (server/core/languages/grammar.ts through the message
// parts the pages use): each sentence below is written out by hand, in each language, for singular,
// plural and feminine names, every certainty, and effects that raise, lower or do not clearly differ.
import { describe, expect, it } from "vitest";
import { createI18n } from "#components/i18n";
import type { Rating } from "#core/grade/certainty";
import { statementFor, type Magnitude } from "#core/grade/statements";
import { grammaticalSnapshot, joinParts, type TreatmentGrammar } from "#core/languages/grammar";
import type { Locale } from "#core/languages/locales";
import { messageText } from "#core/languages/message";
import { translatedSnapshot, versionGrammar } from "#core/languages/translation";
import type { VersionSnapshot } from "#core/snapshot/schema";

type Case = [treatment: string, comparator: string, certainty: Rating, magnitude: Magnitude, change: "increase" | "reduce", sentence: string];

/** One statement, put through the grammar of `names` and rendered as the pages render it. */
function rendered(locale: Locale, names: Record<string, TreatmentGrammar>, outcome: string, [treatment, comparator, certainty, magnitude, change]: Case): string {
  const statement = statementFor({ treatment, comparator, outcome, estimate: change === "increase" ? 1 : -1, certainty, magnitude });
  const snapshot = { outcomes: [{ settings: { reference: comparator }, groups: [], readings: [{ treatment, comparator, statement }] }] } as unknown as VersionSnapshot;
  const read = grammaticalSnapshot(snapshot, locale, (label) => names[label]!).outcomes[0]!.readings[0]!.statement!;
  return messageText(createI18n(locale).t, locale, read);
}

const cases: Record<Locale, { outcome: string; names: Record<string, TreatmentGrammar>; sentences: Case[] }> = {
  en: {
    outcome: "good sleep",
    names: {
      light: { phrase: "timed bright-light sessions", number: "plural", gender: "masculine" },
      usual: { phrase: "usual care", number: "singular", gender: "masculine" },
      k: { phrase: "sleep aid K", number: "singular", gender: "masculine" },
    },
    sentences: [
      ["light", "usual", "high", "moderate", "increase", "Timed bright-light sessions increase good sleep compared with usual care."],
      ["light", "usual", "moderate", "moderate", "increase", "Timed bright-light sessions probably increase good sleep compared with usual care."],
      ["light", "usual", "low", "moderate", "increase", "Timed bright-light sessions may increase good sleep compared with usual care."],
      ["light", "usual", "high", "large", "reduce", "Timed bright-light sessions result in a large reduction in good sleep compared with usual care."],
      ["light", "usual", "moderate", "unclear", "increase", "Timed bright-light sessions probably do not show a clear difference in good sleep compared with usual care."],
      ["light", "usual", "very_low", "moderate", "increase", "The evidence is very uncertain about the effect of timed bright-light sessions on good sleep compared with usual care."],
      ["usual", "light", "high", "small", "reduce", "Usual care slightly reduces good sleep compared with timed bright-light sessions."],
      ["k", "usual", "moderate", "large", "increase", "Sleep aid K likely results in a large increase in good sleep compared with usual care."],
      ["k", "usual", "low", "unclear", "increase", "Sleep aid K may not show a clear difference in good sleep compared with usual care."],
      ["usual", "k", "high", "unclear", "reduce", "Usual care does not show a clear difference in good sleep compared with sleep aid K."],
      ["usual", "k", "moderate", "small", "reduce", "Usual care probably slightly reduces good sleep compared with sleep aid K."],
      ["light", "k", "high", "trivial", "increase", "Timed bright-light sessions result in little to no difference in good sleep compared with sleep aid K."],
    ],
  },
  es: {
    outcome: "el buen sueño",
    names: {
      light: { phrase: "las sesiones de luz brillante programadas", number: "plural", gender: "feminine" },
      usual: { phrase: "la atención habitual", number: "singular", gender: "feminine" },
      k: { phrase: "la ayuda para dormir K", number: "singular", gender: "feminine" },
      nap: { phrase: "el plan de siestas", number: "singular", gender: "masculine" },
    },
    sentences: [
      ["light", "usual", "high", "moderate", "increase", "Las sesiones de luz brillante programadas aumentan el buen sueño en comparación con la atención habitual."],
      ["light", "usual", "moderate", "large", "increase", "Las sesiones de luz brillante programadas probablemente producen un gran aumento del buen sueño en comparación con la atención habitual."],
      ["light", "usual", "low", "moderate", "reduce", "Las sesiones de luz brillante programadas podrían reducir el buen sueño en comparación con la atención habitual."],
      ["light", "usual", "moderate", "unclear", "increase", "Las sesiones de luz brillante programadas probablemente no muestran una diferencia clara en el buen sueño en comparación con la atención habitual."],
      ["light", "usual", "very_low", "moderate", "increase", "La evidencia es muy incierta sobre el efecto de las sesiones de luz brillante programadas en el buen sueño en comparación con la atención habitual."],
      ["usual", "nap", "high", "small", "reduce", "La atención habitual reduce ligeramente el buen sueño en comparación con el plan de siestas."],
      ["nap", "usual", "low", "large", "increase", "El plan de siestas podría producir un gran aumento del buen sueño en comparación con la atención habitual."],
      ["nap", "k", "high", "unclear", "increase", "El plan de siestas no muestra una diferencia clara en el buen sueño en comparación con la ayuda para dormir K."],
      ["k", "nap", "moderate", "moderate", "increase", "La ayuda para dormir K probablemente aumenta el buen sueño en comparación con el plan de siestas."],
      ["light", "nap", "low", "unclear", "reduce", "Las sesiones de luz brillante programadas podrían no mostrar una diferencia clara en el buen sueño en comparación con el plan de siestas."],
      ["light", "nap", "high", "large", "reduce", "Las sesiones de luz brillante programadas producen una gran reducción del buen sueño en comparación con el plan de siestas."],
      ["k", "usual", "moderate", "trivial", "increase", "La ayuda para dormir K probablemente produce poca o ninguna diferencia en el buen sueño en comparación con la atención habitual."],
    ],
  },
  fr: {
    outcome: "le bon sommeil",
    names: {
      light: { phrase: "les séances de lumière vive programmées", number: "plural", gender: "feminine" },
      usual: { phrase: "les soins habituels", number: "plural", gender: "masculine" },
      k: { phrase: "l’aide au sommeil K", number: "singular", gender: "feminine" },
      nap: { phrase: "le programme de siestes", number: "singular", gender: "masculine" },
    },
    sentences: [
      ["light", "usual", "high", "moderate", "increase", "Les séances de lumière vive programmées augmentent le bon sommeil par rapport aux soins habituels."],
      ["light", "usual", "moderate", "large", "increase", "Les séances de lumière vive programmées entraînent probablement une forte augmentation du bon sommeil par rapport aux soins habituels."],
      ["light", "nap", "low", "moderate", "reduce", "Les séances de lumière vive programmées pourraient diminuer le bon sommeil par rapport au programme de siestes."],
      ["usual", "k", "moderate", "unclear", "increase", "Les soins habituels ne montrent probablement pas de différence nette sur le bon sommeil par rapport à l’aide au sommeil K."],
      ["nap", "usual", "very_low", "moderate", "increase", "Les données probantes sont très incertaines quant à l’effet du programme de siestes sur le bon sommeil par rapport aux soins habituels."],
      ["k", "nap", "high", "small", "reduce", "L’aide au sommeil K diminue légèrement le bon sommeil par rapport au programme de siestes."],
      ["nap", "light", "low", "large", "increase", "Le programme de siestes pourrait entraîner une forte augmentation du bon sommeil par rapport aux séances de lumière vive programmées."],
      ["usual", "nap", "high", "unclear", "reduce", "Les soins habituels ne montrent pas de différence nette sur le bon sommeil par rapport au programme de siestes."],
      ["k", "usual", "moderate", "moderate", "increase", "L’aide au sommeil K augmente probablement le bon sommeil par rapport aux soins habituels."],
      ["light", "k", "low", "unclear", "reduce", "Les séances de lumière vive programmées pourraient ne pas montrer de différence nette sur le bon sommeil par rapport à l’aide au sommeil K."],
      ["usual", "light", "high", "large", "reduce", "Les soins habituels entraînent une forte diminution du bon sommeil par rapport aux séances de lumière vive programmées."],
      ["nap", "k", "moderate", "trivial", "increase", "Le programme de siestes n’entraîne probablement que peu ou pas de différence sur le bon sommeil par rapport à l’aide au sommeil K."],
    ],
  },
  ar: {
    outcome: "النوم الجيد",
    names: {
      light: { phrase: "جلسات الضوء الساطع المجدولة", number: "plural", gender: "feminine" },
      usual: { phrase: "الرعاية المعتادة", number: "singular", gender: "feminine" },
      k: { phrase: "المساعد على النوم K", number: "singular", gender: "masculine" },
      nap: { phrase: "جدول القيلولة", number: "singular", gender: "masculine" },
      latin: { phrase: "Compound K", number: "singular", gender: "masculine" },
    },
    sentences: [
      ["light", "usual", "high", "moderate", "increase", "تزيد جلسات الضوء الساطع المجدولة النوم الجيد مقارنةً بالرعاية المعتادة."],
      ["usual", "nap", "moderate", "large", "increase", "يُرجَّح أن تؤدي الرعاية المعتادة إلى زيادة كبيرة في النوم الجيد مقارنةً بجدول القيلولة."],
      ["nap", "usual", "low", "moderate", "reduce", "قد يخفّض جدول القيلولة النوم الجيد مقارنةً بالرعاية المعتادة."],
      ["light", "usual", "moderate", "unclear", "increase", "يُحتمل ألّا تُظهر جلسات الضوء الساطع المجدولة فرقًا واضحًا في النوم الجيد مقارنةً بالرعاية المعتادة."],
      ["usual", "nap", "very_low", "moderate", "increase", "الأدلة غير مؤكدة إلى حد كبير بشأن أثر الرعاية المعتادة في النوم الجيد مقارنةً بجدول القيلولة."],
      ["k", "usual", "high", "small", "reduce", "يخفّض المساعد على النوم K النوم الجيد قليلًا مقارنةً بالرعاية المعتادة."],
      ["usual", "k", "low", "large", "increase", "قد تؤدي الرعاية المعتادة إلى زيادة كبيرة في النوم الجيد مقارنةً بالمساعد على النوم K."],
      ["light", "nap", "high", "unclear", "reduce", "لا تُظهر جلسات الضوء الساطع المجدولة فرقًا واضحًا في النوم الجيد مقارنةً بجدول القيلولة."],
      ["k", "usual", "moderate", "moderate", "increase", "يُحتمل أن يزيد المساعد على النوم K النوم الجيد مقارنةً بالرعاية المعتادة."],
      ["nap", "k", "low", "unclear", "increase", "قد لا يُظهر جدول القيلولة فرقًا واضحًا في النوم الجيد مقارنةً بالمساعد على النوم K."],
      ["usual", "light", "high", "large", "reduce", "تؤدي الرعاية المعتادة إلى انخفاض كبير في النوم الجيد مقارنةً بجلسات الضوء الساطع المجدولة."],
      ["light", "k", "moderate", "trivial", "increase", "يُحتمل أن تؤدي جلسات الضوء الساطع المجدولة إلى فرق ضئيل أو لا فرق في النوم الجيد مقارنةً بالمساعد على النوم K."],
      ["nap", "latin", "low", "moderate", "reduce", "قد يخفّض جدول القيلولة النوم الجيد مقارنةً بـCompound K."],
    ],
  },
};

describe.each(Object.keys(cases) as Locale[])("statements with real names in %s", (locale) => {
  const { outcome, names, sentences } = cases[locale];
  it.each(sentences.map((c) => [c[5], c] as const))("%s", (_, c) => {
    expect(rendered(locale, names, outcome, c)).toBe(c[5]);
  });
});

describe("contractions only where a preposition meets an article", () => {
  it("leaves other words alone", () => {
    const parts = (before: string, name: string) => joinParts("fr", [{ text: before, name: false }, { text: name, name: true }]).map((p) => p.text).join("");
    expect(parts("par rapport à ", "l’aide")).toBe("Par rapport à l’aide");
    expect(parts("plus de ", "sommeil")).toBe("Plus de sommeil");
    expect(parts("l’effet de ", "les soins")).toBe("L’effet des soins");
  });
});

describe("each treatment's grammar in a language (server/core/languages/translation.ts, versionGrammar)", () => {
  const snapshot = {
    treatments: [
      { label: "usual", displayName: "Usual care", phrase: "usual care", number: "singular" },
      { label: "light", displayName: "Timed bright-light sessions", number: "plural" },
      { label: "k", displayName: "Sleep aid K" },
    ],
  } as unknown as VersionSnapshot;

  it("in English: the analyst's phrase and number, else the display name inside a sentence", () => {
    const grammar = versionGrammar(snapshot, "en", null);
    expect(grammar("usual")).toEqual({ phrase: "usual care", number: "singular", gender: "masculine" });
    expect(grammar("light")).toEqual({ phrase: "timed bright-light sessions", number: "plural", gender: "masculine" });
    expect(grammar("k")).toEqual({ phrase: "sleep aid K", number: "singular", gender: "masculine" });
  });

  it("in a translation: the translator's phrase and choice, else the translated name and the source's number", () => {
    const grammar = versionGrammar(snapshot, "fr", {
      "treatment:usual": "Soins habituels",
      "treatmentPhrase:usual": "les soins habituels",
      "treatmentGrammar:usual": "masculine plural",
      "treatment:light": "Séances de lumière",
      "treatmentGrammar:light": "feminine plural",
      "treatment:k": "Aide au sommeil K",
      "treatmentGrammar:k": "neuter dual",
    });
    expect(grammar("usual")).toEqual({ phrase: "les soins habituels", number: "plural", gender: "masculine" });
    expect(grammar("light")).toEqual({ phrase: "séances de lumière", number: "plural", gender: "feminine" });
    // A choice the desk does not offer reads as the default.
    expect(grammar("k")).toEqual({ phrase: "aide au sommeil K", number: "singular", gender: "masculine" });
  });
});

describe("an outcome's unit in a translation", () => {
  it("is a field of its own, and the page reads the translated unit", () => {
    const outcome = { name: "Sleepiness", unit: "points", readings: [], groups: [] };
    const translated = translatedSnapshot(
      { brief: { title: "T", condition: "C", population: "P", topic: "S" }, treatments: [], texts: { shortTakeHtml: "", laySummaryHtml: "" }, note: null, outcomes: [outcome] } as unknown as VersionSnapshot,
      { "unit:0": "puntos" },
    );
    expect(translated.outcomes[0]!.unit).toBe("puntos");
  });
});
