// The Express application: security headers, logs, sessions in Postgres, the API and the pages.
import path from "node:path";
import { fileURLToPath } from "node:url";
import compression from "compression";
import connectPgSimple from "connect-pg-simple";
import { createServer, type IncomingMessage, type Server, type ServerResponse } from "node:http";
import cookieParser from "cookie-parser";
import express, { type NextFunction, type Request, type Response } from "express";
import session from "express-session";
import pino from "pino";
import { pinoHttp } from "pino-http";
import type pg from "pg";
import type { Queue } from "#workflows/queue";
import { apiRoutes } from "./api";
import { sessionLifetime } from "./api/session";
import { createPassport } from "./auth/passport";
import { addressable } from "#core/publication/urls";
import type { Database } from "#db/client";
import { listenForVersionChanges } from "#db/notices";
import { PostgresRateLimitStore } from "#db/rate-limits";
import { errorAnswer, sendError } from "./http/errors";
import { createCsrf, cspNonce, securityHeaders, sessionCookieName } from "./http/security";
import { pageRoutes } from "./pages/render";
import { requestRenderAhead, startRenderAheadWorker } from "#workflows/render-ahead";
import { publicFileRoutes } from "./public/routes";

export const projectRoot = path.resolve(path.dirname(fileURLToPath(import.meta.url)), "../..");

export interface AppOptions {
  db: Database;
  pool: pg.Pool;
  sessionSecret: string;
  production: boolean;
  secureTransport: boolean;
  logLevel: pino.LevelWithSilent;
  /** Where log lines go (the server's entry point watches it for a vanished reader); standard output by default. */
  logDestination?: pino.DestinationStream;
  /** The address readers use, for permalinks; by default the one each request came to. */
  publicUrl?: string;
  /** Leave out the pages (integration tests of the API need no build). */
  pages?: boolean;
  /** The job queue that delivers e-mail (server/workflows/queue.ts); without one, messages stay queued. */
  queue?: Queue | null;
  /** The development mailbox's folder, for /desk/dev/mail; never used in production. */
  mailFolder?: string | null;
  /**
   * Where the rate limits' keys live in the shared table: every process of one deployment uses the
   * same (the default, ""); a test's own server takes one of its own so that its counts start at zero.
   */
  rateLimitNamespace?: string;
  /** Also told of every change to a brief's public pages (the CDN purge hook). */
  onVersionsChanged?: (slug: string) => void;
}

/** Standard output, written asynchronously (a buffered stream, flushed on exit): a request does not wait for its log line. */
export function logDestination(logLevel: pino.LevelWithSilent) {
  return pino.destination({ sync: false, minLength: logLevel === "silent" ? 0 : 4096 });
}

