// An outcome's settings, data upload, result and certainty judgements.
import { Router } from "express";
import multer from "multer";
import { z } from "zod";
import { formatFitsOutcome, latestResult, rerunLatest, storeDataset } from "../analysis/run";
import { deskRoles } from "../auth/roles";
import { requireRole } from "../auth/require-role";
import { findOutcome, outcomePatch, updateOutcome, type OutcomeRow } from "../briefs/outcomes";
import type { Database } from "../db/client";
import { assessCertainty } from "../grade/assess";
import { judgementInput, loadJudgements, saveJudgement } from "../grade/judgements";
import { fieldIssues, rejectMalformedId, sendError, validateBody } from "../http/errors";
import type { AnalysisResult } from "../nma/analyse";
import { DatasetError, formats } from "../nma/types";

const maximumUploadBytes = 5 * 1024 * 1024;

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: maximumUploadBytes, files: 1, fields: 5 },
});

export function outcomeRoutes(db: Database): Router {
  const router = Router();
  router.param("id", rejectMalformedId);

  router.patch("/outcomes/:id", requireRole("analyst"), validateBody(outcomePatch), async (req, res) => {
    const { rowVersion, ...changes } = req.body as z.infer<typeof outcomePatch>;
    try {
      const update = await updateOutcome(db, String(req.params.id), rowVersion, changes, req.user!.id, rerunLatest);
      if (update.ok) return res.json({ outcome: update.outcome });
      if (update.reason === "not-found") return sendError(res, 404, { key: "errors.notFound", message: "There is no such outcome." });
      if (update.reason === "invalid") {
        return sendError(res, 400, { key: "errors.invalidRequest", message: "The changed outcome is not valid.", details: fieldIssues(update.error) });
      }
      sendError(res, 409, {
        key: "errors.conflict",
        message: `Someone else changed this outcome (now version ${update.current.rowVersion}, you edited version ${rowVersion}).`,
        details: { current: update.current },
      });
    } catch (error) {
      if (!(error instanceof DatasetError)) throw error;
      res.status(422).json({
        error: { key: "errors.outcome.notAnalysable", message: "The current data cannot be analysed with these settings; nothing was changed." },
        issues: error.issues,
      });
    }
  });

  router.put("/outcomes/:id/dataset", requireRole("analyst"), (req, res, next) => {
    upload.single("file")(req, res, (error: unknown) => {
      if (!error) return next();
      const tooLarge = error instanceof multer.MulterError && error.code === "LIMIT_FILE_SIZE";
      sendError(res, tooLarge ? 413 : 400, {
        key: tooLarge ? "errors.upload.tooLarge" : "errors.upload.invalid",
        message: tooLarge ? `The file is larger than ${maximumUploadBytes / 1024 / 1024} MiB.` : `The upload could not be read: ${(error as Error).message}`,
      });
    });
  }, async (req, res) => {
    const outcome = await findOutcome(db, String(req.params.id));
    if (!outcome) return sendError(res, 404, { key: "errors.notFound", message: "There is no such outcome." });
    const format = z.enum(formats).safeParse(req.body?.format);
    if (!format.success) {
      return sendError(res, 400, { key: "errors.upload.format", message: `Send the field format: one of ${formats.join(", ")}.`, details: [{ field: "format" }] });
    }
    if (!req.file) return sendError(res, 400, { key: "errors.upload.missing", message: "Send the CSV file in the multipart field file.", details: [{ field: "file" }] });
    if (!/\.csv$/i.test(req.file.originalname) && !/^text\/(csv|plain)$/.test(req.file.mimetype)) {
      return sendError(res, 415, { key: "errors.upload.notCsv", message: "Upload a CSV file (.csv)." });
    }
    if (!formatFitsOutcome(format.data, outcome)) {
      return sendError(res, 400, { key: "errors.upload.formatKind", message: `The ${format.data} format does not fit a ${outcome.kind} outcome.` });
    }
    try {
      const stored = await storeDataset(db, outcome, { name: req.file.originalname, bytes: req.file.buffer }, format.data, req.user!.id);
      res.json({
        valid: true,
        datasetId: stored.dataset.id,
        sha256: stored.dataset.sha256,
        studies: stored.result.studies,
        treatments: stored.result.treatments,
        excludedStudies: stored.result.excludedStudies,
        resultId: stored.resultId,
      });
    } catch (error) {
      if (!(error instanceof DatasetError)) throw error;
      res.status(422).json({
        valid: false,
        error: { key: "errors.upload.invalidData", message: "The file was not stored: correct the problems listed and upload it again." },
        issues: error.issues,
      });
    }
  });

  router.get("/outcomes/:id/result", requireRole(...deskRoles), async (req, res) => {
    const stored = await latestResult(db, String(req.params.id));
    if (!stored) return sendError(res, 404, { key: "errors.noResult", message: "This outcome has no analysis yet: upload its data first." });
    res.json(stored.result);
  });

  /** Certainty of every comparison of the outcome's latest result, with suggestions and what is pending. */
  async function certaintyOf(outcome: OutcomeRow) {
    const stored = await latestResult(db, outcome.id);
    if (!stored) return null;
    const thresholds = { small: outcome.thresholdSmall, moderate: outcome.thresholdModerate, large: outcome.thresholdLarge };
    return assessCertainty(stored.result as AnalysisResult, await loadJudgements(db, outcome.id), thresholds);
  }

  router.get("/outcomes/:id/certainty", requireRole(...deskRoles), async (req, res) => {
    const outcome = await findOutcome(db, String(req.params.id));
    const comparisons = outcome ? await certaintyOf(outcome) : null;
    if (!comparisons) return sendError(res, 404, { key: "errors.noResult", message: "This outcome has no analysis yet: upload its data first." });
    res.json({ comparisons });
  });

  router.put("/outcomes/:id/certainty/:treatment/:comparator", requireRole("analyst"), validateBody(judgementInput), async (req, res) => {
    const outcome = await findOutcome(db, String(req.params.id));
    const before = outcome ? await certaintyOf(outcome) : null;
    if (!outcome || !before) return sendError(res, 404, { key: "errors.noResult", message: "This outcome has no analysis yet: upload its data first." });
    const treatment = String(req.params.treatment);
    const comparator = String(req.params.comparator);
    if (!before.some((c) => c.treatment === treatment && c.comparator === comparator)) {
      return sendError(res, 404, {
        key: "errors.noComparison",
        message: `The result has no comparison ${treatment} vs ${comparator}; pairs are named in the order the result lists them.`,
      });
    }
    // A suggestion may be overridden, but only with a reason: the reason is published as a footnote.
    const current = before.find((c) => c.treatment === treatment && c.comparator === comparator)!;
    const judgement = req.body as z.infer<typeof judgementInput>;
    const unexplained = (["incoherence", "imprecision"] as const).filter(
      (name) => judgement[name] && judgement[name].levels !== current.suggestions[name].levels && judgement[name].reason === "",
    );
    if (unexplained.length > 0) {
      return sendError(res, 400, {
        key: "errors.certainty.overrideReason",
        message: `Give the reason for departing from the suggestion: ${unexplained.join(", ")}.`,
        details: unexplained.map((name) => ({ field: `${name}.reason`, message: "a reason is required to depart from the suggestion" })),
      });
    }
    await saveJudgement(db, { outcomeId: outcome.id, treatment, comparator }, judgement, req.user!.id);
    const after = await certaintyOf(outcome);
    res.json({ comparison: after!.find((c) => c.treatment === treatment && c.comparator === comparator) });
  });

  return router;
}
