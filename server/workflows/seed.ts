// Demo content for a local cluster. Only scripts/start.ts and the test set-up call this, and
// only against the cluster they manage: a server given an outside DATABASE_URL never seeds.
import { assessCertainty } from "#core/grade/assess";
import type { Role } from "#core/access/roles";
import { createBrief, findBriefByTitle, nameTreatments, updateBrief } from "#db/briefs";
import type { Database } from "#db/client";
import { saveJudgement } from "#db/judgements";
import { createOutcome } from "#db/outcomes";
import { ensurePerson, updatePerson, type Person } from "#db/people";
import { storeDataset } from "./analysis";
import { demoBriefs } from "./demo-briefs";
import { publishVersion } from "./publish";
import { reviewBrief } from "./review";
import { demoTranslations } from "./demo-translations";
import { markTranslationReady, publishTranslationOf, saveTranslationDraft } from "./translations";
import { translationLocales } from "#core/languages/locales";
import { newestVersionId, readTranslation } from "#db/translations";

export const demoPassword = "fairweigh-demo";

export const demoAccounts: { email: string; displayName: string; roles: Role[]; translationLocales?: string[] }[] = [
  { email: "admin@fairweigh.example", displayName: "Demo administrator", roles: ["admin"] },
  { email: "analyst@fairweigh.example", displayName: "Demo analyst", roles: ["analyst"] },
  { email: "editor@fairweigh.example", displayName: "Demo editor", roles: ["editor"] },
  { email: "translator@fairweigh.example", displayName: "Demo translator", roles: ["translator"], translationLocales: ["es", "fr"] },
  { email: "press@fairweigh.example", displayName: "Demo reporter", roles: ["press"] },
];

/** Idempotent: accounts and briefs that exist already are left as they are. */
export async function seedDemo(db: Database): Promise<void> {
  const people: Person[] = [];
  for (const account of demoAccounts) {
    let person = await ensurePerson(db, { ...account, password: demoPassword }, null);
    // A demo translator made before translators had languages gets theirs.
    if (account.translationLocales && person.translationLocales.length === 0) {
      person = (await db.transaction((tx) => updatePerson(tx, person.id, { translationLocales: account.translationLocales }, person.id))) ?? person;
    }
    people.push(person);
  }
  const analyst = people.find((p) => p.roles.includes("analyst"))!;
  const editor = people.find((p) => p.roles.includes("editor"))!;
  for (const [index, demo] of demoBriefs().entries()) {
    const brief = (await findBriefByTitle(db, demo.title)) ?? (await publishDemoBrief(db, demo, analyst.id, editor.id));
    await translateDemoBrief(db, brief.id, demoTranslations[index]!, editor);
  }
}

/** Each language of a demonstration brief not yet translated goes the translator's way: saved, ready, published. */
async function translateDemoBrief(db: Database, briefId: string, texts: (typeof demoTranslations)[number], editor: Person) {
  const versionId = await newestVersionId(db, briefId);
  if (!versionId) return;
  for (const locale of translationLocales) {
    if (await readTranslation(db, versionId, locale)) continue;
    const steps = [
      await saveTranslationDraft(db, editor, versionId, locale, texts[locale]),
      await markTranslationReady(db, editor, versionId, locale),
      await publishTranslationOf(db, editor, versionId, locale),
    ];
    const refused = steps.find((step) => !step.ok);
    if (refused && !refused.ok) throw new Error(`the demo translation into ${locale} could not be published: ${JSON.stringify(refused)}`);
  }
}

/**
 * Goes the way a real brief goes: an analyst creates it, uploads the data and records certainty
 * (every computed suggestion confirmed, the invented risk of bias included, and no other domain rated down: a demonstration, not an appraisal);
 * an editor writes its texts; the analyst submits it for review; the editor approves and publishes it.
 */
async function publishDemoBrief(db: Database, demo: ReturnType<typeof demoBriefs>[number], analystId: string, editorId: string) {
  const brief = await createBrief(db, { title: demo.title, topic: demo.topic, condition: demo.condition, population: demo.population, demo: true }, analystId);
  for (const spec of demo.outcomes) {
    const outcome = await createOutcome(
      db,
      brief.id,
      {
        name: spec.name,
        kind: spec.kind,
        measure: spec.measure,
        model: "random",
        referenceTreatment: spec.reference,
        direction: spec.direction,
        baselineRisk: spec.baselineRisk,
        unit: spec.unit,
        thresholdSmall: spec.thresholds.small,
        thresholdModerate: spec.thresholds.moderate,
        thresholdLarge: spec.thresholds.large,
      },
      analystId,
    );
    const format = spec.kind === "binary" ? "arm-binary" : "arm-continuous";
    const { result } = await storeDataset(db, outcome, { name: "fictional-demo.csv", bytes: Buffer.from(spec.csv) }, format, analystId);
    const none = { levels: 0 as const, reason: "" };
    for (const comparison of assessCertainty(result, new Map(), spec.thresholds, spec.baselineRisk)) {
      await saveJudgement(
        db,
        { outcomeId: outcome.id, treatment: comparison.treatment, comparator: comparison.comparator },
        {
          ...(comparison.pending.includes("direct")
            ? { direct: { riskOfBias: { levels: (comparison.suggestions.riskOfBias?.levels ?? 0) as 0 | 1 | 2, reason: "" }, inconsistency: none, indirectness: none, publicationBias: none } }
            : {}),
          ...(comparison.pending.includes("indirect") && !comparison.indirectVia ? { indirectRating: { rating: "low" as const, reason: "Fictional demonstration: no first-order loop." } } : {}),
          incoherence: { levels: comparison.suggestions.incoherence.levels, reason: "" },
          imprecision: { levels: comparison.suggestions.imprecision.levels, reason: "" },
        },
        analystId,
      );
    }
  }
  await nameTreatments(db, brief.id, demo.treatmentNames, analystId, demo.treatmentGrammar);
  const texts = await updateBrief(db, brief.id, brief.rowVersion, { laySummary: demo.laySummary, shortTake: demo.shortTake }, editorId);
  if (!texts.ok) throw new Error(`the demo brief "${demo.title}" could not take its texts`);
  const steps = [
    await reviewBrief(db, brief.id, { decision: "submitted" }, analystId),
    await reviewBrief(db, brief.id, { decision: "approved", comment: "Fictional demonstration: approved by the demo editor.", acknowledgeWarnings: true }, editorId),
    await publishVersion(db, brief.id, {}, editorId, null),
  ];
  const refused = steps.find((step) => !step.ok);
  if (refused && !refused.ok) throw new Error(`the demo brief "${demo.title}" could not be published: ${refused.detail}`);
  return brief;
}
