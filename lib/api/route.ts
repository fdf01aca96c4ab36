import "server-only";
import { NextResponse } from "next/server";
import { ZodError, type z } from "zod";
import { appOrigins } from "@/lib/app-origins";
import { AppError, type FieldErrors, type FieldMessage } from "@/lib/errors";
import { pickLocale } from "@/lib/i18n/config";
import { translator, type Translator } from "@/lib/i18n/translator";
import { type Permission } from "@/lib/permissions";
import { assertCan, currentActor, type Actor } from "@/lib/session";
import { translateIssues } from "@/lib/validation/issues";
import { parseInput } from "@/lib/validation/parse";
import { isJsonMediaType, JSON_BODY_MAX_BYTES, mediaTypeOf, readBodyText } from "./body";
import { isCrossSite } from "./cross-site";

interface Context<P> {
  request: Request;
  actor: Actor;
  params: P;
  t: Translator;
}

interface Options {
  /** The permission the route needs; every route needs a signed-in actor. */
  permission: Permission;
}

type Handler<P> = (ctx: Context<P>) => Promise<Response | unknown>;

/** Error bodies: `{ error: { code, message, fields? } }` with the status that fits. */
export function errorResponse(error: unknown, t: Translator): Response {
  if (error instanceof ZodError) return errorResponse(new ValidationFailed(error.issues), t);
  if (error instanceof ValidationFailed) {
    const fields = translateIssues(error.issues, t, t.has);
    return NextResponse.json({ error: { code: "validation", message: t("errors.validation"), fields } }, { status: error.status });
  }
  if (error instanceof AppError) {
    const fields: FieldErrors | undefined = error.fields ? translateFields(error.fields, error.params, t) : undefined;
    return NextResponse.json(
      { error: { code: error.code, message: t(`errors.${error.code}`, error.params), ...(fields ? { fields } : {}) } },
      { status: error.status },
    );
  }
  console.error(error);
  return NextResponse.json({ error: { code: "internal", message: t("errors.internal") } }, { status: 500 });
}

export function translateFields(fields: Record<string, FieldMessage[]>, params: Record<string, string | number>, t: Translator): FieldErrors {
  return Object.fromEntries(
    Object.entries(fields).map(([field, messages]) => [field, messages.map((m) => (typeof m === "string" ? t(m, params) : t(m.key, m.values)))]),
  );
}

/** A validation failure with zod's issues; translated where it is answered. */
export class ValidationFailed extends AppError {
  constructor(
    readonly issues: readonly z.core.$ZodIssue[],
    status: 400 | 422 = 400,
  ) {
    super(status === 422 ? "unprocessable" : "validation");
  }
}

function localeFrom(request: Request, actor: Actor | null) {
  return pickLocale(actor?.locale ?? request.headers.get("accept-language")?.split(",")[0]?.split("-")[0]);
}

/**
 * Wraps a `/api/v1` route handler: refuses cross-site writes, resolves the actor (session or
 * Bearer token), checks the permission table, and turns every error into the JSON error shape.
 */
export function apiRoute<P = Record<string, never>>(options: Options, handler: Handler<P>) {
  return async (request: Request, context: { params: Promise<P> }): Promise<Response> => {
    let t = translator(localeFrom(request, null));
    try {
      if (isCrossSite(request, appOrigins())) throw new AppError("crossSite");
      const actor = await currentActor();
      if (!actor) throw new AppError("unauthenticated");
      t = translator(localeFrom(request, actor));
      assertCan(actor, options.permission);
      const result = await handler({ request, actor, params: await context.params, t });
      return privateAnswer(result instanceof Response ? result : NextResponse.json(result));
    } catch (error) {
      return privateAnswer(errorResponse(error, t));
    }
  };
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

export function parseOrThrow<S extends z.ZodType>(schema: S, value: unknown): z.output<S> {
  const parsed = parseInput(schema, value);
  if (!parsed.success) throw new ValidationFailed(parsed.error.issues);
  return parsed.data;
}

export const created = (body: unknown) => NextResponse.json(body, { status: 201 });
export const noContent = () => new Response(null, { status: 204 });
