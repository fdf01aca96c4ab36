import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { errorAnswer } from "@/lib/error-body";
import { AppError, ValidationFailed } from "@/lib/errors";
import { pickLocale } from "@/lib/i18n/config";
import { translator, type Translator } from "@/lib/i18n/translator";
import { type Permission } from "@/lib/permissions";
import { assertCan, currentActor, type Actor } from "@/lib/session";
import { queryObject } from "@/lib/validation/common";
import { isCrossSite } from "./cross-site";

/** What a route declares: the reference (lib/api/openapi.ts) and the parsing below are both built from it. */
export interface Endpoint {
  /** Names the operation; its summary is `apiDocs.operations.<operation>` in the catalogue. */
  operation: string;
  /** The permission the route needs; every route needs a signed-in actor. */
  permission: Permission;
  /** Path parameters ({code}, {id}). */
  params?: z.ZodType;
  /** The query string. */
  query?: z.ZodType;
  /** A JSON body. */
  body?: z.ZodType;
  /** An empty request body counts as `{}` (e.g. a return with nothing to add). */
  bodyOptional?: boolean;
  /** A body that is not JSON, read by the handler itself (documented only). */
  accepts?: "text/csv";
  /** The success answer, for the reference: 200 JSON unless said. */
  answers?: { status?: 200 | 201 | 204; type?: "application/json" | "text/csv" | "image/webp" | "application/octet-stream" };
}

type Parsed<T> = T extends z.ZodType ? z.output<T> : undefined;

interface Context<E extends Endpoint> {
  request: Request;
  actor: Actor;
  params: Parsed<E["params"]>;
  query: Parsed<E["query"]>;
  body: Parsed<E["body"]>;
  t: Translator;
}

export type RouteHandler = ((request: Request, context: { params: Promise<Record<string, string | string[]>> }) => Promise<Response>) & {
  endpoint?: Endpoint;
};

export const httpMethods = ["GET", "POST", "PUT", "PATCH", "DELETE"] as const;
export type HttpMethod = (typeof httpMethods)[number];

/** The language of an answer: the user's setting, else the caller's Accept-Language, else English. */
function localeFrom(request: Request, actor: Actor | null) {
  return pickLocale(actor?.locale ?? request.headers.get("accept-language")?.split(",")[0]?.split("-")[0]);
}

/** Answers any error in the JSON error shape (lib/error-body.ts). */
export function errorResponse(error: unknown, t: Translator): Response {
  const { status, body } = errorAnswer(error, t);
  return NextResponse.json(body, { status });
}

/**
 * Wraps a `/api/v1` route handler: refuses cross-site writes, resolves the actor (session or
 * Bearer token), checks the permission table, parses params, query and body with the endpoint's
 * schemas (each once), and turns every error into the JSON error shape.
 */
export function apiRoute<E extends Endpoint>(endpoint: E, handler: (ctx: Context<E>) => Promise<Response | unknown>): RouteHandler {
  const route: RouteHandler = async (request, context) => {
    let t = translator(localeFrom(request, null));
    try {
      if (isCrossSite(request)) throw new AppError("crossSite");
      const actor = await currentActor();
      if (!actor) throw new AppError("unauthenticated");
      t = translator(localeFrom(request, actor));
      assertCan(actor, endpoint.permission);
      const params = endpoint.params ? parseOrThrow(endpoint.params, await context.params) : undefined;
      const query = endpoint.query ? parseOrThrow(endpoint.query, queryObject(new URL(request.url).searchParams)) : undefined;
      const body = endpoint.body
        ? endpoint.bodyOptional && request.headers.get("content-length") === "0"
          ? parseOrThrow(endpoint.body, {})
          : await readJson(request, endpoint.body)
        : undefined;
      const result = await handler({ request, actor, params, query, body, t } as Context<E>);
      if (result instanceof Response) return result;
      return NextResponse.json(result);
    } catch (error) {
      return errorResponse(error, t);
    }
  };
  route.endpoint = endpoint;
  return route;
}

/**
 * The exports of a route file: the methods it has, and a JSON 405 (with `Allow`) for the rest, so
 * `export const { GET, POST, PUT, PATCH, DELETE } = methods({ GET: apiRoute(…) })`.
 */
export function methods(handlers: Partial<Record<HttpMethod, RouteHandler>>): Record<HttpMethod, RouteHandler> {
  const allow = [...httpMethods.filter((m) => handlers[m]), ...(handlers.GET ? ["HEAD"] : []), "OPTIONS"].sort().join(", ");
  const notAllowed: RouteHandler = async (request) => {
    const response = errorResponse(new AppError("methodNotAllowed", { method: request.method }), translator(localeFrom(request, null)));
    response.headers.set("allow", allow);
    return response;
  };
  return Object.fromEntries(httpMethods.map((m) => [m, handlers[m] ?? notAllowed])) as Record<HttpMethod, RouteHandler>;
}

/** Reads and validates a JSON body: 415 for another content type, 400 for broken JSON or bad fields. */
export async function readJson<S extends z.ZodType>(request: Request, schema: S): Promise<z.output<S>> {
  const type = request.headers.get("content-type") ?? "";
  if (!type.toLowerCase().includes("application/json")) throw new AppError("unsupportedMediaType");
  let body: unknown;
  try {
    body = await request.json();
  } catch {
    throw new AppError("badRequest");
  }
  return parseOrThrow(schema, body);
}

export function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const parsed = schema.safeParse(value, { reportInput: true });
  if (!parsed.success) throw new ValidationFailed(parsed.error.issues);
  return parsed.data;
}

export const created = (body: unknown) => NextResponse.json(body, { status: 201 });
export const noContent = () => new Response(null, { status: 204 });
