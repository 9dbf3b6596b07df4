// The demonstration briefs in Spanish, French and Arabic: our own translations of the invented
// English texts in ./demo-briefs.ts, labelled fictional in each language like the originals. Field
// names are those of server/core/languages/translation.ts; a treatment is named by its label in the data.
import type { TranslationLocale } from "#core/languages/locales";

type Texts = Record<string, string>;

const sleep: Record<TranslationLocale, Texts> = {
  es: {
    topic: "Sueño",
    title: "Dormir bien después del turno de noche (demostración ficticia)",
    condition: "Mal sueño tras el trabajo nocturno",
    population: "Adultos que trabajan en turno de noche",
    summary: `*Este resumen usa datos inventados para mostrar cómo presenta Fairweigh un metaanálisis en red. No describe ningún estudio, persona ni producto reales.*

Quienes trabajan de noche suelen dormir mal durante el día. Este análisis ficticio reúne 15 ensayos inventados sobre cinco formas de ayudar —sesiones de luz intensa, un plan de siestas, dos ayudas para dormir y sesiones de luz combinadas con siestas— y compara cada una con la atención habitual y entre sí, incluso donde ningún ensayo las comparó directamente.

Los grupos de abajo dicen qué opciones respalda la evidencia y con qué seguridad. No son una clasificación: las opciones de un mismo grupo pueden no diferir entre sí en absoluto.`,
    shortTake: `- La ayuda para dormir K probablemente da un beneficio grande para el buen sueño en comparación con la atención habitual, y las sesiones de luz brillante programadas probablemente uno moderado (certeza moderada).
- El plan de siestas y la ayuda para dormir M **podrían** ayudar un poco, pero la certeza es baja.
- Para las sesiones de luz con plan de siestas, la evidencia es muy incierta.
- Las puntuaciones que ponen opciones «primeras» o «últimas» no son una prueba: lea los grupos y la certeza.`,
    "outcome:0": "Buen sueño la mayoría de los días a las 4 semanas",
    "outcomePhrase:0": "el buen sueño la mayoría de los días a las 4 semanas",
    "outcome:1": "Puntuación de somnolencia diurna (0 a 100) a las 4 semanas",
    "outcomePhrase:1": "la puntuación de somnolencia diurna (0 a 100) a las 4 semanas",
    "unit:1": "puntos",
    "treatment:usual_care": "Atención habitual",
    "treatment:light": "Sesiones de luz intensa programadas",
    "treatment:nap_plan": "Plan de siestas",
    "treatment:drug_k": "Ayuda para dormir K (ficticia)",
    "treatment:drug_m": "Ayuda para dormir M (ficticia)",
    "treatment:combined": "Sesiones de luz con plan de siestas",
    ...grammar({
      usual_care: ["la atención habitual", "feminine singular"],
      light: ["las sesiones de luz intensa programadas", "feminine plural"],
      nap_plan: ["el plan de siestas", "masculine singular"],
      drug_k: ["la ayuda para dormir K", "feminine singular"],
      drug_m: ["la ayuda para dormir M", "feminine singular"],
      combined: ["las sesiones de luz con plan de siestas", "feminine plural"],
    }),
  },
  fr: {
    topic: "Sommeil",
    title: "Bien dormir après le travail de nuit (démonstration fictive)",
    condition: "Mauvais sommeil après le travail de nuit",
    population: "Adultes qui travaillent de nuit",
    summary: `*Cette synthèse utilise des données inventées pour montrer comment Fairweigh présente une méta-analyse en réseau. Aucune étude, personne ou produit réels n’y sont décrits.*

Les personnes qui travaillent de nuit dorment souvent mal le jour. Cette analyse fictive réunit 15 essais inventés portant sur cinq façons d’aider — des séances de lumière vive, un programme de siestes, deux aides au sommeil et des séances de lumière associées aux siestes — et compare chacune aux soins habituels et aux autres, même là où aucun essai ne les a comparées directement.

Les groupes ci-dessous disent quelles options les données probantes soutiennent, et avec quelle certitude. Ce n’est pas un classement : des options d’un même groupe peuvent ne pas différer du tout.`,
    shortTake: `- L’aide au sommeil K apporte probablement un grand bénéfice pour bien dormir par rapport aux soins habituels, et les séances de lumière vive programmées probablement un bénéfice modéré (certitude modérée).
- Le programme de siestes et l’aide au sommeil M **pourraient** aider un peu, mais la certitude est faible.
- Pour les séances de lumière avec programme de siestes, les données sont très incertaines.
- Les scores qui placent des options « premières » ou « dernières » ne prouvent rien : lisez plutôt les groupes et la certitude.`,
    "outcome:0": "Bon sommeil la plupart des jours à 4 semaines",
    "outcomePhrase:0": "le bon sommeil la plupart des jours à 4 semaines",
    "outcome:1": "Score de somnolence diurne (0 à 100) à 4 semaines",
    "outcomePhrase:1": "le score de somnolence diurne (0 à 100) à 4 semaines",
    "unit:1": "points",
    "treatment:usual_care": "Soins habituels",
    "treatment:light": "Séances de lumière vive programmées",
    "treatment:nap_plan": "Programme de siestes",
    "treatment:drug_k": "Aide au sommeil K (fictive)",
    "treatment:drug_m": "Aide au sommeil M (fictive)",
    "treatment:combined": "Séances de lumière avec programme de siestes",
    ...grammar({
      usual_care: ["les soins habituels", "masculine plural"],
      light: ["les séances de lumière vive programmées", "feminine plural"],
      nap_plan: ["le programme de siestes", "masculine singular"],
      drug_k: ["l’aide au sommeil K", "feminine singular"],
      drug_m: ["l’aide au sommeil M", "feminine singular"],
      combined: ["les séances de lumière avec programme de siestes", "feminine plural"],
    }),
  },
  ar: {
    topic: "النوم",
    title: "النوم الجيد بعد نوبات العمل الليلية (عرض توضيحي خيالي)",
    condition: "سوء النوم بعد العمل في النوبات الليلية",
    population: "البالغون الذين يعملون في نوبات ليلية",
    summary: `*يستخدم هذا الملخص بيانات مختلَقة لبيان كيف يعرض Fairweigh تحليلًا تلويًا شبكيًا. ولا يصف أي دراسة أو شخص أو منتج حقيقي.*

كثيرًا ما ينام العاملون في النوبات الليلية نومًا سيئًا في النهار. يجمع هذا التحليل الخيالي 15 تجربة مختلَقة لخمس طرق للمساعدة — جلسات الضوء الساطع، وجدول القيلولة، ومساعدان على النوم، وجلسات الضوء مع القيلولة — ويقارن كلًّا منها بالرعاية المعتادة وببعضها، حتى حيث لم تقارن أي تجربة بينها مباشرةً.

تبيّن المجموعات أدناه الخيارات التي تدعمها الأدلة ومدى يقيننا. وهي ليست ترتيبًا: فقد لا تختلف الخيارات في المجموعة الواحدة عن بعضها إطلاقًا.`,
    shortTake: `- يُحتمل أن يعطي المساعد على النوم K فائدة كبيرة للنوم الجيد مقارنةً بالرعاية المعتادة، وأن تعطي جلسات الضوء الساطع المجدولة فائدة متوسطة (يقين متوسط).
- **قد** يساعد جدول القيلولة والمساعد على النوم M قليلًا، لكن اليقين منخفض.
- أما جلسات الضوء مع جدول القيلولة، فالأدلة بشأنها غير مؤكدة إلى حد كبير.
- الدرجات التي تضع خيارات «أولًا» أو «أخيرًا» ليست دليلًا: اقرأ المجموعات ودرجة اليقين بدلًا منها.`,
    "outcome:0": "نوم جيد في معظم الأيام بعد 4 أسابيع",
    "outcomePhrase:0": "النوم الجيد في معظم الأيام بعد 4 أسابيع",
    "outcome:1": "درجة النعاس النهاري (من 0 إلى 100) بعد 4 أسابيع",
    "outcomePhrase:1": "درجة النعاس النهاري (من 0 إلى 100) بعد 4 أسابيع",
    "unit:1": "نقاط",
    "treatment:usual_care": "الرعاية المعتادة",
    "treatment:light": "جلسات ضوء ساطع في مواعيد محددة",
    "treatment:nap_plan": "جدول قيلولة",
    "treatment:drug_k": "المساعد على النوم K (خيالي)",
    "treatment:drug_m": "المساعد على النوم M (خيالي)",
    "treatment:combined": "جلسات الضوء مع جدول القيلولة",
    ...grammar({
      usual_care: ["الرعاية المعتادة", "feminine singular"],
      light: ["جلسات الضوء الساطع في مواعيد محددة", "feminine plural"],
      nap_plan: ["جدول القيلولة", "masculine singular"],
      drug_k: ["المساعد على النوم K", "masculine singular"],
      drug_m: ["المساعد على النوم M", "masculine singular"],
      combined: ["جلسات الضوء مع جدول القيلولة", "feminine plural"],
    }),
  },
};

