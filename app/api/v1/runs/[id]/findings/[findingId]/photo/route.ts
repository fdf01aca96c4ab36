// PUT/GET /api/v1/runs/{id}/findings/{findingId}/photo — a finding's photo as the body (PNG, JPEG or WebP; who records findings); read it or ?variant=thumb (everyone)
import { apiRoute, methods } from "@/lib/api/route";
import { readPictureBody, scanBodyRefusal } from "@/lib/api/scan-body";
import { attachFindingPhoto, findingPhoto } from "@/lib/data/runs";
import { findingParamSchema, pictureUploadQuerySchema, pictureVariantQuerySchema } from "@/lib/validation/pictures";

export const { GET, POST, PUT, PATCH, DELETE } = methods({
  PUT: apiRoute(
    { operation: "putRunFindingPhoto", permission: "runs:recordFindings", params: findingParamSchema, query: pictureUploadQuerySchema, accepts: "image/*", bodyRefusal: scanBodyRefusal },
    async ({ actor, request, params, query }) => ({ finding: await attachFindingPhoto(actor, params.id, params.findingId, await readPictureBody(request), query.fileName) }),
  ),
  GET: apiRoute(
    { operation: "getRunFindingPhoto", permission: "data:read", params: findingParamSchema, query: pictureVariantQuerySchema, answers: { type: "application/octet-stream" } },
    async ({ actor, params, query }) => findingPhoto(actor, params.id, params.findingId, query.variant),
  ),
});
