import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { MotifForm } from "@/components/motifs/motif-form";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listCollections } from "@/lib/data/motifs";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { createMotifAction } from "../actions";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("motifs"))("form.newTitle") };
}

export default async function NewMotifPage() {
  const actor = await requirePageActor();
  if (!can(actor.role, "motifs:write")) return <Forbidden />;
  const [t, collections] = await Promise.all([getTranslations(), listCollections(actor)]);
  return (
    <>
      <PageHeader title={t("motifs.form.newTitle")} intro={t("motifs.form.newIntro")} />
      <Panel>
        <MotifForm
          action={createMotifAction}
          mode="create"
          cancelHref="/motifs"
          collections={collections}
          initial={{ name: "", description: "", tags: "", designer: "", firstUsedOn: "", notes: "", collectionIds: [], stamps: "", colourways: "" }}
        />
      </Panel>
    </>
  );
}
