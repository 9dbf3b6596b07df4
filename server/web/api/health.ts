import { Router } from "express";
import type pg from "pg";
import { handle } from "./handle";

/** GET /api/health: 200 when the database answers, 503 when it does not. */
export function healthRoutes(pool: pg.Pool): Router {
  const router = Router();
  handle(router, "GET /api/health", async (_req, res) => {
    try {
      await pool.query("select 1");
      res.json({ status: "ok", database: "ok" });
    } catch {
      res.status(503).json({ status: "degraded", database: "unreachable" });
    }
  });
  return router;
}
