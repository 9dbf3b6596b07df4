// One shape for every API error: a message key the interface translates, an English message
// for scripts and logs, and the facts (which field, which value) where there are any.
import type { NextFunction, Request, Response } from "express";
import type { z } from "zod";
import { defaultLocale, isLocale, localeCookie, readerLocale } from "#core/languages/locales";
import { wordsOf } from "#core/languages/words";

export interface ApiError {
  key: string;
  message: string;
  details?: unknown;
}

/**
 * The error in the caller's language: their account's, else the site language they chose, else their
 * browser's. The message is the key's sentence in that language (the precise English message for
 * English callers), with each checklist item the details carry as a sentence; keys stay in details.
 */
export function sendError(res: Response, status: number, error: ApiError): void {
  res.status(status).json({ error: inCallersLanguage(res.req, error) });
}

/** A checklist item (server/core/editorial/readiness.ts) as details carry it: a message key of the desk's words and its values. */
const isItem = (value: unknown): value is { key: string; values: Record<string, unknown> } =>
  typeof value === "object" && value !== null && typeof (value as { key?: unknown }).key === "string" && (value as { key: string }).key.startsWith("readiness.");

function inCallersLanguage(req: Request | undefined, error: ApiError): ApiError {
  const chosen = req?.user?.locale;
  const locale = isLocale(chosen) ? chosen : readerLocale(req?.cookies?.[localeCookie], req?.get("accept-language"));
  const t = wordsOf(locale, "desk");
  const items = Array.isArray(error.details) ? error.details.filter(isItem) : [];
  const listed = items.length > 0 ? `: ${items.map((item) => t(item.key, item.values).replace(/[.。]$/, "")).join("; ")}.` : "";
  const known = t(`desk.${error.key}`, { defaultValue: "" });
  // The fields a validation names, which the English message states in its own words.
  const fields = Array.isArray(error.details) ? error.details.flatMap((d: { field?: unknown }) => (typeof d?.field === "string" && d.field ? [d.field] : [])) : [];
  const sentence = locale === defaultLocale || !known ? error.message.replace(/[.:]\s*$/, "") : `${known.replace(/[.:]\s*$/, "")}${fields.length > 0 ? ` (${fields.join(", ")})` : ""}`;
  return { ...error, message: listed ? `${sentence}${listed}` : /[.!?]$/.test(sentence) ? sentence : `${sentence}.` };
}

export function fieldIssues(error: z.ZodError) {
  return error.issues.map((issue) => ({ field: issue.path.join("."), message: issue.message }));
}

/** The issues in one line of an error message, "field: what is wrong; …"; `whole` names an issue of the whole. */
export function issueList(issues: { field: string; message: string }[], whole: string): string {
  return issues.map((issue) => `${issue.field || whole}: ${issue.message}`).join("; ");
}

/** The path of the first text holding a NUL byte, which PostgreSQL cannot store; null when there is none. */
export function nulPath(value: unknown, path: string[] = [], depth = 0): string | null {
  if (typeof value === "string") return value.includes("\u0000") ? path.join(".") || "body" : null;
  if (depth > 32 || value === null || typeof value !== "object") return null;
  for (const [key, inner] of Object.entries(value)) {
    if (key.includes("\u0000")) return [...path, key].join(".");
    const found = nulPath(inner, [...path, key], depth + 1);
    if (found !== null) return found;
  }
  return null;
}

/** Validates req.body against a schema; on success the parsed value replaces the body. */
export function validateBody<T extends z.ZodType>(schema: T) {
  return (req: Request, res: Response, next: NextFunction) => {
    const nul = nulPath(req.body);
    if (nul !== null) {
      sendError(res, 400, { key: "errors.invalidText", message: `The field ${nul} holds a NUL byte, which cannot be stored.`, details: [{ field: nul, message: "holds a NUL byte" }] });
      return;
    }
    const parsed = schema.safeParse(req.body ?? {});
    if (!parsed.success) {
      sendError(res, 400, {
        key: "errors.invalidRequest",
        message: `The request body is not valid: ${issueList(fieldIssues(parsed.error), "body")}`,
        details: fieldIssues(parsed.error),
      });
      return;
    }
    req.body = parsed.data;
    next();
  };
}

