// Registers an API route from its entry in the route table (routes.ts): for a public read for reuse,
// CORS and its rate limit; the role check (401 for a caller not signed in, 403 for one without any
// of the roles named); then the address, query and body
// checked against their schemas, then the handlers, which receive them parsed and typed.
import type { NextFunction, Request, Response, Router } from "express";
import type { z } from "zod";
import { admits } from "#core/access/access";
import { fieldIssues, issueList, sendError, validateBody } from "../http/errors";
import { reuseHeaders } from "../http/security";
import { apiRoutes, type ApiRoute, type RouteSpec } from "./routes";

type Spec<K extends ApiRoute> = (typeof apiRoutes)[K];
type Parsed<S, F extends string, Otherwise> = S extends { [P in F]: infer Schema extends z.ZodType } ? z.output<Schema> : Otherwise;
/** A form route reads its own body (to answer a form with a redirect), so it arrives unparsed. */
type BodyOf<K extends ApiRoute> = Spec<K> extends { form: true } | { multipart: true } ? Record<string, unknown> | undefined : Parsed<Spec<K>, "body", undefined>;

/** A request to route K: its address parameters, query and body as the route table parses them. */
export type ApiRequest<K extends ApiRoute> = Request<Parsed<Spec<K>, "params", Record<string, never>>, unknown, BodyOf<K>, Parsed<Spec<K>, "query", Record<string, never>>>;
type Handler<K extends ApiRoute> = (req: ApiRequest<K>, res: Response, next: NextFunction) => unknown;

function roleCheck(spec: RouteSpec) {
  return (req: Request, res: Response, next: NextFunction): void => {
    if (admits(spec.who, req.user?.roles ?? null)) return next();
    if (!req.user) return sendError(res, 401, { key: "errors.signInRequired", message: "Sign in to use this part of the API." });
    const required = spec.who as readonly string[];
    sendError(res, 403, { key: "errors.roleRequired", message: `This needs the role ${required.join(" or ")}.`, details: { required } });
  };
}

/** An address whose parameters do not fit names nothing here: 404, before any database is asked. */
function paramsCheck(schema: z.ZodType) {
  return (req: Request, res: Response, next: NextFunction): void => {
    const parsed = schema.safeParse(req.params);
    if (parsed.success) return next();
    const issues = fieldIssues(parsed.error);
    sendError(res, 404, { key: "errors.notFound", message: `There is nothing at this address (${issueList(issues, "address")}).`, details: issues });
  };
}

/** The query, parsed, replaces req.query (in Express 5 a getter, so it is shadowed on the request). */
function queryCheck(schema: z.ZodType) {
  return (req: Request, res: Response, next: NextFunction): void => {
    const parsed = schema.safeParse(req.query);
    if (!parsed.success) {
      const issues = fieldIssues(parsed.error);
      return sendError(res, 400, { key: "errors.invalidQuery", message: `The query is not valid: ${issueList(issues, "query")}`, details: issues });
    }
    Object.defineProperty(req, "query", { value: parsed.data, enumerable: true });
    next();
  };
}

/** Registers route K on a router mounted at /api. */
export function handle<K extends ApiRoute>(router: Router, route: K, ...handlers: Handler<K>[]): void {
  const spec: RouteSpec = apiRoutes[route];
  const [method, address] = route.split(" ") as [string, string];
  const steps = [...(spec.reuse ? reuseHeaders : []), roleCheck(spec)];
  if (spec.params) steps.push(paramsCheck(spec.params));
  if (spec.query && !spec.form) steps.push(queryCheck(spec.query));
  if (spec.body && !spec.form && !spec.multipart) steps.push(validateBody(spec.body));
  const register = router[method.toLowerCase() as "get" | "post" | "put" | "patch" | "delete"].bind(router);
  // The one place the typed handlers meet Express's untyped ones: the steps above made them true.
  register(address.slice("/api".length), ...steps, ...(handlers as unknown as ((req: Request, res: Response, next: NextFunction) => unknown)[]));
}

