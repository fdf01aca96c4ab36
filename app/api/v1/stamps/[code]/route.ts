// GET/PATCH/DELETE /api/v1/stamps/{code} — one stamp; changes need the version they start from (409 on a conflict)
import { apiRoute, noContent, parseOrThrow, readJson } from "@/lib/api/route";
import { deleteStamp, getStamp, updateStamp } from "@/lib/data/stamps";
import { deleteStampSchema, stampCodeParamSchema, updateStampSchema } from "@/lib/validation/stamps";

type Params = { code: string };

export const GET = apiRoute<Params>({ permission: "data:read" }, async ({ actor, params }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  return { stamp: await getStamp(actor, code) };
});

export const PATCH = apiRoute<Params>({ permission: "stamps:write" }, async ({ actor, request, params }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  const patch = await readJson(request, updateStampSchema);
  const updated = await updateStamp(actor, code, patch);
  return { stamp: await getStamp(actor, updated.code) };
});

export const DELETE = apiRoute<Params>({ permission: "stamps:write" }, async ({ actor, request, params }) => {
  const { code } = parseOrThrow(stampCodeParamSchema, params);
  const { version } = parseOrThrow(deleteStampSchema, Object.fromEntries(new URL(request.url).searchParams));
  await deleteStamp(actor, code, version);
  return noContent();
});
