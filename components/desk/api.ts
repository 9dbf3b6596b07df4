// The desk's one way to call the JSON API: a route of the route table by its name, its address
// built from the parameters the table names, same-origin cookies, JSON, and the CSRF token on every
// request that changes state (see docs/api.md). The answer is typed from the contract.
import type { z } from "zod";
import { admits } from "#core/access/access";
import type { Role } from "#core/access/roles";
import type { RouteAnswers } from "#web/api/contract";
import { apiRoutes, type ApiRoute } from "#web/api/routes";
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

let csrfToken: string | null = null;

async function fetchCsrfToken(): Promise<string> {
  const response = await fetch("/api/csrf", { credentials: "same-origin" });
  const body = (await response.json()) as { token: string };
  return body.token;
}

/**
 * Whether this person may call the route, by the rule the server enforces (the route table): the
 * desk shows a screen, a link or a query only to those who may use it.
 */
export function may(person: { roles: readonly Role[] }, route: ApiRoute): boolean {
  return admits(apiRoutes[route].who, person.roles);
}

type Spec<K extends ApiRoute> = (typeof apiRoutes)[K];
type Input<S, F extends string> = S extends { [P in F]: infer Schema extends z.ZodType } ? { [P in F]: z.input<Schema> } : { [P in F]?: never };
/** What a call of route K sends: the address's parameters, the query and the body its entry names. */
export type CallInput<K extends ApiRoute> = Input<Spec<K>, "params"> & Partial<Input<Spec<K>, "query">> & (Spec<K> extends { multipart: true } ? { body: FormData } : Input<Spec<K>, "body">);

/** The address of route K with its parameters filled in ("/api/briefs/:id" → "/api/briefs/1f…"), and its query. */
export function routePath<K extends ApiRoute>(route: K, input: { params?: Record<string, string | number>; query?: Record<string, unknown> } = {}): string {
  const path = route.split(" ")[1]!.replace(/:(\w+)/g, (_, name: string) => encodeURIComponent(String(input.params?.[name] ?? "")));
  const query = new URLSearchParams(Object.entries(input.query ?? {}).filter(([, value]) => value !== undefined && value !== null && value !== "").map(([name, value]) => [name, String(value)]));
  return query.size > 0 ? `${path}?${query}` : path;
}

/** Calls route K; resolves with its answer, or throws an ApiError with the API's words for the failure. */
export function call<K extends ApiRoute>(route: K, ...[input]: object extends CallInput<K> ? [CallInput<K>?] : [CallInput<K>]): Promise<RouteAnswers[K]> {
  const { params, query, body } = (input ?? {}) as { params?: Record<string, string>; query?: Record<string, unknown>; body?: unknown };
  return request<RouteAnswers[K]>(route.split(" ")[0]!, routePath(route, { params, query }), body);
}

/** JSON bodies are sent as JSON; FormData (file uploads) as multipart. */
async function request<T>(method: string, path: string, body?: unknown): Promise<T> {
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
    // The server words its errors in the signed-in person's language (server/web/http/errors.ts).
    const error = (payload as { error?: { key?: string; message?: string } }).error;
    throw new ApiError(response.status, error?.key ?? "errors.internal", error?.message ?? response.statusText, payload);
  }
  return payload as T;
}

/** A new session (after signing out) needs a new token. */
export function forgetCsrfToken(): void {
  csrfToken = null;
}
