// Signing in and out. The same route serves the JSON API and the sign-in page's HTML form:
// a form post is answered with a redirect, so that signing in works without JavaScript.
import { Router } from "express";
import type { AppPassport } from "../auth/passport";
import { handle } from "./handle";
import { isFormPost } from "../http/forms";
import { recordAudit } from "#db/audit";
import { signedInCookie } from "#core/access/access";
import type { Database } from "#db/client";
import { fieldIssues, sendError } from "../http/errors";
import { signInRateLimits, tooManyAttempts, type LimitStore } from "../http/security";
import type { Person } from "#db/people";
import { credentialsBody } from "./contract";

/** Where a form sign-in goes next: only a path on this site, so the form cannot redirect elsewhere. */
function safeNext(value: unknown): string {
  return typeof value === "string" && /^\/(?!\/)[\w\-/?=&.%]*$/.test(value) ? value : "/desk";
}

function signInPage(error: string, next: string): string {
  return `/sign-in?error=${error}&next=${encodeURIComponent(next)}`;
}

/** How long a session lasts without a request (rolling: each request starts it again). */
export const sessionLifetime = 1000 * 60 * 60 * 12;

export function sessionRoutes(db: Database, passport: AppPassport, sessionCookie: string, limitStore: LimitStore): Router {
  const router = Router();

  handle(router, "GET /api/session", (req, res) => {
    res.json({ person: req.user });
  });

  const limited = signInRateLimits(limitStore, (req, res) =>
    isFormPost(req) ? res.redirect(303, signInPage("too-many", safeNext(req.body?.next))) : tooManyAttempts(res),
  );

  handle(router, "POST /api/session", ...limited, (req, res, next) => {
    const form = isFormPost(req);
    const parsed = credentialsBody.safeParse(req.body ?? {});
    if (!parsed.success) {
      if (form) return res.redirect(303, signInPage("missing", safeNext(req.body?.next)));
      return sendError(res, 400, {
        key: "errors.invalidRequest",
        message: "Send an e-mail and a password.",
        details: fieldIssues(parsed.error),
      });
    }
    req.body = { ...req.body, ...parsed.data };
    passport.authenticate("local", (error: unknown, person: Person | false) => {
      if (error) return next(error);
      if (!person) {
        res.locals.signInFailed = true;
        if (form) return res.redirect(303, signInPage("invalid", safeNext(req.body?.next)));
        return sendError(res, 401, {
          key: "errors.signIn.invalid",
          message: "That e-mail and password do not match an account.",
        });
      }
      req.logIn(person, async (loginError) => {
        if (loginError) return next(loginError);
        await recordAudit(db, { actorId: person.id, action: "sign-in", entity: "session", entityId: person.id, before: null, after: null });
        res.cookie(signedInCookie, "1", { sameSite: "lax", secure: req.secure, path: "/", maxAge: sessionLifetime });
        if (form) return res.redirect(303, safeNext(req.body?.next));
        res.json({ person });
      });
    })(req, res, next);
  });

  handle(router, "DELETE /api/session", (req, res, next) => {
    const person = req.user;
    req.logOut((error) => {
      if (error) return next(error);
      req.session.destroy(async (destroyError) => {
        if (destroyError) return next(destroyError);
        if (person) {
          await recordAudit(db, { actorId: person.id, action: "sign-out", entity: "session", entityId: person.id, before: null, after: null });
        }
        res.clearCookie(sessionCookie, { path: "/" });
        res.clearCookie(signedInCookie, { path: "/" });
        res.status(204).end();
      });
    });
  });

  return router;
}
