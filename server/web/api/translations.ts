// The translation desk's API: the queue of versions per language, one version's translation beside
// its source, saving, marking ready and (editors only) publishing. A translator works only in the
// languages assigned to them; editors in all. The frozen snapshot is never written.
import { Router, type Request, type Response } from "express";
import type { z } from "zod";
import { isTranslationLocale, translationLocales, type TranslationLocale } from "#core/locales";
import { mayReadEmbargoed } from "#core/roles";
import type { Database } from "#db/client";
import { translationQueue } from "#db/translations";
import { markTranslationReady, publishTranslationOf, readTranslationView, saveTranslationDraft } from "#workflows/translations";
import { guard } from "../auth/require-role";
import { rejectMalformedId, sendError, validateBody } from "../http/errors";
import { saveTranslationBody } from "./contract";

/** The languages this person may translate: all for editors, their assigned ones for translators. */
export function translatableLocales(person: Express.User): TranslationLocale[] {
  if (person.roles.includes("editor")) return [...translationLocales];
  return person.translationLocales.filter(isTranslationLocale);
}

export function translationRoutes(db: Database): Router {
  const router = Router();
  router.param("versionId", rejectMalformedId);

  /** The locale of the address, if this person may work in it; otherwise the answer is sent and null returned. */
  function allowedLocale(req: Request, res: Response): TranslationLocale | null {
    const locale = String(req.params.locale);
    if (!isTranslationLocale(locale)) {
      sendError(res, 404, { key: "errors.notFound", message: `There is no translation language "${locale}": choose one of ${translationLocales.join(", ")}.` });
      return null;
    }
    if (!translatableLocales(req.user!).includes(locale)) {
      sendError(res, 403, { key: "errors.translation.locale", message: `You are not assigned to translate into ${locale}: ask an administrator.`, details: { locale } });
      return null;
    }
    return locale;
  }

  router.get("/translations", guard("GET /api/translations"), async (req, res) => {
    const locales = translatableLocales(req.user!);
    res.json({ locales, versions: await translationQueue(db, locales, mayReadEmbargoed(req.user!.roles)) });
  });

  router.get("/translations/:versionId/:locale", guard("GET /api/translations/:versionId/:locale"), async (req, res) => {
    const locale = allowedLocale(req, res);
    if (!locale) return;
    const view = await readTranslationView(db, req.user!, String(req.params.versionId), locale);
    if (!view) return sendError(res, 404, { key: "errors.notFound", message: "There is no such version." });
    res.json({ translation: view });
  });

  router.put("/translations/:versionId/:locale", guard("PUT /api/translations/:versionId/:locale"), validateBody(saveTranslationBody), async (req, res) => {
    const locale = allowedLocale(req, res);
    if (!locale) return;
    const { fields } = req.body as z.infer<typeof saveTranslationBody>;
    const outcome = await saveTranslationDraft(db, req.user!, String(req.params.versionId), locale, fields);
    if (!outcome.ok) return sendError(res, 404, { key: "errors.notFound", message: "There is no such version." });
    res.json({ translation: outcome.view });
  });

  router.post("/translations/:versionId/:locale/ready", guard("POST /api/translations/:versionId/:locale/ready"), async (req, res) => {
    const locale = allowedLocale(req, res);
    if (!locale) return;
    const outcome = await markTranslationReady(db, req.user!, String(req.params.versionId), locale);
    if (outcome.ok) return res.json({ translation: outcome.view });
    if (outcome.reason === "unfinished") {
      const details = [...outcome.empty.map((field) => ({ field, message: "empty" })), ...outcome.stale.map((field) => ({ field, message: "source changed" }))];
      return sendError(res, 409, { key: "errors.translation.unfinished", message: `Not ready: ${details.map((d) => `${d.field} (${d.message})`).join(", ") || "save the translation first"}.`, details });
    }
    sendError(res, 404, { key: "errors.notFound", message: "There is no such version." });
  });

  router.post("/translations/:versionId/:locale/publish", guard("POST /api/translations/:versionId/:locale/publish"), async (req, res) => {
    const locale = allowedLocale(req, res);
    if (!locale) return;
    const outcome = await publishTranslationOf(db, req.user!, String(req.params.versionId), locale);
    if (outcome.ok) return res.json({ translation: outcome.view });
    if (outcome.reason === "not-ready") return sendError(res, 409, { key: "errors.translation.notReady", message: "Only a translation marked ready can be published." });
    sendError(res, 404, { key: "errors.notFound", message: "There is no such version." });
  });

  return router;
}