/** How a sentence of the language names each treatment, and its gender and number (server/core/languages/grammar.ts). */
function grammar(byLabel: Record<string, [phrase: string, genderAndNumber: string]>): Texts {
  return Object.fromEntries(Object.entries(byLabel).flatMap(([label, [phrase, choice]]) => [[`treatmentPhrase:${label}`, phrase], [`treatmentGrammar:${label}`, choice]]));
}

/** The 21 fictional compounds and the inactive tablet, named in each language, with their phrases inside a sentence. */
function compounds(name: (letter: string) => string, inactive: string, phrase: (letter: string) => string, inactivePhrase: string, gender: string): Texts {
  const letters = Array.from({ length: 21 }, (_, i) => String.fromCharCode(97 + i));
  return {
    "treatment:inactive": inactive,
    ...Object.fromEntries(letters.map((l) => [`treatment:compound_${l}`, name(l.toUpperCase())])),
    ...grammar({ inactive: [inactivePhrase, "masculine singular"], ...Object.fromEntries(letters.map((l) => [`compound_${l}`, [phrase(l.toUpperCase()), gender]])) }),
  };
}

const headache: Record<TranslationLocale, Texts> = {
  es: {
    topic: "Cefalea",
    title: "Alivio de una cefalea tensional corriente: 22 opciones comparadas (demostración ficticia)",
    condition: "Cefalea tensional episódica",
    population: "Adultos con una cefalea tensional ocasional",
    summary: `*Este resumen usa datos inventados para mostrar cómo presenta Fairweigh una red grande. No describe ningún estudio, persona ni producto reales.*

Veintiún compuestos ficticios para una cefalea tensional corriente se comparan con un comprimido inactivo y entre sí. Con tantas opciones, una lista de «mejor» a «peor» sugeriría diferencias que la evidencia no muestra. Los grupos de abajo mantienen juntos los compuestos que la evidencia no puede distinguir.`,
    shortTake: `- Diez de los 21 compuestos ficticios probablemente dan un beneficio grande en comparación con el comprimido inactivo; otros nueve podrían dar uno menor, con certeza baja.
- Para los compuestos B y H, la evidencia es muy incierta.
- La mayoría de los compuestos no se pueden distinguir entre sí: caen en el mismo grupo.
- La puntuación de clasificación de un compuesto puede ser alta por azar; los grupos y su certeza dicen más.`,
    "outcome:0": "Sin dolor dos horas después de una dosis",
    "outcomePhrase:0": "la ausencia de dolor dos horas después de una dosis",
    ...compounds((l) => `Compuesto ${l} (ficticio)`, "Comprimido inactivo", (l) => `el compuesto ${l}`, "el comprimido inactivo", "masculine singular"),
  },
  fr: {
    topic: "Céphalée",
    title: "Soulager une céphalée de tension ordinaire : 22 options comparées (démonstration fictive)",
    condition: "Céphalée de tension épisodique",
    population: "Adultes ayant une céphalée de tension occasionnelle",
    summary: `*Cette synthèse utilise des données inventées pour montrer comment Fairweigh présente un grand réseau. Aucune étude, personne ou produit réels n’y sont décrits.*

Vingt et un composés fictifs contre une céphalée de tension ordinaire sont comparés à un comprimé inactif et entre eux. Avec autant d’options, une liste du « meilleur » au « pire » suggérerait des différences que les données probantes ne montrent pas. Les groupes ci-dessous réunissent les composés que les données ne permettent pas de distinguer.`,
    shortTake: `- Dix des 21 composés fictifs apportent probablement un grand bénéfice par rapport au comprimé inactif ; neuf autres pourraient en apporter un moindre, avec une certitude faible.
- Pour les composés B et H, les données sont très incertaines.
- La plupart des composés ne peuvent pas être distingués les uns des autres : ils tombent dans le même groupe.
- Le score de classement d’un composé peut être élevé par hasard ; les groupes et leur certitude en disent plus.`,
    "outcome:0": "Sans douleur deux heures après une dose",
    "outcomePhrase:0": "l’absence de douleur deux heures après une dose",
    ...compounds((l) => `Composé ${l} (fictif)`, "Comprimé inactif", (l) => `le composé ${l}`, "le comprimé inactif", "masculine singular"),
  },
  ar: {
    topic: "الصداع",
    title: "تخفيف صداع التوتر اليومي: مقارنة 22 خيارًا (عرض توضيحي خيالي)",
    condition: "صداع التوتر العرضي",
    population: "البالغون المصابون بصداع توتر عرضي",
    summary: `*يستخدم هذا الملخص بيانات مختلَقة لبيان كيف يعرض Fairweigh شبكة كبيرة. ولا يصف أي دراسة أو شخص أو منتج حقيقي.*

يُقارَن واحد وعشرون مركّبًا خياليًا لصداع التوتر اليومي بقرص غير فعّال وببعضها. ومع هذا العدد من الخيارات، توحي قائمة من «الأفضل» إلى «الأسوأ» بفروق لا تُظهرها الأدلة. وتجمع المجموعات أدناه المركّبات التي لا تستطيع الأدلة التمييز بينها.`,
    shortTake: `- يُحتمل أن تعطي عشرة من المركّبات الخيالية الـ21 فائدة كبيرة مقارنةً بالقرص غير الفعّال؛ وقد تعطي تسعة أخرى فائدة أصغر، بيقين منخفض.
- أما المركّبان B وH، فالأدلة بشأنهما غير مؤكدة إلى حد كبير.
- لا يمكن التمييز بين معظم المركّبات: فهي تقع في المجموعة نفسها.
- قد تكون درجة ترتيب مركّب ما مرتفعة بالصدفة؛ والمجموعات ودرجة يقينها أبلغ دلالة.`,
    "outcome:0": "الخلو من الألم بعد ساعتين من جرعة واحدة",
    "outcomePhrase:0": "الخلو من الألم بعد ساعتين من جرعة واحدة",
    ...compounds((l) => `المركّب ${l} (خيالي)`, "قرص غير فعّال", (l) => `المركّب ${l}`, "القرص غير الفعّال", "masculine singular"),
  },
};

/** The translations of each demonstration brief, in the order of demoBriefs(). */
export const demoTranslations: Record<TranslationLocale, Texts>[] = [sleep, headache];
