// People, for administrators: invite, change roles and locales, deactivate, send an invitation again,
// the delivery state of every e-mail, and the audit log of every change.
import { Router } from "express";

import { findPersonRecord, listPeople } from "#db/people";
import { listMessages } from "#db/messages";
import { auditActions, listAudit } from "#db/audit";
import { changePerson, invitePerson, resendInvitation, type AccountContext } from "#workflows/accounts";
import { handle } from "./handle";
import type { AddressedRequest } from "../http/site-url";
import { sendError } from "../http/errors";

export function peopleRoutes(context: (req: AddressedRequest) => AccountContext): Router {
  const router = Router();

  handle(router, "GET /api/people", async (req, res) => {
    res.json({ people: await listPeople(context(req).db) });
  });

  handle(router, "POST /api/people", async (req, res) => {
    const outcome = await invitePerson(context(req), req.body, req.user!);
    if (!outcome.ok) return sendError(res, 409, { key: "errors.people.taken", message: "Someone already has an account with that e-mail address.", details: [{ field: "email", message: "taken" }] });
    res.status(201).json({ person: await findPersonRecord(context(req).db, outcome.person.id) });
  });

  handle(router, "PATCH /api/people/:id", async (req, res) => {
    const outcome = await changePerson(context(req), req.params.id, req.body, req.user!);
    if (outcome.ok) return res.json({ person: await findPersonRecord(context(req).db, outcome.person.id) });
    if (outcome.reason === "not-found") return sendError(res, 404, { key: "errors.notFound", message: "There is no such person." });
    if (outcome.reason === "self") return sendError(res, 409, { key: "errors.people.self", message: "You cannot deactivate your own account: ask another administrator." });
    sendError(res, 409, { key: "errors.people.lastAdmin", message: "This would leave nobody able to administer the site: give another active person the role admin first." });
  });

  handle(router, "POST /api/people/:id/invitation", async (req, res) => {
    const outcome = await resendInvitation(context(req), req.params.id, req.user!);
    if (outcome.ok) return res.status(202).json({ sent: true });
    if (outcome.reason === "not-found") return sendError(res, 404, { key: "errors.notFound", message: "There is no such person." });
    sendError(res, 409, { key: "errors.people.accepted", message: "This person has already set a password: they can reset it from the sign-in page." });
  });

  handle(router, "GET /api/messages", async (req, res) => {
    res.json({ messages: await listMessages(context(req).db) });
  });

  handle(router, "GET /api/audit", async (req, res) => {
    const query = req.query;
    const db = context(req).db;
    const page = await listAudit(db, { actorId: query.person, action: query.action, briefId: query.brief, before: query.before, limit: query.limit });
    res.json({ ...page, actions: await auditActions(db) });
  });

  return router;
}
