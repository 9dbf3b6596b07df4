// Headers, CSRF protection and rate limits. docs/api.md tells clients how to use the CSRF token.
import { randomBytes } from "node:crypto";
import type { NextFunction, Request, RequestHandler, Response } from "express";
import { doubleCsrf } from "csrf-csrf";
import rateLimit, { ipKeyGenerator } from "express-rate-limit";
import helmet from "helmet";
import type { Store } from "express-rate-limit";
import { sendError } from "./errors";

/** A fresh nonce per response, for the few inline scripts the page renderer writes. */
export function cspNonce(_req: Request, res: Response, next: NextFunction): void {
  res.locals.cspNonce = randomBytes(16).toString("base64url");
  next();
}

export function securityHeaders(production: boolean, secureTransport: boolean): RequestHandler {
  return helmet({
    contentSecurityPolicy: {
      directives: {
        defaultSrc: ["'self'"],
        // The development server injects its own inline module scripts.
        scriptSrc: production
          ? ["'self'", (_req, res) => `'nonce-${(res as Response).locals.cspNonce}'`]
          : ["'self'", "'unsafe-inline'"],
        styleSrc: ["'self'", "'unsafe-inline'"],
        imgSrc: ["'self'", "data:"],
        fontSrc: ["'self'", "data:"],
        connectSrc: production ? ["'self'"] : ["'self'", "ws:"],
        formAction: ["'self'"],
        frameAncestors: ["'none'"],
        objectSrc: ["'none'"],
        upgradeInsecureRequests: secureTransport ? [] : null,
      },
    },
    // Only over HTTPS; locally the site is plain HTTP on loopback.
    strictTransportSecurity: secureTransport,
  });
}

/**
 * The counters' store for one limiter, its keys under `prefix`: in PostgreSQL, shared by every process
 * of the deployment (server/db/rate-limits.ts).
 */
export type LimitStore = (prefix: string) => Store;

/** The session cookie; over HTTPS with the __Host- prefix, which browsers bind to this host and path. */
export const sessionCookieName = (secureTransport: boolean) => (secureTransport ? "__Host-fairweigh.session" : "fairweigh.session");

export const csrfFormField = "_csrf";

/**
 * Before signing in, a reader has no session (none is stored for anonymous visits: hostile probe
 * round 3, F13); the CSRF token of a form is bound instead to this random cookie of the browser.
 */
const visitorCookie = (secureTransport: boolean) => (secureTransport ? "__Host-fairweigh.visitor" : "fairweigh.visitor");

export function createCsrf(secret: string, secureTransport: boolean) {
  const visitor = visitorCookie(secureTransport);
  const csrf = doubleCsrf({
    getSecret: () => secret,
    // The token is bound to the signed-in session, or before signing in to the visitor cookie; a new
    // session (after signing in or out) needs a new token.
    getSessionIdentifier: (req) => (req.user ? req.session.id : `visitor:${String(req.cookies?.[visitor] ?? "")}`),
    cookieName: secureTransport ? "__Host-fairweigh.csrf" : "fairweigh.csrf",
    cookieOptions: { sameSite: "lax", secure: secureTransport, httpOnly: true, path: "/" },
    getCsrfTokenFromRequest: (req) =>
      req.get("x-csrf-token") ?? (typeof req.body?.[csrfFormField] === "string" ? req.body[csrfFormField] : undefined),
    errorConfig: { statusCode: 403, code: "EBADCSRFTOKEN", message: "invalid csrf token" },
  });
  /** A token for this request's form; an anonymous browser gets its visitor cookie first, and no session is stored. */
  const issueToken = (req: Request, res: Response): string => {
    if (!req.user && typeof req.cookies?.[visitor] !== "string") {
      const id = randomBytes(18).toString("base64url");
      res.cookie(visitor, id, { sameSite: "lax", secure: secureTransport, httpOnly: true, path: "/", maxAge: 1000 * 60 * 60 * 12 });
      req.cookies = { ...req.cookies, [visitor]: id };
    }
    return csrf.generateCsrfToken(req, res, { overwrite: false });
  };
  return { ...csrf, issueToken };
}

