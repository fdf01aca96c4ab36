import type { Metadata } from "next";
import { notFound } from "next/navigation";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { MotifForm } from "@/components/motifs/motif-form";
import { PageHeader, Panel } from "@/components/ui/panel";
import { colourwaysText, stampsText } from "@/lib/contracts/motifs";
import { getMotif, listCollections } from "@/lib/data/motifs";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { motifIdParamSchema } from "@/lib/validation/motifs";
import { parseInput } from "@/lib/validation/parse";
import { updateMotifAction } from "../../actions";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("motifs"))("form.save") };
}

export default async function EditMotifPage({ params }: { params: Promise<{ id: string }> }) {
  const actor = await requirePageActor();
  if (!can(actor.role, "motifs:write")) return <Forbidden />;
  const parsed = parseInput(motifIdParamSchema, await params);
  if (!parsed.success) notFound();
  const motif = await getMotif(actor, parsed.data.id).catch(() => null);
  if (!motif) notFound();
  const [t, collections] = await Promise.all([getTranslations(), listCollections(actor)]);
  return (
    <>
      <PageHeader title={t("motifs.form.editTitle", { name: motif.name })} />
      <Panel>
        <MotifForm
          action={updateMotifAction}
          mode="edit"
          cancelHref={`/motifs/${motif.id}`}
          collections={collections}
          initial={{
            id: motif.id,
            version: motif.version,
            name: motif.name,
            description: motif.description ?? "",
            tags: motif.tags.join(", "),
            designer: motif.designer ?? "",
            firstUsedOn: motif.firstUsedOn ?? "",
            notes: motif.notes ?? "",
            collectionIds: motif.collections.map((c) => c.id),
            stamps: stampsText(motif.stamps),
            colourways: colourwaysText(motif.colourways),
          }}
        />
      </Panel>
    </>
  );
}
