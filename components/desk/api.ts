// The desk's one way to call the JSON API: same-origin cookies, JSON, and the CSRF token on
// every request that changes state (see docs/api.md).
export type { SignedInPerson } from "#web/api/contract";

export class ApiError extends Error {
  constructor(
    readonly status: number,
    readonly key: string,
    message: string,
    /** The whole answer, for errors that carry more than a message (a validation report, a conflict). */
    readonly payload: unknown = null,
  ) {
    super(message);
  }
}

/**
 * The desk's words for an API error key ("errors.conflict"), set by the desk when its language is
 * known; the API's English message is kept for a key the interface has no words for.
 */
let errorWords: (key: string) => string | null = () => null;
export function setErrorWords(words: (key: string) => string | null): void {
  errorWords = words;
}

let csrfToken: string | null = null;

async function fetchCsrfToken(): Promise<string> {
  const response = await fetch("/api/csrf", { credentials: "same-origin" });
  const body = (await response.json()) as { token: string };
  return body.token;
}

/** JSON bodies are sent as JSON; FormData (file uploads) as multipart. */
export async function callApi<T>(method: string, path: string, body?: unknown): Promise<T> {
  const headers: Record<string, string> = { accept: "application/json" };
  if (method !== "GET") {
    csrfToken ??= await fetchCsrfToken();
    headers["x-csrf-token"] = csrfToken;
  }
  const isForm = body instanceof FormData;
  if (body !== undefined && !isForm) headers["content-type"] = "application/json";
  const response = await fetch(path, {
    method,
    headers,
    credentials: "same-origin",
    body: body === undefined ? undefined : isForm ? body : JSON.stringify(body),
  });
  if (response.status === 204) return undefined as T;
  const payload = await response.json().catch(() => ({}));
  if (!response.ok) {
    const error = (payload as { error?: { key?: string; message?: string } }).error;
    const key = error?.key ?? "errors.internal";
    const fields = ((payload as { error?: { details?: unknown } }).error?.details ?? null) as { field?: string }[] | null;
    const named = Array.isArray(fields) && fields.some((d) => d?.field) ? ` (${fields.map((d) => d.field).filter(Boolean).join(", ")})` : "";
    const words = errorWords(key);
    throw new ApiError(response.status, key, words ? words + named : (error?.message ?? response.statusText), payload);
  }
  return payload as T;
}

/** A new session (after signing out) needs a new token. */
export function forgetCsrfToken(): void {
  csrfToken = null;
}
