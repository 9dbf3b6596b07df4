// A plain-language check of an editor's or translator's text: a reading-ease figure for its
// language, its longest sentences, and the terms lay readers trip on with a plainer phrasing.
// Advice only: nothing is ever refused because of it. Pure (runs in the desk, in the browser).
//
// Formulas (each named in the interface and in docs/methods.md):
// - English: Flesch Reading Ease (Flesch R, A new readability yardstick, J Appl Psychol 1948;32:221–233),
//   206.835 − 1.015·(words/sentences) − 84.6·(syllables/words), by the `flesch` package; syllables by
//   the `syllable` package.
// - Spanish: Szigriszt-Pazos perspicuity (Szigriszt Pazos F, Sistemas predictivos de legibilidad del
//   mensaje escrito: fórmula de perspicuidad, doctoral thesis, Universidad Complutense de Madrid, 1993),
//   206.835 − 62.3·(syllables/words) − (words/sentences), read on the INFLESZ scale (Barrio-Cantalejo
//   IM et al., An Sist Sanit Navar 2008;31:135–152).
// - French: Kandel & Moles (Kandel L, Moles A, Application de l’indice de Flesch à la langue française,
//   Cahiers Études de Radio-Télévision 1958;19:253–274), 207 − 1.015·(words/sentences) − 73.6·(syllables/words).
// - Arabic: no standard formula is used.
// Spanish and French syllables are counted by vowel groups (common practice; an approximation).
import { flesch } from "flesch";
import { syllable } from "syllable";
import type { Locale } from "../languages/locales";

export type ReadabilityFormula = "flesch" | "szigriszt-pazos" | "kandel-moles";

export interface Counts {
  sentences: number;
  words: number;
  syllables: number;
}

/** A sentence longer than this is pointed out (common practice in plain-language guidance: 20 to 25 words). */
export const longSentenceWords = 25;

const formulaOf: Record<Locale, ReadabilityFormula | null> = { en: "flesch", es: "szigriszt-pazos", fr: "kandel-moles", ar: null };

export function readingEase(formula: ReadabilityFormula, counts: Counts): number {
  const wordsPerSentence = counts.words / counts.sentences;
  const syllablesPerWord = counts.syllables / counts.words;
  switch (formula) {
    case "flesch":
      return flesch({ sentence: counts.sentences, word: counts.words, syllable: counts.syllables });
    case "szigriszt-pazos":
      return 206.835 - 62.3 * syllablesPerWord - wordsPerSentence;
    case "kandel-moles":
      return 207 - 1.015 * wordsPerSentence - 73.6 * syllablesPerWord;
  }
}

/**
 * The band of a figure, from easiest to hardest: Flesch's own table (1948) for English and French
 * (Kandel & Moles kept his scale), the INFLESZ scale for Spanish.
 */
export function easeBand(formula: ReadabilityFormula, score: number): "veryEasy" | "easy" | "fairlyEasy" | "standard" | "fairlyDifficult" | "difficult" | "veryDifficult" {
  if (formula === "szigriszt-pazos") {
    return score > 80 ? "veryEasy" : score > 65 ? "fairlyEasy" : score > 55 ? "standard" : score > 40 ? "fairlyDifficult" : "veryDifficult";
  }
  return score >= 90 ? "veryEasy" : score >= 80 ? "easy" : score >= 70 ? "fairlyEasy" : score >= 60 ? "standard" : score >= 50 ? "fairlyDifficult" : score >= 30 ? "difficult" : "veryDifficult";
}