/** PostgreSQL's SQLSTATE codes that a request caused (bad input, a clash), and the answer each gets. */
const databaseRefusals: Record<string, { status: number; key: string; message: string }> = {
  "22021": { status: 400, key: "errors.invalidText", message: "A text holds a character that cannot be stored (such as a NUL byte)." },
  "22P05": { status: 400, key: "errors.invalidText", message: "A text holds a character that cannot be stored (such as a NUL byte)." },
  "22P02": { status: 400, key: "errors.invalidRequest", message: "A value is not of the expected kind." },
  "22003": { status: 400, key: "errors.invalidRequest", message: "A number is out of range." },
  "22001": { status: 400, key: "errors.invalidRequest", message: "A text is longer than allowed." },
  "23505": { status: 409, key: "errors.conflict", message: "Something with the same name was saved at the same moment; try again." },
  "23503": { status: 409, key: "errors.conflict", message: "What this refers to was changed or removed at the same moment; reload and try again." },
  "40001": { status: 409, key: "errors.conflict", message: "Another change was saved at the same moment; try again." },
  "40P01": { status: 409, key: "errors.conflict", message: "Another change was saved at the same moment; try again." },
};

/** Errors of the database being unreachable or restarting: the request may succeed if tried again. */
const unavailableCodes = new Set(["57P01", "57P02", "57P03", "53300", "08000", "08003", "08006", "ECONNREFUSED", "ECONNRESET", "ETIMEDOUT", "EPIPE"]);

/** The error and every cause behind it (Drizzle wraps the driver's error). */
function* causes(error: unknown): Generator<Record<string, unknown>> {
  let current = error;
  for (let depth = 0; depth < 5 && current && typeof current === "object"; depth++) {
    yield current as Record<string, unknown>;
    current = (current as { cause?: unknown }).cause;
  }
}

/**
 * What an error that reached the last handler means for the client: a known fault of the request
 * (a body that does not parse or is too large, a malformed address, a value the database refuses, a
 * clash with a concurrent request) gets its 4xx; a database that is down gets 503; anything else is
 * a 500, the only answer that says the server is at fault.
 */
export function errorAnswer(error: unknown): { status: number; error: ApiError } {
  for (const cause of causes(error)) {
    const type = cause.type;
    if (type === "entity.parse.failed") return { status: 400, error: { key: "errors.invalidJson", message: "The request body is not valid JSON (an object was expected)." } };
    if (type === "entity.too.large") return { status: 413, error: { key: "errors.tooLarge", message: "The request body is larger than allowed." } };
    if (type === "encoding.unsupported" || type === "charset.unsupported") return { status: 415, error: { key: "errors.unsupportedEncoding", message: "The request body's encoding is not supported: send UTF-8." } };
    if (cause instanceof URIError) return { status: 404, error: { key: "errors.notFound", message: "There is nothing at this address." } };
    const code = typeof cause.code === "string" ? cause.code : null;
    if (code && databaseRefusals[code]) {
      const { status, ...answer } = databaseRefusals[code];
      return { status, error: answer };
    }
    if (code && unavailableCodes.has(code)) return { status: 503, error: { key: "errors.unavailable", message: "The service is briefly unavailable; try again in a moment." } };
    const status = typeof cause.status === "number" ? cause.status : typeof cause.statusCode === "number" ? cause.statusCode : null;
    if (status !== null && status >= 400 && status < 500) return { status, error: { key: "errors.invalidRequest", message: typeof cause.message === "string" ? cause.message : "The request is not valid." } };
  }
  return { status: 500, error: { key: "errors.internal", message: "Something went wrong on the server. It has been logged." } };
}
