// One shape for every API error: a message key the interface translates, an English message
// for scripts and logs, and the facts (which field, which value) where there are any.
import type { NextFunction, Request, Response } from "express";
import type { z } from "zod";

export interface ApiError {
  key: string;
  message: string;
  details?: unknown;
}

export function sendError(res: Response, status: number, error: ApiError): void {
  res.status(status).json({ error });
}

export function fieldIssues(error: z.ZodError) {
  return error.issues.map((issue) => ({ field: issue.path.join("."), message: issue.message }));
}

/** Validates req.body against a schema; on success the parsed value replaces the body. */
export function validateBody<T extends z.ZodType>(schema: T) {
  return (req: Request, res: Response, next: NextFunction) => {
    const parsed = schema.safeParse(req.body ?? {});
    if (!parsed.success) {
      sendError(res, 400, {
        key: "errors.invalidRequest",
        message: `The request body is not valid: ${fieldIssues(parsed.error).map((i) => `${i.field || "body"}: ${i.message}`).join("; ")}`,
        details: fieldIssues(parsed.error),
      });
      return;
    }
    req.body = parsed.data;
    next();
  };
}

/** Validates req.query; the parsed value is left in res.locals.query (req.query is read-only in Express 5). */
export function validateQuery<T extends z.ZodType>(schema: T) {
  return (req: Request, res: Response, next: NextFunction) => {
    const parsed = schema.safeParse(req.query);
    if (!parsed.success) {
      sendError(res, 400, {
        key: "errors.invalidQuery",
        message: `The query is not valid: ${fieldIssues(parsed.error).map((i) => `${i.field}: ${i.message}`).join("; ")}`,
        details: fieldIssues(parsed.error),
      });
      return;
    }
    res.locals.query = parsed.data;
    next();
  };
}

const uuid = /^[0-9a-f]{8}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{4}-[0-9a-f]{12}$/i;

/** For router.param("id"): an id that is not a UUID names nothing, so it is a 404, not a database error. */
export function rejectMalformedId(_req: Request, res: Response, next: NextFunction, id: string): void {
  if (!uuid.test(id)) return sendError(res, 404, { key: "errors.notFound", message: `There is nothing with the id ${id}.` });
  next();
}
