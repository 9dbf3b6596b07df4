// The OpenAPI document is generated from the route table: it must be valid OpenAPI 3.1 and describe
// every route in the table with its method, parameters and answer.
import { Validator } from "@seriousme/openapi-schema-validator";
import { describe, expect, it } from "vitest";
import { openApiDocument } from "#web/api/openapi";
import { apiRoutes } from "#web/api/routes";
import { routeOf } from "#tests/support/route-answers";

type Operation = { parameters: { name: string; in: string }[]; responses: Record<string, { content?: Record<string, unknown> }>; security?: unknown[]; requestBody?: unknown };
const document = openApiDocument("http://fairweigh.example") as { openapi: string; paths: Record<string, Record<string, Operation>> };

describe("/api/openapi.json", () => {
  it("validates as OpenAPI 3.1", async () => {
    const result = await new Validator().validate(document as never);
    expect(result.errors ?? []).toEqual([]);
    expect(result.valid).toBe(true);
    expect(document.openapi).toBe("3.1.0");
  });

  it("lists every route of the table, and nothing else", () => {
    const listed = Object.entries(document.paths).flatMap(([address, operations]) => Object.keys(operations).map((method) => `${method.toUpperCase()} ${address.replace(/\{(\w+)\}/g, ":$1")}`));
    expect(new Set(listed)).toEqual(new Set(Object.keys(apiRoutes)));
    expect(listed).toHaveLength(51);
  });

  it("states each route's parameters, body, success answer and sign-in, as the table does", () => {
    const patch = document.paths["/api/briefs/{id}"]!.patch!;
    expect(patch.parameters.map((parameter) => `${parameter.in} ${parameter.name}`)).toEqual(["path id", "header x-csrf-token"]);
    expect(patch.requestBody).toMatchObject({ required: true, content: { "application/json": { schema: { type: "object", required: ["rowVersion"] } } } });
    expect(Object.keys(patch.responses).sort()).toEqual(["200", "400", "401", "403", "404", "503"]);
    expect(patch.security).toEqual([{ session: [] }]);

    const snapshot = document.paths["/api/briefs/{slug}/versions/{number}"]!.get!;
    expect(snapshot.security).toBeUndefined();
    expect(snapshot.responses["200"]!.content!["application/json"]).toMatchObject({ schema: { type: "object", properties: { schemaVersion: { const: 6 } } } });

    const audit = document.paths["/api/audit"]!.get!;
    expect(audit.parameters.map((parameter) => `${parameter.in} ${parameter.name}`)).toEqual(["query person", "query action", "query brief", "query before", "query limit"]);
    // Every change needs the CSRF token but the readers' alerts (mounted before the check, index.ts).
    const withoutToken = Object.entries(document.paths).flatMap(([address, operations]) =>
      Object.entries(operations).filter(([method, operation]) => method !== "get" && !operation.parameters.some((parameter) => parameter.name === "x-csrf-token")).map(([method]) => `${method.toUpperCase()} ${address}`),
    );
    expect(withoutToken.sort()).toEqual(["POST /api/subscriptions", "POST /api/subscriptions/confirm", "POST /api/subscriptions/unsubscribe"]);
    expect(document.paths["/api/session"]!.post!.parameters.map((parameter) => parameter.name)).toEqual(["x-csrf-token"]);
    expect(document.paths["/api/outcomes/{id}/dataset"]!.put!.requestBody).toMatchObject({ content: { "multipart/form-data": { schema: { required: ["file", "format"] } } } });
  });
});

describe("a request's route", () => {
  it("is found by method and path, a literal segment before a parameter", () => {
    expect(routeOf("GET", "/api/briefs/0b5f9c8e-1d2a-4c3b-9e8f-7a6b5c4d3e2f")).toBe("GET /api/briefs/:id");
    expect(routeOf("GET", "/api/briefs/some-brief/versions/2")).toBe("GET /api/briefs/:slug/versions/:number");
    expect(routeOf("GET", "/api/briefs/0b5f9c8e-1d2a-4c3b-9e8f-7a6b5c4d3e2f/readiness")).toBe("GET /api/briefs/:id/readiness");
    expect(routeOf("PUT", "/api/outcomes/x/certainty")).toBe("PUT /api/outcomes/:id/certainty");
    expect(routeOf("GET", "/api/audit?limit=5")).toBe("GET /api/audit");
    expect(routeOf("DELETE", "/api/briefs")).toBeNull();
  });
});
