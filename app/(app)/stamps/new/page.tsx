import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { PageHeader } from "@/components/ui/panel";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { createStampAction } from "../actions";
import { NewStampPanel } from "./new-stamp-panel";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("stamps"))("form.newTitle") };
}

export default async function NewStampPage() {
  const actor = await requirePageActor();
  if (!can(actor.role, "stamps:write")) return <Forbidden />;
  const t = await getTranslations();
  return (
    <>
      <PageHeader title={t("stamps.form.newTitle")} intro={t("stamps.form.newIntro")} />
      <NewStampPanel actor={actor} action={createStampAction} />
    </>
  );
}
