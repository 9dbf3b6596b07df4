// The JSON API under /api. Every route validates its input with zod and checks roles on the server.
import express, { Router, type NextFunction, type Request, type Response } from "express";
import type { AppPassport } from "../auth/passport";
import type pg from "pg";
import type { Database } from "#db/client";
import { sendError } from "../http/errors";
import type { createCsrf, LimitStore } from "../http/security";
import { briefRoutes } from "./briefs";
import { reuseRoutes } from "./reuse";
import { handle } from "./handle";
import { healthRoutes } from "./health";
import { outcomeRoutes } from "./outcomes";
import { versionRoutes } from "./versions";
import { peopleRoutes } from "./people";
import { sessionRoutes } from "./session";
import { accountRoutes } from "./account";
import { subscriptionRoutes } from "./subscriptions";
import { devRoutes } from "./dev";
import { translationRoutes } from "./translations";
import { siteUrl, type AddressedRequest } from "../http/site-url";
import type { Queue } from "#workflows/queue";
import type { AccountContext } from "#workflows/accounts";

export interface ApiDependencies {
  db: Database;
  pool: pg.Pool;
  passport: AppPassport;
  csrf: ReturnType<typeof createCsrf>;
  /** The session cookie's name, which signing out clears. */
  sessionCookie: string;
  /** The job queue (e-mail); null where none runs, and then messages stay queued. */
  queue: Queue | null;
  /** The address readers use, for links in e-mails; the request's own address when unset. */
  publicUrl?: string;
  /** Where the development mailbox keeps messages; null in production. */
  mailFolder: string | null;
  /** The rate limits' counters (shared by every process on the database). */
  limitStore: LimitStore;
}

export function apiRoutes({ db, pool, passport, csrf, sessionCookie, queue, publicUrl, mailFolder, limitStore }: ApiDependencies): Router {
  const accounts = (req: AddressedRequest): AccountContext => ({ db, queue, siteUrl: siteUrl(req, publicUrl) });
  const api = Router();
  // Answers depend on who asks (drafts, the press room, embargoed versions): no shared cache keeps them.
  api.use((_req, res, next) => {
    res.set("Cache-Control", "private, no-store");
    next();
  });
  api.use(express.json({ limit: "1mb" }));
  api.use(express.urlencoded({ extended: false, limit: "64kb" }));

  api.use(healthRoutes(pool));

  handle(api, "GET /api/csrf", (req, res) => {
    res.json({ token: csrf.issueToken(req, res) });
  });

  // Readers' alerts take no token (see subscriptions.ts for why); every route below that changes
  // state needs it (GET and HEAD do not).
  api.use(subscriptionRoutes(accounts, limitStore));
  api.use((req: Request, res: Response, next: NextFunction) => {
    csrf.doubleCsrfProtection(req, res, (error?: unknown) => {
      if (!error) return next();
      if (req.is("application/x-www-form-urlencoded")) return res.redirect(303, "/sign-in?error=expired");
      sendError(res, 403, {
        key: "errors.csrf",
        message: "The CSRF token is missing or does not match: get one from GET /api/csrf and send it in the x-csrf-token header.",
      });
    });
  });

  api.use(sessionRoutes(db, passport, sessionCookie, limitStore));
  api.use(peopleRoutes(accounts));
  api.use(accountRoutes(accounts, limitStore));
  api.use(devRoutes(mailFolder));
  api.use(briefRoutes(db));
  api.use(versionRoutes(db, accounts));
  api.use(outcomeRoutes(db, queue));
  api.use(translationRoutes(db));
  api.use(reuseRoutes(db, publicUrl));

  api.use((_req, res) => sendError(res, 404, { key: "errors.notFound", message: "There is no such API route." }));
  return api;
}
