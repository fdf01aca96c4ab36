import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { Notice } from "@/components/ui/notice";
import { PageHeader } from "@/components/ui/panel";
import { getNewStampRequest } from "@/lib/data/requests";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { NewStampPanel } from "../../../new/new-stamp-panel";
import { fulfilNewStampAction } from "../../actions";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("requests"))("make.title") };
}

/** A keeper records the stamp that arrived from the maker for a new-stamp request: the stamp form, prefilled with the size. */
export default async function MakeStampPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor();
  if (!can(actor.role, "stamps:write")) return <Forbidden />;
  const { id } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const request = await getNewStampRequest(actor, id).catch((error) => {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  });
  const t = await getTranslations();
  const intro = request.motif
    ? t("requests.make.introMotif", { motif: request.motif.name, role: request.role ? t(`motifs.roles.${request.role}`) : t("motifs.roles.filler") })
    : t("requests.make.intro");
  return (
    <>
      <PageHeader title={t("requests.make.title")} intro={intro} />
      {request.sketch ? (
        <a href={request.sketch.urls.original} target="_blank" rel="noreferrer" className="mb-4 inline-block" data-testid="sketch" aria-label={t("requests.queue.openSketch")}>
          {/* eslint-disable-next-line @next/next/no-img-element -- the sketch streams from our API with the session cookie */}
          <img src={request.sketch.urls.thumb} alt={t("requests.queue.sketchAlt")} className="h-40 w-40 rounded border border-stone-200 bg-white object-contain" />
        </a>
      ) : null}
      {request.state !== "open" ? (
        <Notice tone="error">{t("errors.requestAnswered", { state: t(`requests.newStates.${request.state}`) })}</Notice>
      ) : (
        <NewStampPanel
          actor={actor}
          action={fulfilNewStampAction}
          hidden={{ requestId: request.id, requestVersion: String(request.version) }}
          cancelTo="/stamps/requests"
          prefill={{ name: request.motif ? request.motif.name : "", widthMm: request.widthMm, heightMm: request.heightMm, notes: request.note }}
        />
      )}
    </>
  );
}
