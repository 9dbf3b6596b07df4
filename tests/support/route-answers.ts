// Which route of the table a test's request reached, and whether its answer fits that route's
// answer schema (server/web/api/routes.ts): the tests' client checks every successful API answer.
import { apiRoutes, type ApiRoute, type RouteSpec } from "#web/api/routes";

/** The issues of an answer that does not fit its route's schema; [] when it fits or the route has none. */
export function answerIssues(route: ApiRoute, body: unknown): string[] {
  const spec: RouteSpec = apiRoutes[route];
  if (!spec.answer) return [];
  const parsed = spec.answer.safeParse(body);
  return parsed.success ? [] : parsed.error.issues.map((issue) => `${issue.path.join(".") || "answer"}: ${issue.message}`);
}

/** The route a request to this method and path reaches, if any ("/api/briefs/1234…" → "GET /api/briefs/:id"). */
export function routeOf(method: string, path: string): ApiRoute | null {
  const segments = path.split("?")[0]!.split("/");
  const candidates = (Object.keys(apiRoutes) as ApiRoute[]).filter((route) => {
    const [routeMethod, routePath] = route.split(" ") as [string, string];
    if (routeMethod !== method.toUpperCase()) return false;
    const parts = routePath.split("/");
    return parts.length === segments.length && parts.every((part, i) => part.startsWith(":") || part === segments[i]);
  });
  // A literal segment wins over a parameter ("/api/briefs/:id/reviews" is not "/api/briefs/:slug/…").
  const literals = (route: ApiRoute) => route.split("/").filter((part) => !part.startsWith(":")).length;
  return candidates.sort((a, b) => literals(b) - literals(a))[0] ?? null;
}
