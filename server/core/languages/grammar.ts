// Real names inside generated sentences, grammatically (PRODUCT.md: statements in four languages):
// each treatment has, per language, the phrase a sentence uses ("usual care", "les soins habituels"),
// a grammatical number and, where the language marks it, a gender. Templates agree through i18next
// contexts (`_plural`, `_feminine`); a preposition meeting an article contracts ("à les" → "aux",
// "de el" → "del", "بـال" → "بال"); a sentence starts with a capital. Pure.
import type { Locale } from "./locales";
import type { VersionSnapshot } from "../snapshot/schema";

export const grammaticalNumbers = ["singular", "plural"] as const;
export type GrammaticalNumber = (typeof grammaticalNumbers)[number];
export const genders = ["masculine", "feminine"] as const;
export type Gender = (typeof genders)[number];

/** A translator's choice of gender and number, as the translation's grammar field stores it ("feminine plural"). */
export const grammarChoices = genders.flatMap((gender) => grammaticalNumbers.map((number) => `${gender} ${number}`));

export interface TreatmentGrammar {
  /** How a sentence names it: with its article where the language needs one. */
  phrase: string;
  number: GrammaticalNumber;
  gender: Gender;
}

/**
 * The context a statement's template takes for its subject. English, Spanish and French verbs agree
 * in number; an Arabic verb before its subject agrees in gender, and a plural of things takes the
 * feminine singular, so both read "feminine" there.
 */
export function agreement(locale: Locale, grammar: Pick<TreatmentGrammar, "number" | "gender">): "plural" | "feminine" | undefined {
  if (locale === "ar") return grammar.gender === "feminine" || grammar.number === "plural" ? "feminine" : undefined;
  return grammar.number === "plural" ? "plural" : undefined;
}

/** "Good sleep" reads "good sleep" inside a sentence; "HbA1c", "IL-6" and "Compound K" keep their capitals where the second letter is not lower case. */
export function inSentence(name: string, locale: Locale): string {
  return /^\p{Lu}\p{Ll}/u.test(name) ? name[0]!.toLocaleLowerCase(locale) + name.slice(1) : name;
}

/** [preposition at the end of the text before, article at the start of the name, the two contracted]. */
const contractions: Partial<Record<Locale, [RegExp, RegExp, string][]>> = {
  fr: [
    [/(^|\s)à $/, /^les /, "aux "],
    [/(^|\s)à $/, /^le /, "au "],
    [/(^|\s)de $/, /^les /, "des "],
    [/(^|\s)de $/, /^le /, "du "],
  ],
  es: [
    [/(^|\s)a $/, /^el /, "al "],
    [/(^|\s)de $/, /^el /, "del "],
  ],
  // The attached preposition keeps its joining stroke only before a name in another script:
  // بـ + الرعاية → بالرعاية, بـ + جدول → بجدول, but بـCompound K.
  ar: [[/بـ$/, /^(?=\p{Script=Arabic})/u, "ب"]],
};

/**
 * A sentence made of template text and names: each preposition that meets a name's article is
 * contracted with it, and the first letter is a capital. The parts are changed, never merged, so that
 * names can still be isolated for bidirectional text.
 */
export function joinParts(locale: Locale, parts: { text: string; name: boolean }[]): { text: string; name: boolean }[] {
  const out = parts.map((part) => ({ ...part }));
  for (let i = 1; i < out.length; i++) {
    if (!out[i]!.name || out[i - 1]!.name) continue;
    for (const [before, article, contracted] of contractions[locale] ?? []) {
      const match = before.exec(out[i - 1]!.text);
      if (!match || !article.test(out[i]!.text)) continue;
      out[i - 1]!.text = out[i - 1]!.text.slice(0, match.index) + (match[1] ?? "") + contracted;
      out[i]!.text = out[i]!.text.replace(article, "");
      break;
    }
  }
  const first = out.find((part) => part.text !== "");
  if (first) first.text = first.text.charAt(0).toLocaleUpperCase(locale) + first.text.slice(1);
  return out.filter((part) => part.text !== "");
}

/**
 * The version with its statements and group labels naming treatments by their phrases, and each
 * statement's template agreeing with its subject. The frozen facts are untouched: a reading knows its
 * treatment and comparator by label, so the words can be chosen for any language when it is read.
 */
export function grammaticalSnapshot(snapshot: VersionSnapshot, locale: Locale, grammarOf: (label: string) => TreatmentGrammar): VersionSnapshot {
  return {
    ...snapshot,
    outcomes: snapshot.outcomes.map((outcome) => ({
      ...outcome,
      groups: outcome.groups.map((group) =>
        "reference" in group.label.values ? { ...group, label: { ...group.label, values: { ...group.label.values, reference: grammarOf(outcome.settings.reference).phrase } } } : group,
      ),
      readings: outcome.readings.map((reading) => {
        if (!reading.statement) return reading;
        const subject = grammarOf(reading.treatment);
        const context = agreement(locale, subject);
        const values = { ...reading.statement.values, treatment: subject.phrase, comparator: grammarOf(reading.comparator).phrase };
        return { ...reading, statement: { ...reading.statement, values: context ? { ...values, context } : values } };
      }),
    })),
  };
}
