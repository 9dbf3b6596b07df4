// GET /api/openapi.json: the API as OpenAPI 3.1, generated from the route table (routes.ts) with zod's
// own JSON Schema output (draft 2020-12, which OpenAPI 3.1 uses), so that it cannot differ from what
// the server checks. Refinements (a rule across fields) are stated in the words of `does` and `also`.
import { z } from "zod";
import { formats } from "#core/nma/types";
import { snapshotSchemaVersion } from "#core/snapshot/schema";
import { apiRoutes, type RouteSpec } from "./routes";

type JsonSchema = Record<string, unknown>;

function schemaOf(schema: z.ZodType, io: "input" | "output"): JsonSchema {
  const json = z.toJSONSchema(schema, { target: "draft-2020-12", io, unrepresentable: "any" }) as JsonSchema;
  delete json.$schema; // the document's dialect is OpenAPI 3.1's own
  return json;
}

/** One parameter per property of an object schema (the address's or the query's). */
function parameters(schema: z.ZodType | undefined, where: "path" | "query"): JsonSchema[] {
  if (!schema) return [];
  const json = schemaOf(schema, "input") as { properties?: Record<string, JsonSchema>; required?: string[] };
  return Object.entries(json.properties ?? {}).map(([name, property]) => ({ name, in: where, required: where === "path" || (json.required ?? []).includes(name), schema: property }));
}

const error = (description: string) => ({ description, content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } });

function operation(route: string, spec: RouteSpec): JsonSchema {
  const [method] = route.split(" ") as [string];
  const roles = spec.who === "anyone" ? "Anyone, without an account." : spec.who === "signed-in" ? "Anyone signed in." : `Signed in with the role ${spec.who.join(" or ")}.`;
  const changes = method !== "GET";
  const needsToken = changes && spec.csrf !== false;
  const status = String(spec.status ?? 200);
  const responses: Record<string, unknown> = {
    [status]: spec.answer ? { description: spec.does, content: { "application/json": { schema: schemaOf(spec.answer, "output") } } } : { description: spec.does },
  };
  if (spec.body || spec.query || spec.multipart) responses["400"] = error("The request is not valid; `details` names each field and what is wrong with it.");
  if (spec.who !== "anyone") responses["401"] = error("Not signed in.");
  if (Array.isArray(spec.who)) responses["403"] = error("Signed in without a role this route needs.");
  if (spec.params) responses["404"] = error("Nothing at this address.");
  if (needsToken) responses["403"] ??= error("The CSRF token is missing or does not match.");
  responses["503"] = error("The database is unreachable for a moment: try again.");
  const body = spec.multipart
    ? { required: true, content: { "multipart/form-data": { schema: { type: "object", required: ["file", "format"], properties: { file: { type: "string", contentMediaType: "text/csv" }, format: { enum: [...formats] } } } } } }
    : spec.body
      ? { required: true, content: { "application/json": { schema: schemaOf(spec.body, "input") }, ...(spec.form ? { "application/x-www-form-urlencoded": { schema: schemaOf(spec.body, "input") } } : {}) } }
      : undefined;
  return {
    operationId: route.replace(/[^A-Za-z0-9]+/g, "_").replace(/^_|_$/g, ""),
    summary: spec.does,
    description: [roles, spec.also, spec.reuse ? "For reuse outside the site: CORS open to any origin, an ETag, and the public rate limit (docs/data.md)." : null].filter(Boolean).join(" "),
    tags: [spec.reuse ? "data for reuse" : spec.who === "anyone" ? "public" : "desk"],
    parameters: [...parameters(spec.params, "path"), ...parameters(spec.query, "query"), ...(needsToken ? [{ name: "x-csrf-token", in: "header", required: true, schema: { type: "string" }, description: "From GET /api/csrf." }] : [])],
    ...(body ? { requestBody: body } : {}),
    responses,
    ...(spec.who === "anyone" ? {} : { security: [{ session: [] }] }),
  };
}

/** The OpenAPI 3.1 document of every route in the table; `server` is the site's address. */
export function openApiDocument(server: string): JsonSchema {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const [route, spec] of Object.entries(apiRoutes) as [string, RouteSpec][]) {
    const [method, address] = route.split(" ") as [string, string];
    const path = address.replace(/:(\w+)/g, "{$1}");
    paths[path] = { ...paths[path], [method.toLowerCase()]: operation(route, spec) };
  }
  return {
    openapi: "3.1.0",
    info: {
      title: "Fairweigh API",
      version: `snapshot schema ${snapshotSchemaVersion}`,
      description:
        "The JSON API of a Fairweigh site. The routes tagged “data for reuse” are stable for outside use: a released version's snapshot never changes once released, and its `schemaVersion` changes only when its shape does (docs/data.md). Every change needs the CSRF token of GET /api/csrf in the x-csrf-token header.",
      license: { name: "CC BY 4.0 (the published briefs' data)", identifier: "CC-BY-4.0" },
    },
    servers: [{ url: server }],
    paths,
    components: {
      schemas: {
        Error: {
          type: "object",
          required: ["error"],
          properties: { error: { type: "object", required: ["key", "message"], properties: { key: { type: "string" }, message: { type: "string" }, details: {} } } },
        },
      },
      securitySchemes: { session: { type: "apiKey", in: "cookie", name: "fairweigh.session", description: "The session cookie of POST /api/session (over HTTPS: __Host-fairweigh.session)." } },
    },
  };
}
