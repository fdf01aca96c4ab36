// PUT/GET /api/v1/new-stamp-requests/{id}/sketch — the request's sketch as the body (PNG, JPEG or WebP; who asks for new stamps); read it or ?variant=thumb (everyone)
import { apiRoute, methods } from "@/lib/api/route";
import { readPictureBody, scanBodyRefusal } from "@/lib/api/scan-body";
import { attachNewStampSketch, newStampSketch } from "@/lib/data/requests";
import { idParamSchema } from "@/lib/validation/common";
import { pictureUploadQuerySchema, pictureVariantQuerySchema } from "@/lib/validation/pictures";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  PUT: apiRoute(
    { operation: "putNewStampSketch", permission: "stamps:requestNew", params: idParamSchema, query: pictureUploadQuerySchema, accepts: "image/*", bodyRefusal: scanBodyRefusal },
    async ({ actor, request, params, query }) => ({ request: await attachNewStampSketch(actor, params.id, { bytes: await readPictureBody(request), fileName: query.fileName }) }),
  ),
  GET: apiRoute(
    { operation: "getNewStampSketch", permission: "data:read", params: idParamSchema, query: pictureVariantQuerySchema, answers: { type: "application/octet-stream" } },
    async ({ actor, params, query }) => newStampSketch(actor, params.id, query.variant),
  ),
});
