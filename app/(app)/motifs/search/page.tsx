import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { PictureSearch } from "@/components/motifs/picture-search";
import { PageHeader, Panel } from "@/components/ui/panel";
import { motifNames } from "@/lib/data/motifs";
import { scanLimits } from "@/lib/data/scans";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("motifs"))("picture.title") };
}

export default async function PictureSearchPage() {
  const actor = await requirePageActor();
  if (!can(actor.role, "data:read")) return <Forbidden />;
  const [t, names] = await Promise.all([getTranslations(), motifNames(actor)]);
  return (
    <>
      <PageHeader title={t("motifs.picture.title")} intro={t("motifs.picture.intro")} />
      <Panel>
        <PictureSearch maxBytes={scanLimits().maxBytes} motifNames={names} />
      </Panel>
    </>
  );
}
