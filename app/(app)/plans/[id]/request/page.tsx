import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader, Panel } from "@/components/ui/panel";
import { getPlan } from "@/lib/data/plans";
import { workshopToday } from "@/lib/data/settings";
import { AppError } from "@/lib/errors";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { isoDateAfter } from "@/lib/stamps/codes";
import { z } from "@/lib/zod";
import { StampRequestForm } from "./request-form";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("requests"))("formTitle") };
}

/** "Request these stamps": the plan's stamps (and, for both faces, their mirror twins) to ask the keepers for. */
export default async function RequestStampsPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor();
  if (!can(actor.role, "stamps:request")) return <Forbidden />;
  const { id } = await params;
  if (!z.uuid().safeParse(id).success) notFound();
  const plan = await getPlan(actor, id).catch((error) => {
    if (error instanceof AppError && error.code === "notFound") notFound();
    throw error;
  });
  const [t, today] = await Promise.all([getTranslations("requests"), workshopToday()]);
  const backFace = plan.layout.sides === 2;
  const choices = [
    ...plan.stamps.map((s) => ({ code: s.code, name: s.name, out: s.out, location: s.location, checked: true })),
    ...(backFace ? plan.stamps.flatMap((s) => (s.twin && !plan.stamps.some((o) => o.code === s.twin!.code) ? [{ code: s.twin.code, name: s.twin.name, out: false, location: null, checked: true }] : [])) : []),
  ];
  return (
    <>
      <PageHeader title={t("formTitle")} intro={t("formIntro", { plan: plan.name })} />
      <Panel>
        <StampRequestForm planId={plan.id} planName={plan.name} choices={choices} forWhom={actor.name} fromOn={today} untilOn={isoDateAfter(new Date(`${today}T12:00:00Z`), 7)} />
      </Panel>
    </>
  );
}
