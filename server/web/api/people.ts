// People, for administrators: invite, change roles and locales, deactivate, send an invitation again,
// the delivery state of every e-mail, and the audit log of every change.
import { Router, type Request } from "express";
import type { z } from "zod";
import { findPersonRecord, listPeople } from "#db/people";
import { listMessages } from "#db/messages";
import { auditActions, listAudit } from "#db/audit";
import { changePerson, invitePerson, resendInvitation, type AccountContext } from "#workflows/accounts";
import { guard } from "../auth/require-role";
import { rejectMalformedId, sendError, validateBody, validateQuery } from "../http/errors";
import { auditQuery, changePersonBody, inviteBody } from "./contract";

export function peopleRoutes(context: (req: Request) => AccountContext): Router {
  const router = Router();
  router.param("id", rejectMalformedId);

  router.get("/people", guard("GET /api/people"), async (req, res) => {
    res.json({ people: await listPeople(context(req).db) });
  });

  router.post("/people", guard("POST /api/people"), validateBody(inviteBody), async (req, res) => {
    const outcome = await invitePerson(context(req), req.body as z.infer<typeof inviteBody>, req.user!);
    if (!outcome.ok) return sendError(res, 409, { key: "errors.people.taken", message: "Someone already has an account with that e-mail address.", details: [{ field: "email", message: "taken" }] });
    res.status(201).json({ person: await findPersonRecord(context(req).db, outcome.person.id) });
  });

  router.patch("/people/:id", guard("PATCH /api/people/:id"), validateBody(changePersonBody), async (req, res) => {
    const outcome = await changePerson(context(req), String(req.params.id), req.body as z.infer<typeof changePersonBody>, req.user!);
    if (outcome.ok) return res.json({ person: await findPersonRecord(context(req).db, outcome.person.id) });
    if (outcome.reason === "not-found") return sendError(res, 404, { key: "errors.notFound", message: "There is no such person." });
    if (outcome.reason === "self") return sendError(res, 409, { key: "errors.people.self", message: "You cannot deactivate your own account: ask another administrator." });
    sendError(res, 409, { key: "errors.people.lastAdmin", message: "This would leave nobody able to administer the site: give another active person the role admin first." });
  });

  router.post("/people/:id/invitation", guard("POST /api/people/:id/invitation"), async (req, res) => {
    const outcome = await resendInvitation(context(req), String(req.params.id), req.user!);
    if (outcome.ok) return res.status(202).json({ sent: true });
    if (outcome.reason === "not-found") return sendError(res, 404, { key: "errors.notFound", message: "There is no such person." });
    sendError(res, 409, { key: "errors.people.accepted", message: "This person has already set a password: they can reset it from the sign-in page." });
  });

  router.get("/messages", guard("GET /api/messages"), async (req, res) => {
    res.json({ messages: await listMessages(context(req).db) });
  });

  router.get("/audit", guard("GET /api/audit"), validateQuery(auditQuery), async (req, res) => {
    const query = res.locals.query as z.infer<typeof auditQuery>;
    const db = context(req).db;
    const page = await listAudit(db, { actorId: query.person, action: query.action, briefId: query.brief, before: query.before, limit: query.limit });
    res.json({ ...page, actions: await auditActions(db) });
  });

  return router;
}
