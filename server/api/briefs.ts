// Briefs and their outcomes, treatment names and the Markdown preview: the desk's drafts.
import { Router } from "express";
import { z } from "zod";
import { deskRoles } from "../auth/roles";
import { requireRole } from "../auth/require-role";
import { briefWithOutcomes, createBrief, findBrief, listBriefs, nameTreatments, updateBrief } from "../briefs/briefs";
import { createOutcome, outcomeInput } from "../briefs/outcomes";
import { renderMarkdown } from "../content/markdown";
import type { Database } from "../db/client";
import { rejectMalformedId, sendError, validateBody } from "../http/errors";

const briefFields = {
  title: z.string().trim().min(1).max(300),
  topic: z.string().trim().min(1).max(200),
  condition: z.string().trim().min(1).max(200),
  population: z.string().trim().min(1).max(500),
};
const createBriefBody = z.object(briefFields).strict();
const patchBriefBody = z
  .object({
    rowVersion: z.number().int().positive(),
    title: briefFields.title.optional(),
    topic: briefFields.topic.optional(),
    condition: briefFields.condition.optional(),
    population: briefFields.population.optional(),
    laySummary: z.string().max(20_000).optional(),
    keyMessages: z.string().max(20_000).optional(),
  })
  .strict();

/** Who may change what in a brief: analysts its description, editors also its texts. */
const editorialFields = ["laySummary", "keyMessages"] as const;

export function briefRoutes(db: Database): Router {
  const router = Router();
  router.param("id", rejectMalformedId);

  router.get("/briefs", requireRole(...deskRoles), async (_req, res) => {
    res.json({ briefs: await listBriefs(db) });
  });

  router.post("/briefs", requireRole("analyst"), validateBody(createBriefBody), async (req, res) => {
    const brief = await createBrief(db, req.body, req.user!.id);
    res.status(201).json({ id: brief.id, slug: brief.slug });
  });

  router.get("/briefs/:id", requireRole(...deskRoles), async (req, res) => {
    const brief = await briefWithOutcomes(db, String(req.params.id));
    if (!brief) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    res.json({ brief });
  });

  router.patch("/briefs/:id", requireRole("analyst", "editor"), validateBody(patchBriefBody), async (req, res) => {
    const { rowVersion, ...changes } = req.body as z.infer<typeof patchBriefBody>;
    if (editorialFields.some((field) => field in changes) && !req.user!.roles.includes("editor")) {
      return sendError(res, 403, { key: "errors.roleRequired", message: "The lay summary and key messages need the role editor.", details: { required: ["editor"] } });
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

  const treatmentNamesBody = z.object({ names: z.record(z.string().min(1).max(200), z.string().trim().min(1).max(200)) }).strict();
  router.put("/briefs/:id/treatments", requireRole("analyst"), validateBody(treatmentNamesBody), async (req, res) => {
    if (!(await findBrief(db, String(req.params.id)))) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    await nameTreatments(db, String(req.params.id), (req.body as z.infer<typeof treatmentNamesBody>).names, req.user!.id);
    const brief = await briefWithOutcomes(db, String(req.params.id));
    res.json({ treatments: brief!.treatments });
  });

  const previewBody = z.object({ markdown: z.string().max(20_000) }).strict();
  router.post("/preview", requireRole(...deskRoles), validateBody(previewBody), (req, res) => {
    res.json({ html: renderMarkdown((req.body as z.infer<typeof previewBody>).markdown) });
  });

  router.post("/briefs/:id/outcomes", requireRole("analyst"), validateBody(outcomeInput), async (req, res) => {
    if (!(await findBrief(db, String(req.params.id)))) return sendError(res, 404, { key: "errors.notFound", message: "There is no such brief." });
    const outcome = await createOutcome(db, String(req.params.id), req.body, req.user!.id);
    res.status(201).json({ outcome });
  });

  return router;
}
