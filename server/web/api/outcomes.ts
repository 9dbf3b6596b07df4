// An outcome's settings, data upload, result and certainty judgements.
import { Router, type Response } from "express";
import multer from "multer";
import { z } from "zod";
import { evidenceByRiskOfBias } from "#core/snapshot/facts";
import { DatasetError, formats } from "#core/nma/types";
import { latestResult } from "#db/analyses";
import type { Database } from "#db/client";
import { deleteOutcome, findOutcome } from "#db/outcomes";
import { analyseAgain, formatFitsOutcome, isLargeUpload, queueUpload, storeDataset } from "#workflows/analysis";
import type { Queue } from "#workflows/queue";
import { judgeComparisons, outcomeCertainty, type JudgementOutcome } from "#workflows/certainty";
import { changeOutcomeSettings } from "#workflows/outcome-settings";
import { handle } from "./handle";
import { fieldIssues, sendError } from "../http/errors";

const maximumUploadBytes = 5 * 1024 * 1024;

const upload = multer({
  storage: multer.memoryStorage(),
  limits: { fileSize: maximumUploadBytes, files: 1, fields: 5 },
});

/** `queue`: where large uploads are analysed; without one (a test's API alone), every upload is analysed at once. */
export function outcomeRoutes(db: Database, queue: Queue | null): Router {
  const router = Router();

  handle(router, "PATCH /api/outcomes/:id", async (req, res) => {
    const { rowVersion, ...changes } = req.body;
    try {
      const update = await changeOutcomeSettings(db, req.params.id, rowVersion, changes, req.user!.id);
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

  handle(router, "DELETE /api/outcomes/:id", async (req, res) => {
    if (!(await deleteOutcome(db, req.params.id, req.user!.id))) return sendError(res, 404, { key: "errors.notFound", message: "There is no such outcome." });
    res.status(204).end();
  });

  handle(router, "PUT /api/outcomes/:id/dataset", (req, res, next) => {
    upload.single("file")(req, res, (error: unknown) => {
      if (!error) return next();
      const tooLarge = error instanceof multer.MulterError && error.code === "LIMIT_FILE_SIZE";
      sendError(res, tooLarge ? 413 : 400, {
        key: tooLarge ? "errors.upload.tooLarge" : "errors.upload.invalid",
        message: tooLarge ? `The file is larger than ${maximumUploadBytes / 1024 / 1024} MiB.` : `The upload could not be read: ${(error as Error).message}`,
      });
    });
  }, async (req, res) => {
    const outcome = await findOutcome(db, req.params.id);
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
      if (queue && isLargeUpload(req.file.buffer)) {
        const pending = await queueUpload(db, queue, outcome, { name: req.file.originalname, bytes: req.file.buffer }, format.data, req.user!.id);
        return res.status(202).json({ valid: true, analysing: true, uploadId: pending.id, fileName: req.file.originalname });
      }
      const stored = await storeDataset(db, outcome, { name: req.file.originalname, bytes: req.file.buffer }, format.data, req.user!.id);
      res.json({
        valid: true,
        datasetId: stored.dataset.id,
        sha256: stored.dataset.sha256,
        studies: stored.result.studies,
        treatments: stored.result.treatments,
        excludedStudies: stored.result.excludedStudies,
        riskOfBias: evidenceByRiskOfBias(stored.parsed.studies, [])?.studies ?? null,
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

  handle(router, "POST /api/outcomes/:id/analysis", async (req, res) => {
    const outcome = await findOutcome(db, req.params.id);
    if (!outcome) return sendError(res, 404, { key: "errors.notFound", message: "There is no such outcome." });
    try {
      const rerun = await analyseAgain(db, outcome, req.user!.id);
      if (!rerun) return sendError(res, 409, { key: "errors.upload.noData", message: "The outcome has no data to analyse: upload a file first." });
      res.json(rerun);
    } catch (error) {
      if (!(error instanceof DatasetError)) throw error;
      res.status(422).json({ valid: false, error: { key: "errors.upload.invalidData", message: "The stored data cannot be analysed as they are: upload a corrected file." }, issues: error.issues });
    }
  });

  handle(router, "GET /api/outcomes/:id/result", async (req, res) => {
    const stored = await latestResult(db, req.params.id);
    if (!stored) return sendError(res, 404, noResult);
    res.json(stored.result);
  });

  // A result of an earlier engine version counts as none (server/core/nma/stored-result.ts).
  const noResult = { key: "errors.noResult", message: "This outcome has no analysis by the current engine: upload its data, or analyse it again." };

  handle(router, "GET /api/outcomes/:id/certainty", async (req, res) => {
    const outcome = await findOutcome(db, req.params.id);
    const comparisons = outcome ? await outcomeCertainty(db, outcome) : null;
    if (!comparisons) return sendError(res, 404, noResult);
    res.json({ comparisons });
  });

  /** The answer to a refused judgement: which pair, and why. */
  function refuseJudgement(res: Response, judged: Exclude<JudgementOutcome, { ok: true }>) {
    if (judged.reason === "no-result") return sendError(res, 404, noResult);
    const { treatment, comparator } = judged.pair;
    if (judged.reason === "no-comparison") {
      return sendError(res, 404, {
        key: "errors.noComparison",
        message: `The result has no comparison ${treatment} vs ${comparator}; pairs are named in the order the result lists them.`,
      });
    }
    // A suggestion may be overridden, but only with a reason: the reason is published as a footnote.
    sendError(res, 400, {
      key: "errors.certainty.overrideReason",
      message: `Give the reason for departing from the suggestion (${treatment} vs ${comparator}): ${judged.domains.join(", ")}.`,
      details: judged.domains.map((name) => ({ field: `${name}.reason`, message: "a reason is required to depart from the suggestion", treatment, comparator })),
    });
  }

  handle(router, "PUT /api/outcomes/:id/certainty/:treatment/:comparator", async (req, res) => {
    const outcome = await findOutcome(db, req.params.id);
    if (!outcome) return sendError(res, 404, noResult);
    const pair = { treatment: req.params.treatment, comparator: req.params.comparator };
    const judged = await judgeComparisons(db, outcome, [{ ...pair, judgement: req.body }], req.user!.id);
    if (!judged.ok) return refuseJudgement(res, judged);
    res.json({ comparison: judged.comparisons[0] });
  });

  // Many pairs at once (the desk's bulk actions): all are saved, or none.
  handle(router, "PUT /api/outcomes/:id/certainty", async (req, res) => {
    const outcome = await findOutcome(db, req.params.id);
    if (!outcome) return sendError(res, 404, noResult);
    const judged = await judgeComparisons(db, outcome, req.body.judgements, req.user!.id);
    if (!judged.ok) return refuseJudgement(res, judged);
    res.json({ comparisons: judged.comparisons });
  });

  return router;
}
