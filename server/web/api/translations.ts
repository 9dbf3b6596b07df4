// The translation desk's API: the queue of versions per language, one version's translation beside
// its source, saving, marking ready and (editors only) publishing. A translator works only in the
// languages assigned to them; editors in all. The frozen snapshot is never written.
import { Router, type Response } from "express";

import { isTranslationLocale, translationLocales, type TranslationLocale } from "#core/languages/locales";
import type { Database } from "#db/client";
import { translationQueue } from "#db/translations";
import { markTranslationReady, publishTranslationOf, readTranslationView, saveTranslationDraft } from "#workflows/translations";
import { handle } from "./handle";
import { sendError } from "../http/errors";

/** The languages this person may translate: all for editors, their assigned ones for translators. */
export function translatableLocales(person: Express.User): TranslationLocale[] {
  if (person.roles.includes("editor")) return [...translationLocales];
  return person.translationLocales.filter(isTranslationLocale);
}

export function translationRoutes(db: Database): Router {
  const router = Router();

  /** The locale of the address (the route table admits only translation languages), if this person may work in it; otherwise the answer is sent and null returned. */
  function allowedLocale(req: { params: { locale: TranslationLocale }; user?: Express.User }, res: Response): TranslationLocale | null {
    const { locale } = req.params;
    if (!translatableLocales(req.user!).includes(locale)) {
      sendError(res, 403, { key: "errors.translation.locale", message: `You are not assigned to translate into ${new Intl.DisplayNames(["en"], { type: "language" }).of(locale)}: ask an administrator.`, details: { locale } });
      return null;
    }
    return locale;
  }

  handle(router, "GET /api/translations", async (req, res) => {
    const locales = translatableLocales(req.user!);
    res.json({ locales, versions: await translationQueue(db, locales) });
  });

  handle(router, "GET /api/translations/:versionId/:locale", async (req, res) => {
    const locale = allowedLocale(req, res);
    if (!locale) return;
    const view = await readTranslationView(db, req.user!, req.params.versionId, locale);
    if (!view) return sendError(res, 404, { key: "errors.notFound", message: "There is no such version." });
    res.json({ translation: view });
  });

  handle(router, "PUT /api/translations/:versionId/:locale", async (req, res) => {
    const locale = allowedLocale(req, res);
    if (!locale) return;
    const { fields } = req.body;
    const outcome = await saveTranslationDraft(db, req.user!, req.params.versionId, locale, fields);
    if (!outcome.ok) return sendError(res, 404, { key: "errors.notFound", message: "There is no such version." });
    res.json({ translation: outcome.view });
  });

  handle(router, "POST /api/translations/:versionId/:locale/ready", async (req, res) => {
    const locale = allowedLocale(req, res);
    if (!locale) return;
    const outcome = await markTranslationReady(db, req.user!, req.params.versionId, locale);
    if (outcome.ok) return res.json({ translation: outcome.view });
    if (outcome.reason === "unfinished") {
      const details = [...outcome.empty.map((field) => ({ field, message: "empty" })), ...outcome.stale.map((field) => ({ field, message: "source changed" }))];
      return sendError(res, 409, { key: "errors.translation.unfinished", message: `Not ready: ${details.map((d) => `${d.field} (${d.message})`).join(", ") || "save the translation first"}.`, details });
    }
    sendError(res, 404, { key: "errors.notFound", message: "There is no such version." });
  });

  handle(router, "POST /api/translations/:versionId/:locale/publish", async (req, res) => {
    const locale = allowedLocale(req, res);
    if (!locale) return;
    const outcome = await publishTranslationOf(db, req.user!, req.params.versionId, locale);
    if (outcome.ok) return res.json({ translation: outcome.view });
    if (outcome.reason === "not-ready") return sendError(res, 409, { key: "errors.translation.notReady", message: "Only a translation marked ready can be published." });
    sendError(res, 404, { key: "errors.notFound", message: "There is no such version." });
  });

  return router;
}
