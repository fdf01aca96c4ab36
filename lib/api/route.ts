import "server-only";
import { NextResponse } from "next/server";
import type { z } from "zod";
import { appOrigins } from "@/lib/app-origins";
import { errorAnswer } from "@/lib/error-body";
import { AppError, ValidationFailed } from "@/lib/errors";
import { defaultLocale, negotiateLocale, type Locale } from "@/lib/i18n/config";
import { translator, type Translator } from "@/lib/i18n/translator";
import { type Permission } from "@/lib/permissions";
import { assertCan, currentActor, type Actor } from "@/lib/session";
import { queryObject } from "@/lib/validation/common";
import { parseInput } from "@/lib/validation/parse";
import { isJsonMediaType, JSON_BODY_MAX_BYTES, mediaTypeOf, readBodyText } from "./body";
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
  /** Turns a refused body or query into the route's own refusal (the scan and picture routes answer a hidden character in a file name as badFileName). */
  bodyRefusal?: (error: ValidationFailed) => Error | undefined;
  /** A body that is not JSON, read by the handler itself (documented only). */
  accepts?: "text/csv" | "image/*";
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

/**
 * The language of an answer: a browser session answers in the person's setting (what their screens speak);
 * a script with a token, and anyone not signed in, in the language its Accept-Language asks for; else English.
 */
export function localeFrom(request: Request, actor: Pick<Actor, "locale" | "via"> | null): Locale {
  if (actor?.via === "session") return actor.locale;
  return negotiateLocale(request.headers.get("accept-language")) ?? defaultLocale;
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
      if (isCrossSite(request, appOrigins())) throw new AppError("crossSite");
      const actor = await currentActor();
      if (!actor) throw new AppError("unauthenticated");
      t = translator(localeFrom(request, actor));
      assertCan(actor, endpoint.permission);
      const params = endpoint.params ? parseOrThrow(endpoint.params, await context.params) : undefined;
      const query = endpoint.query ? parseQuery(endpoint, new URL(request.url).searchParams) : undefined;
      const body = endpoint.body ? await readBody(request, endpoint) : undefined;
      const result = await handler({ request, actor, params, query, body, t } as Context<E>);
      return privateAnswer(result instanceof Response ? result : NextResponse.json(result));
    } catch (error) {
      return privateAnswer(errorResponse(error, t));
    }
  };
  route.endpoint = endpoint;
  return route;
}

function parseQuery(endpoint: Endpoint, search: URLSearchParams) {
  try {
    return parseOrThrow(endpoint.query!, queryObject(search));
  } catch (error) {
    throw (error instanceof ValidationFailed && endpoint.bodyRefusal?.(error)) || error;
  }
}

async function readBody(request: Request, endpoint: Endpoint) {
  try {
    if (endpoint.bodyOptional && request.headers.get("content-length") === "0") return parseOrThrow(endpoint.body!, {});
    return await readJson(request, endpoint.body!);
  } catch (error) {
    throw (error instanceof ValidationFailed && endpoint.bodyRefusal?.(error)) || error;
  }
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
    return privateAnswer(response);
  };
  return Object.fromEntries(httpMethods.map((m) => [m, handlers[m] ?? notAllowed])) as Record<HttpMethod, RouteHandler>;
}

/**
 * Every /api/v1 answer is about someone's workshop and account: caches keep none of it unless the route
 * chose its own policy (scan images: private, a few minutes). nosniff and the rest come from proxy.ts.
 */
export function privateAnswer(response: Response): Response {
  if (!response.headers.has("cache-control")) response.headers.set("cache-control", "no-store");
  return response;
}

/**
 * Reads and validates a JSON body: 415 unless the media type is application/json or …+json, 413 past
 * JSON_BODY_MAX_BYTES (lib/api/body.ts), 400 for broken JSON or bad fields.
 */
export async function readJson<S extends z.ZodType>(request: Request, schema: S): Promise<z.output<S>> {
  if (!isJsonMediaType(mediaTypeOf(request.headers.get("content-type")))) throw new AppError("unsupportedMediaType");
  const text = await readBodyText(request, JSON_BODY_MAX_BYTES);
  let body: unknown;
  try {
    body = JSON.parse(text);
  } catch {
    throw new AppError("badRequest");
  }
  return parseOrThrow(schema, body);
}

/** Parses any outside input through the one rule (lib/validation/parse.ts); 400 naming each field otherwise. */
export function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const parsed = parseInput(schema, value);
  if (!parsed.success) throw new ValidationFailed(parsed.error.issues);
  return parsed.data;
}

export const created = (body: unknown) => NextResponse.json(body, { status: 201 });
export const noContent = () => new Response(null, { status: 204 });