export async function createApp(options: AppOptions): Promise<express.Express> {
  const { db, pool, sessionSecret, production, secureTransport, logLevel } = options;
  const app = express();
  app.disable("x-powered-by");
  // Behind a proxy in production the client's address comes from X-Forwarded-For; locally there is none.
  app.set("trust proxy", secureTransport ? 1 : false);

  const logger = pino({ level: logLevel }, options.logDestination ?? logDestination(logLevel));
  const csrf = createCsrf(sessionSecret, secureTransport);
  const pages =
    options.pages === false
      ? null
      : await pageRoutes({
          root: projectRoot,
          production,
          csrf,
          db,
          publicUrl: options.publicUrl,
          sessionCookie: sessionCookieName(secureTransport),
          // The same short line as every other request's.
          onFastAnswer: (req, res) => logger.info({ req: { method: req.method, url: req.url }, res: { status: res.statusCode } }, "request completed"),
        });
  // Released pages in memory go to anonymous readers before Express runs at all (render.ts); every
  // process forgets a brief's remembered state as soon as the database announces a change to it.
  if (pages) {
    const queue = options.queue;
    // One process renders the brief's newest version in every language ahead of its readers (server/workflows/render-ahead.ts).
    if (queue) await startRenderAheadWorker(queue, pages.renderAhead);
    const changed = (slug: string) => {
      pages.forget(slug);
      options.onVersionsChanged?.(slug);
      if (queue) void requestRenderAhead(queue, slug).catch((error: Error) => logger.warn({ err: error }, "rendering ahead"));
    };
    const listener = listenForVersionChanges(options.pool, changed, (error) => logger.warn({ err: error }, "listening for version changes"));
    app.locals.stopListening = () => listener.stop();
  }
  const fastAnswer = pages?.fastAnswer;
  const handle = fastAnswer ? (req: IncomingMessage, res: ServerResponse) => void fastAnswer(req, res).then((answered) => answered || app(req, res), () => app(req, res)) : app;
  app.listen = ((...args: Parameters<Server["listen"]>) => {
    const server = createServer(handle);
    // An idle connection is kept longer than a cache or proxy in front keeps its own (Varnish's
    // backend_idle_timeout is 60 s by default), so that the side that sends the next request is the
    // side that closes first; otherwise a request can meet a socket the server is closing and get
    // no answer at all. Headers must be allowed to take at least as long.
    server.keepAliveTimeout = 65_000;
    server.headersTimeout = 66_000;
    return server.listen(...args);
  }) as typeof app.listen;
  // Only paths are addresses here: "OPTIONS *", "GET *" and absolute-form targets ("GET http://host/x")
  // get a 400 that says so, before sessions or pages try to read them (hostile probe round 3, F11).
  app.use((req, res, next) => {
    if (req.url.startsWith("/")) return next();
    res.status(400).type("text/plain").send("The request target must be a path that starts with “/”.");
  });
  app.use(
    pinoHttp({
      logger,
      // One short line per request: no headers, so no cookies in the logs.
      serializers: {
        req: (req: { method: string; url: string }) => ({ method: req.method, url: req.url }),
        res: (res: { statusCode: number }) => ({ status: res.statusCode }),
      },
      customProps: (req) => ({ person: (req as Request).user?.id }),
    }),
  );
  app.use(cspNonce);
  app.use(securityHeaders(production, secureTransport));
  app.use(compression());
  app.use(cookieParser());

  const PgStore = connectPgSimple(session);
  const store = new PgStore({ pool, tableName: "session", createTableIfMissing: false, pruneSessionInterval: 60 * 15 });
  // A rolling session is touched after the answer has begun, so a failed touch (the database gone
  // for a moment) would end an answer already under way and the reader would get nothing at all.
  // The session stays valid until its old expiry, so a touch that fails is logged and let go.
  const touch = store.touch.bind(store);
  store.touch = (sid, stored, done) =>
    touch(sid, stored, (error?: unknown) => {
      if (error) logger.warn({ err: error }, "a session could not be kept alive");
      done?.();
    });
  app.use(
    session({
      name: sessionCookieName(secureTransport),
      secret: sessionSecret,
      store,
      resave: false,
      saveUninitialized: false,
      rolling: true,
      cookie: { httpOnly: true, sameSite: "lax", secure: secureTransport, maxAge: sessionLifetime },
    }),
  );
  const passport = createPassport(db);
  app.use(passport.session());

  // An address that does not decode, or decodes to a NUL byte, names nothing here (and PostgreSQL
  // would refuse it as text): 404 before any route looks it up.
  app.use((req, res, next) => {
    if (addressable(req.path)) return next();
    sendError(res, 404, { key: "errors.notFound", message: "There is nothing at this address." });
  });

  const limitStore = (prefix: string) => new PostgresRateLimitStore(db, `${options.rateLimitNamespace ?? ""}${prefix}`);
  app.use("/api", apiRoutes({ db, pool, passport, csrf, limitStore, sessionCookie: sessionCookieName(secureTransport), queue: options.queue ?? null, publicUrl: options.publicUrl, mailFolder: production ? null : (options.mailFolder ?? null) }));
  app.use(publicFileRoutes(db, options.publicUrl, secureTransport));
  if (pages) app.use(pages.router);

  app.use((error: unknown, req: Request, res: Response, _next: NextFunction) => {
    const answer = errorAnswer(error);
    if (answer.status >= 500) req.log.error({ err: error }, "request failed");
    else req.log.info({ status: answer.status, reason: answer.error.key }, "request refused");
    if (res.headersSent) return res.end();
    sendError(res, answer.status, answer.error);
  });
  return app;
}
