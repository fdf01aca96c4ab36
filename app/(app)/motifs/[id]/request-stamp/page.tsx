import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getTranslations } from "next-intl/server";
import { NewStampRequestForm } from "@/components/motifs/new-stamp-request-form";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getMotif } from "@/lib/data/motifs";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { requestNewStampAction } from "../../../stamps/requests/actions";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("requests"))("ask.title") };
}

/** A designer asks the keepers for a new stamp for this motif's set. */
export default async function RequestStampPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor();
  if (!can(actor.role, "stamps:requestNew")) return <Forbidden />;
  const { id } = await params;
  if (!/^[0-9a-f-]{36}$/i.test(id)) notFound();
  const found = await getMotif(actor, id).catch((error) => {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  });
  const t = await getTranslations();
  return (
    <>
      <PageHeader title={`${t("requests.ask.title")} · ${found.name}`} intro={t("requests.ask.intro")} />
      <Panel>
        <NewStampRequestForm action={requestNewStampAction} motifId={id} backTo={`/motifs/${id}`} unitSystem={actor.unitSystem} />
      </Panel>
    </>
  );
}
