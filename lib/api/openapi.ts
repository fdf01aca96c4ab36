import "server-only";
import { z } from "@/lib/zod";
import type { Translator } from "@/lib/i18n/translator";
import { permissionTable } from "@/lib/permissions";
import { httpMethods, type Endpoint, type HttpMethod, type RouteHandler } from "./route";

/** One route file: its URL template ("/api/v1/stamps/{code}") and its exports. */
export interface RouteModule {
  path: string;
  handlers: Partial<Record<HttpMethod, RouteHandler>>;
}

type JsonSchema = Record<string, unknown> & { properties?: Record<string, JsonSchema>; required?: string[] };

/** A request schema as JSON Schema, as the caller writes it (before defaults and transforms). */
function jsonSchema(schema: z.ZodType): JsonSchema {
  const { $schema: _ignored, ...rest } = z.toJSONSchema(schema, { io: "input", unrepresentable: "any", target: "draft-2020-12" }) as JsonSchema;
  void _ignored;
  return rest;
}

function parameters(schema: z.ZodType | undefined, place: "path" | "query") {
  if (!schema) return [];
  const s = jsonSchema(schema);
  return Object.entries(s.properties ?? {}).map(([name, property]) => ({
    name,
    in: place,
    required: place === "path" || (s.required ?? []).includes(name),
    schema: property,
  }));
}

const errorCodesFor = (endpoint: Endpoint) =>
  [
    endpoint.params || endpoint.query || endpoint.body ? "400" : null,
    "401",
    "403",
    endpoint.params ? "404" : null,
    endpoint.body || endpoint.accepts ? "415" : null,
  ].filter((c): c is string => c !== null);

function operation(endpoint: Endpoint, path: string, t: Translator) {
  const summaryKey = `apiDocs.operations.${endpoint.operation}`;
  const status = String(endpoint.answers?.status ?? 200);
  const type = endpoint.answers?.type ?? "application/json";
  const success = status === "204" ? { description: t("apiDocs.noContent") } : { description: t("apiDocs.success"), content: { [type]: {} } };
  const errorRef = { $ref: "#/components/responses/Error" };
  return {
    operationId: endpoint.operation,
    summary: t.has(summaryKey) ? t(summaryKey) : "",
    tags: [path.split("/")[3] ?? "api"],
    "x-permission": endpoint.permission,
    "x-roles": [...permissionTable[endpoint.permission]],
    parameters: [...parameters(endpoint.params, "path"), ...parameters(endpoint.query, "query")],
    ...(endpoint.body
      ? { requestBody: { required: !endpoint.bodyOptional, content: { "application/json": { schema: jsonSchema(endpoint.body) } } } }
      : endpoint.accepts
        ? { requestBody: { required: true, content: Object.fromEntries(acceptedTypes(endpoint.accepts).map((type) => [type, { schema: { type: "string", ...(type === "text/csv" ? {} : { format: "binary" }) } }])) } }
        : {}),
    responses: { [status]: success, ...Object.fromEntries(errorCodesFor(endpoint).map((code) => [code, errorRef])) },
  };
}

/**
 * The OpenAPI 3.1 document of the JSON API, built from the routes' own declarations (lib/api/route.ts)
 * and their zod schemas, with summaries from the catalogue in the reader's language.
 */
export function openApiDocument(modules: RouteModule[], t: Translator, serverUrl: string) {
  const paths: Record<string, Record<string, unknown>> = {};
  for (const { path, handlers } of modules) {
    for (const method of httpMethods) {
      const endpoint = handlers[method]?.endpoint;
      if (endpoint) (paths[path] ??= {})[method.toLowerCase()] = operation(endpoint, path, t);
    }
  }
  return {
    openapi: "3.1.0",
    info: { title: t("apiDocs.title"), version: "1", description: t("apiDocs.description") },
    servers: [{ url: serverUrl }],
    security: [{ token: [] }, { session: [] }],
    paths,
    components: {
      securitySchemes: {
        token: { type: "http", scheme: "bearer", description: t("apiDocs.tokenAuth") },
        session: { type: "apiKey", in: "cookie", name: "authjs.session-token", description: t("apiDocs.sessionAuth") },
      },
      schemas: {
        Error: {
          type: "object",
          required: ["error"],
          properties: {
            error: {
              type: "object",
              required: ["code", "message"],
              properties: {
                code: { type: "string" },
                message: { type: "string" },
                fields: { type: "object", additionalProperties: { type: "array", items: { type: "string" } } },
              },
            },
          },
        },
      },
      responses: {
        Error: { description: t("apiDocs.errorAnswer"), content: { "application/json": { schema: { $ref: "#/components/schemas/Error" } } } },
      },
    },
  };
}

export type OpenApiDocument = ReturnType<typeof openApiDocument>;

/** The media types a non-JSON body may have: a picture is PNG, JPEG or WebP. */
function acceptedTypes(accepts: NonNullable<Endpoint["accepts"]>): string[] {
  return accepts === "image/*" ? ["image/png", "image/jpeg", "image/webp"] : [accepts];
}