/**
 * More than five failed sign-ins within a minute, for one e-mail or from one address, are refused
 * (common practice; OWASP's authentication guidance asks for a limit without fixing the numbers).
 * Only a password that did not match counts (the route marks it with `signInFailed`), whether the
 * answer is JSON (401) or the form's redirect: a malformed request checks no password.
 */
export function signInRateLimits(store: LimitStore, onLimited: (req: Request, res: Response) => void): RequestHandler[] {
  const common = {
    windowMs: 60_000,
    limit: 5,
    skipSuccessfulRequests: true,
    requestWasSuccessful: (_req: Request, res: Response) => res.locals.signInFailed !== true,
    standardHeaders: "draft-8" as const,
    legacyHeaders: false,
    handler: (req: Request, res: Response) => onLimited(req, res),
  };
  return [
    rateLimit({ ...common, store: store("sign-in:"), keyGenerator: (req) => `address:${ipKeyGenerator(req.ip ?? "unknown")}` }),
    rateLimit({
      ...common,
      store: store("sign-in:"),
      keyGenerator: (req) => `email:${String(req.body?.email ?? "").trim().toLowerCase()}`,
    }),
  ];
}

export function tooManyAttempts(res: Response): void {
  sendError(res, 429, {
    key: "errors.signIn.tooMany",
    message: "Too many failed sign-ins. Wait a minute, then try again.",
  });
}

/**
 * Requests that send an e-mail to the address in their body (a reset link, a subscription's
 * confirmation): twenty per client address and five per e-mail in ten minutes, counted whatever their
 * outcome, so that nobody can flood an inbox (common practice).
 */
export function mailRequestLimits(store: LimitStore, route: string, onLimited: (req: Request, res: Response) => void): RequestHandler[] {
  const common = { windowMs: 10 * 60_000, standardHeaders: "draft-8" as const, legacyHeaders: false, handler: (req: Request, res: Response) => onLimited(req, res) };
  return [
    rateLimit({ ...common, limit: 20, store: store(`${route}:`), keyGenerator: (req) => `mail:${ipKeyGenerator(req.ip ?? "unknown")}` }),
    rateLimit({ ...common, limit: 5, store: store(`${route}:`), keyGenerator: (req) => `mail-to:${String(req.body?.email ?? "").trim().toLowerCase()}` }),
  ];
}

/**
 * Using one-time links: ten links that did not work per address in ten minutes (the route marks them
 * with `linkRefused`), so that nobody tries tokens at speed; links that work do not count.
 */
export function linkLimits(store: LimitStore, route: string, onLimited: (req: Request, res: Response) => void): RequestHandler[] {
  return [
    rateLimit({
      store: store(`${route}:`),
      windowMs: 10 * 60_000,
      limit: 10,
      standardHeaders: "draft-8",
      legacyHeaders: false,
      skipSuccessfulRequests: true,
      requestWasSuccessful: (_req: Request, res: Response) => res.locals.linkRefused !== true,
      keyGenerator: (req) => `link:${ipKeyGenerator(req.ip ?? "unknown")}`,
      handler: (req: Request, res: Response) => onLimited(req, res),
    }),
  ];
}

/**
 * The public reads for outside use (the route table's `reuse`, docs/data.md): any site may read them
 * from a browser (CORS without credentials, so a reader's cookie never travels with them), with the
 * ETag and rate-limit headers visible to it; 600 a minute from one address (common practice for a
 * public read API), counted in each process's memory, not the database, so that a read writes nothing.
 */
export const reuseHeaders: RequestHandler[] = [
  (_req, res, next) => {
    res.set({ "Access-Control-Allow-Origin": "*", "Access-Control-Expose-Headers": "ETag, RateLimit, RateLimit-Policy, Retry-After" });
    next();
  },
  rateLimit({
    windowMs: 60_000,
    limit: 600,
    standardHeaders: "draft-8",
    legacyHeaders: false,
    handler: (_req, res) => sendError(res, 429, { key: "errors.tooManyReads", message: "More than 600 requests a minute from one address: wait a minute, then try again." }),
  }),
];

/** A public answer that every reader gets alike, which caches may keep for `seconds`. */
export function sharedFor(res: Response, seconds: number): void {
  res.set("Cache-Control", `public, max-age=${seconds}`);
}
