// Briefs and their outcomes, treatment names and the Markdown preview: the desk's drafts.
import { Router } from "express";
import type { z } from "zod";
import { guard } from "../auth/require-role";
import { briefWithOutcomes, createBrief, findBrief, listBriefs, nameTreatments, updateBrief } from "#db/briefs";
import { createOutcome } from "#db/outcomes";
import { createBriefBody, createOutcomeBody, patchBriefBody, previewBody, treatmentNamesBody } from "./contract";
import { renderMarkdown } from "#core/markdown";
import type { Database } from "#db/client";
import { rejectMalformedId, sendError, validateBody } from "../http/errors";

/** Who may change what in a brief: analysts its description, editors also its texts. */
const editorialFields = ["laySummary", "shortTake"] as const;

export function briefRoutes(db: Database): Router {
  const router = Router();
  router.param("id", rejectMalformedId);

  router.get("/briefs", guard("GET /api/briefs"), async (_req, res) => {
    res.json({ briefs: await listBriefs(db) });
  });

  router.post("/briefs", guard("POST /api/briefs"), validateBody(createBriefBody), async (req, res) => {
    const brief = await createBrief(db, req.body, req.user!.id);
    res.status(201).json({ id: brief.id, slug: brief.slug });
  });

  router.get("/briefs/:id", guard("GET /api/briefs/:id"), async (req, res) => {
    const brief = await briefWithOutcomes(db, String(req.params.id));
    if (!brief) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    res.json({ brief });
  });

  router.patch("/briefs/:id", guard("PATCH /api/briefs/:id"), validateBody(patchBriefBody), async (req, res) => {
    const { rowVersion, ...changes } = req.body as z.infer<typeof patchBriefBody>;
    if (editorialFields.some((field) => field in changes) && !req.user!.roles.includes("editor")) {
      return sendError(res, 403, { key: "errors.roleRequired", message: "The lay summary and short take need the role editor.", details: { required: ["editor"] } });
    }
    const outcome = await updateBrief(db, String(req.params.id), rowVersion, changes, req.user!.id);
    if (outcome.ok) return res.json({ brief: outcome.brief });
    if (!outcome.current) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    sendError(res, 409, {
      key: "errors.conflict",
      message: `Someone else changed this brief (now version ${outcome.current.rowVersion}, you edited version ${rowVersion}). Review their change, then apply yours again.`,
      details: { current: outcome.current },
    });
  });

  router.put("/briefs/:id/treatments", guard("PUT /api/briefs/:id/treatments"), validateBody(treatmentNamesBody), async (req, res) => {
    const current = await briefWithOutcomes(db, String(req.params.id));
    if (!current) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    const { names, grammar = {} } = req.body as z.infer<typeof treatmentNamesBody>;
    // Names are for the labels in the brief's data only: anything else would be stored and never shown.
    const known = new Set(current.treatments.map((t) => t.label));
    const unknown = [...new Set([...Object.keys(names), ...Object.keys(grammar)])].filter((label) => !known.has(label));
    if (unknown.length > 0) {
      return sendError(res, 400, {
        key: "errors.treatments.unknownLabel",
        message: `These labels are not treatments in the brief's data: ${unknown.slice(0, 10).join(", ")}.`,
        details: unknown.slice(0, 10).map((label) => ({ field: `names.${label}`, message: "not a treatment in the data" })),
      });
    }
    // Grammar is given with a name: a label named before keeps its name when only its grammar changes.
    const withNames = { ...Object.fromEntries(current.treatments.filter((t) => t.named && t.label in grammar).map((t) => [t.label, t.displayName])), ...names };
    await nameTreatments(db, String(req.params.id), withNames, req.user!.id, grammar);
    const brief = await briefWithOutcomes(db, String(req.params.id));
    res.json({ treatments: brief!.treatments });
  });

  router.post("/preview", guard("POST /api/preview"), validateBody(previewBody), (req, res) => {
    res.json({ html: renderMarkdown((req.body as z.infer<typeof previewBody>).markdown) });
  });

  router.post("/briefs/:id/outcomes", guard("POST /api/briefs/:id/outcomes"), validateBody(createOutcomeBody), async (req, res) => {
    if (!(await findBrief(db, String(req.params.id)))) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    const outcome = await createOutcome(db, String(req.params.id), req.body, req.user!.id);
    res.status(201).json({ outcome });
  });

  return router;
}
