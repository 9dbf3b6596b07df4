import { Router } from "express";
import { guard } from "../auth/require-role";
import type { Database } from "#db/client";
import { listPeople } from "#db/people";

/** People and their roles: administrators only. */
export function peopleRoutes(db: Database): Router {
  const router = Router();
  router.get("/", guard("GET /api/people"), async (_req, res) => {
    res.json({ people: await listPeople(db) });
  });
  return router;
}
