// Server-side rendering of the pages/ folder by Vike, and the built assets.
import path from "node:path";
import express, { Router } from "express";
import { createDevMiddleware, renderPage } from "vike/server";
import type { Database } from "./db/client";
import type { createCsrf } from "./http/security";

/** Pages whose HTML carries a CSRF token, because they hold a form that posts without JavaScript. */
const pagesWithForms = new Set(["/sign-in"]);

export async function pageRoutes(options: {
  root: string;
  production: boolean;
  csrf: ReturnType<typeof createCsrf>;
  db: Database;
}): Promise<Router> {
  const { root, production, csrf, db } = options;
  const router = Router();
  if (production) {
    // Built assets carry a content hash in their name, so they can be cached for a year.
    router.use(
      "/assets",
      express.static(path.join(root, "dist/client/assets"), { immutable: true, maxAge: "365d", index: false }),
    );
    router.use(express.static(path.join(root, "dist/client"), { index: false }));
  } else {
    const { devMiddleware } = await createDevMiddleware({ root });
    router.use(devMiddleware);
  }

  router.use(async (req, res, next) => {
    if (req.method !== "GET" && req.method !== "HEAD") return next();
    let csrfToken: string | undefined;
    if (pagesWithForms.has(req.path)) {
      req.session.csrfIssued = true;
      csrfToken = csrf.generateCsrfToken(req, res, { overwrite: false });
    }
    try {
      const pageContext = await renderPage({
        urlOriginal: req.originalUrl,
        headersOriginal: req.headers,
        cspNonce: res.locals.cspNonce as string,
        person: req.user ?? null,
        db,
        csrfToken,
      });
      const { httpResponse } = pageContext;
      if (!httpResponse) return next();
      for (const [name, value] of httpResponse.headers) {
        // helmet has set the full policy with the same nonce; Vike's shorter one would replace it.
        if (name.toLowerCase() !== "content-security-policy") res.setHeader(name, value);
      }
      res.status(httpResponse.statusCode);
      httpResponse.pipe(res);
    } catch (error) {
      next(error);
    }
  });
  return router;
}