/** The words of Markdown as read: links by their text, no emphasis marks, headings or list bullets. */
export function plainText(markdown: string): string {
  return markdown
    .replace(/!?\[([^\]]*)\]\([^)]*\)/g, "$1")
    .replace(/[*_`>#]+/g, " ")
    .replace(/^\s*(?:[-+]|\d+[.)])\s+/gm, "");
}

/** Sentences end at . ! ? … (followed by a space or the end) and at the end of a line: list items and headings are sentences of their own. */
export function sentencesOf(text: string): string[] {
  return plainText(text)
    .split(/(?<=[.!?…؟])\s+|\n+/)
    .map((s) => s.trim())
    .filter((s) => /[\p{L}\p{N}]/u.test(s));
}

export const wordsOf = (sentence: string) => sentence.match(/[\p{L}\p{N}]+(?:['’][\p{L}]+)*/gu) ?? [];

/** Vowel groups, for Spanish and French (common practice; a silent final e in French is not a syllable). */
function vowelGroups(word: string, locale: "es" | "fr"): number {
  const lower = word.toLowerCase();
  const vowels = locale === "es" ? /[aeiouáéíóúü]+/g : /[aeiouyàâäéèêëîïôöûùüÿœæ]+/g;
  let count = lower.match(vowels)?.length ?? 0;
  if (locale === "fr" && count > 1 && /[^aeiouy]e(s)?$/.test(lower)) count -= 1;
  // Spanish hiatus: two strong vowels side by side are two syllables.
  if (locale === "es") count += lower.match(/[aeoáéó](?=[aeoáéó])/g)?.length ?? 0;
  return Math.max(1, count);
}

export function syllablesOf(word: string, locale: Locale): number {
  if (/^\p{N}+$/u.test(word)) return 1;
  return locale === "es" || locale === "fr" ? vowelGroups(word, locale) : syllable(word) || 1;
}

export function countsOf(text: string, locale: Locale): Counts {
  return countsOfSentences(sentencesOf(text), locale);
}

function countsOfSentences(sentences: string[], locale: Locale): Counts {
  const words = sentences.flatMap(wordsOf);
  return { sentences: sentences.length, words: words.length, syllables: words.reduce((sum, w) => sum + syllablesOf(w, locale), 0) };
}

/** Terms a lay reader trips on, with a plainer phrasing (our own list, from plain-language guidance on health writing). */
export const jargon: Record<Locale, { term: string; plain: string }[]> = {
  en: [
    { term: "statistically significant", plain: "unlikely to be due to chance alone" },
    { term: "confidence interval", plain: "a range worked out from the data; 95 of every 100 ranges worked out this way contain the true effect" },
    { term: "odds ratio", plain: "how much more or less likely" },
    { term: "risk ratio", plain: "how much more or less likely" },
    { term: "relative risk", plain: "how much more or less likely" },
    { term: "SUCRA", plain: "a rank score (it does not prove a winner)" },
    { term: "P-score", plain: "a rank score (it does not prove a winner)" },
    { term: "network meta-analysis", plain: "a study that combines trials comparing several treatments" },
    { term: "heterogeneity", plain: "differences between the trials' results" },
    { term: "efficacy", plain: "how well it works" },
    { term: "placebo", plain: "a dummy treatment" },
    { term: "randomised controlled trial", plain: "a trial in which chance decides who gets which treatment" },
    { term: "adverse event", plain: "harm or side effect" },
  ],
  es: [
    { term: "estadísticamente significativo", plain: "poco probable que se deba solo al azar" },
    { term: "intervalo de confianza", plain: "un margen calculado a partir de los datos; 95 de cada 100 márgenes calculados así contienen el efecto real" },
    { term: "odds ratio", plain: "cuánto más o menos probable" },
    { term: "razón de momios", plain: "cuánto más o menos probable" },
    { term: "riesgo relativo", plain: "cuánto más o menos probable" },
    { term: "SUCRA", plain: "una puntuación de rango (no demuestra un ganador)" },
    { term: "metaanálisis en red", plain: "un estudio que combina ensayos que comparan varios tratamientos" },
    { term: "heterogeneidad", plain: "diferencias entre los resultados de los ensayos" },
    { term: "eficacia", plain: "lo bien que funciona" },
    { term: "placebo", plain: "un tratamiento simulado" },
    { term: "ensayo controlado aleatorizado", plain: "un ensayo en el que el azar decide quién recibe cada tratamiento" },
  ],
  fr: [
    { term: "statistiquement significatif", plain: "peu probablement dû au seul hasard" },
    { term: "intervalle de confiance", plain: "une fourchette calculée à partir des données ; 95 sur 100 des fourchettes calculées ainsi contiennent l’effet réel" },
    { term: "rapport de cotes", plain: "combien plus ou moins probable" },
    { term: "odds ratio", plain: "combien plus ou moins probable" },
    { term: "risque relatif", plain: "combien plus ou moins probable" },
    { term: "SUCRA", plain: "un score de rang (il ne prouve pas un gagnant)" },
    { term: "méta-analyse en réseau", plain: "une étude qui combine des essais comparant plusieurs traitements" },
    { term: "hétérogénéité", plain: "des différences entre les résultats des essais" },
    { term: "efficacité", plain: "à quel point cela marche" },
    { term: "placebo", plain: "un traitement factice" },
    { term: "essai contrôlé randomisé", plain: "un essai où le hasard décide qui reçoit quel traitement" },
  ],
  ar: [
    { term: "ذو دلالة إحصائية", plain: "من غير المرجح أن يكون بالصدفة وحدها" },
    { term: "فترة الثقة", plain: "مدى محسوب من البيانات؛ 95 من كل 100 مدى يُحسب بهذه الطريقة تحتوي على الأثر الحقيقي" },
    { term: "نسبة الأرجحية", plain: "كم هو أكثر أو أقل احتمالًا" },
    { term: "الخطر النسبي", plain: "كم هو أكثر أو أقل احتمالًا" },
    { term: "نسبة الخطر", plain: "كم هو أكثر أو أقل احتمالًا" },
    { term: "SUCRA", plain: "درجة ترتيب (لا تثبت وجود فائز)" },
    { term: "التحليل التلوي الشبكي", plain: "دراسة تجمع تجارب تقارن عدة علاجات" },
    { term: "عدم التجانس", plain: "الاختلافات بين نتائج التجارب" },
    { term: "العلاج الوهمي", plain: "علاج صوري" },
    { term: "تجربة معشاة ذات شواهد", plain: "تجربة تحدد فيها الصدفة من يتلقى كل علاج" },
  ],
};

export interface ReadabilityReport {
  formula: ReadabilityFormula | null;
  /** Null when the language has no formula or the text has no words. */
  score: number | null;
  band: ReturnType<typeof easeBand> | null;
  counts: Counts;
  /** The sentences over `longSentenceWords` words, longest first (at most three). */
  longest: { sentence: string; words: number }[];
  jargon: { term: string; plain: string }[];
}

export function readability(markdown: string, locale: Locale): ReadabilityReport {
  const sentences = sentencesOf(markdown);
  const counts = countsOfSentences(sentences, locale);
  const formula = formulaOf[locale];
  const score = formula && counts.words > 0 ? readingEase(formula, counts) : null;
  const longest = sentences
    .map((sentence) => ({ sentence, words: wordsOf(sentence).length }))
    .filter((s) => s.words > longSentenceWords)
    .sort((a, b) => b.words - a.words)
    .slice(0, 3);
  const lower = markdown.toLowerCase();
  return {
    formula,
    score,
    band: formula && score !== null ? easeBand(formula, score) : null,
    counts,
    longest,
    jargon: jargon[locale].filter((entry) => lower.includes(entry.term.toLowerCase())),
  };
}
