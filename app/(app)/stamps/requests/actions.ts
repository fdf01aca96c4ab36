"use server";

import { getLocale, getTranslations } from "next-intl/server";
import { revalidatePath } from "next/cache";
import { redirect } from "next/navigation";
import type { FormState } from "@/lib/actions/form-state";
import { runForm } from "@/lib/actions/run-form";
import { declineFormInput, newStampRequestFormInput } from "@/lib/contracts/plans";
import { stampFormInput } from "@/lib/contracts/stamps";
import { formText } from "@/lib/contracts/form-input";
import { acceptStampRequest, createNewStampRequest, declineNewStampRequest, declineStampRequest, fulfilNewStampRequest } from "@/lib/data/requests";
import { errorAnswer } from "@/lib/error-body";
import { pickLocale } from "@/lib/i18n/config";
import { translator } from "@/lib/i18n/translator";
import { ScanRejected } from "@/lib/scans/errors";
import { requirePermission } from "@/lib/session";
import { z } from "@/lib/zod";
import { acceptRequestSchema, createNewStampRequestSchema, declineRequestSchema, fulfilNewStampRequestSchema } from "@/lib/validation/plans";

const id = z.uuid("validation.notFound");
const acceptSchema = acceptRequestSchema.extend({ id });
const declineSchema = declineRequestSchema.extend({ id });

/** A keeper accepts a stamp request: every stamp checked out now (or on its first day), or none. */
export async function acceptRequestAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(formData, acceptSchema, async ({ id: requestId, version }) => {
    const actor = await requirePermission("stamps:write");
    const request = await acceptStampRequest(actor, requestId, version);
    revalidatePath("/stamps/requests");
    const t = await getTranslations("requests");
    return { status: "success", message: request.state === "checked_out" ? t("queue.checkedOut") : t("queue.accepted") };
  });
}

/** A keeper declines a stamp request with a reason the requester reads. */
export async function declineRequestAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(
    formData,
    declineSchema,
    async ({ id: requestId, ...input }) => {
      const actor = await requirePermission("stamps:write");
      await declineStampRequest(actor, requestId, input);
      revalidatePath("/stamps/requests");
      return { status: "success", message: (await getTranslations("requests"))("queue.declined") };
    },
    (f) => ({ id: f.get("id"), ...declineFormInput(f) }),
  );
}

/** A keeper declines a new-stamp request with a reason. */
export async function declineNewStampAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(
    formData,
    declineSchema,
    async ({ id: requestId, ...input }) => {
      const actor = await requirePermission("stamps:write");
      await declineNewStampRequest(actor, requestId, input);
      revalidatePath("/stamps/requests");
      return { status: "success", message: (await getTranslations("requests"))("queue.declined") };
    },
    (f) => ({ id: f.get("id"), ...declineFormInput(f) }),
  );
}

const fulfilSchema = fulfilNewStampRequestSchema.extend({ id });

/** A keeper turns a new-stamp request into the stamp record made from it; the stamp's fields sit beside their boxes. */
export async function fulfilNewStampAction(_prev: FormState, formData: FormData): Promise<FormState> {
  let target: string | undefined;
  const state = await runForm(
    formData,
    fulfilSchema,
    async ({ id: requestId, ...input }) => {
      const actor = await requirePermission("stamps:write");
      const request = await fulfilNewStampRequest(actor, requestId, input);
      target = request.motif ? `/motifs/${request.motif.id}?saved=stampMade` : `/stamps/${encodeURIComponent(request.stamp!.code)}?saved=created`;
    },
    (f, locale) => ({ id: formText(f, "requestId"), version: Number(formText(f, "requestVersion")), stamp: stampFormInput(f, "create", locale) }),
  );
  if (state.status === "success" && target) {
    revalidatePath("/stamps/requests");
    redirect(target);
  }
  // The stamp's fields arrive as stamp.<name>; the form names them without the prefix.
  const fieldErrors = state.fieldErrors ? Object.fromEntries(Object.entries(state.fieldErrors).map(([k, v]) => [k.replace(/^stamp\./, ""), v])) : undefined;
  return { ...state, fieldErrors };
}

/**
 * The form's optional "sketch" file: its bytes and name, or nothing when no file was chosen (a browser sends an
 * empty part for an empty file box, so an empty file counts as none).
 */
async function sketchOf(formData: FormData) {
  const file = formData.get("sketch");
  if (!file || typeof file === "string" || file.size === 0) return undefined;
  return { bytes: new Uint8Array(await file.arrayBuffer()), fileName: file.name || undefined };
}

/**
 * A new-stamp request, from the planner's fit helper ("make a stamp W wide") or from a motif (its role in the set):
 * one action for both forms; the motif's form thanks in the archive's words, the planner's in its own. A sketch
 * the picture checks refuse stands beside the file field, and nothing is filed.
 */
export async function requestNewStampAction(_prev: FormState, formData: FormData): Promise<FormState> {
  return runForm(
    formData,
    createNewStampRequestSchema,
    async (input) => {
      const actor = await requirePermission("stamps:requestNew");
      try {
        await createNewStampRequest(actor, input, await sketchOf(formData));
      } catch (error) {
        if (!(error instanceof ScanRejected)) throw error;
        const t = translator(pickLocale(await getLocale()));
        return { status: "error", message: t("common.formHasErrors"), fieldErrors: { sketch: [errorAnswer(error, t).body.error.message] } };
      }
      revalidatePath("/stamps/requests");
      const message = input.motifId ? (await getTranslations("requests"))("ask.sent") : (await getTranslations("plans.newStamp"))("sent");
      return { status: "success", message };
    },
    (f, locale) => newStampRequestFormInput(f, locale),
  );
}
