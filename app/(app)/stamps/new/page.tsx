import type { Metadata } from "next";
import { getTranslations } from "next-intl/server";
import { Forbidden } from "@/components/shell/forbidden";
import { StampForm } from "@/components/stamps/stamp-form";
import { PageHeader, Panel } from "@/components/ui/panel";
import { listLocations } from "@/lib/data/stamps/locations";
import { can } from "@/lib/permissions";
import { requirePageActor } from "@/lib/session";
import { createStampAction } from "../actions";
import { locationLabel } from "@/lib/stamps/format";

export async function generateMetadata(): Promise<Metadata> {
  return { title: (await getTranslations("stamps"))("form.newTitle") };
}

export default async function NewStampPage() {
  const actor = await requirePageActor();
  if (!can(actor.role, "stamps:write")) return <Forbidden />;
  const [t, locations] = await Promise.all([getTranslations(), listLocations(actor)]);
  return (
    <>
      <PageHeader title={t("stamps.form.newTitle")} intro={t("stamps.form.newIntro")} />
      <Panel>
        <StampForm
          action={createStampAction}
          mode="create"
          unitSystem={actor.unitSystem}
          locations={locations.map((l) => ({ id: l.id, label: locationLabel(l) }))}
          initial={{
            code: "",
            name: "",
            widthMm: null,
            heightMm: null,
            stripDepthMm: null,
            weightG: null,
            face: "single",
            mirrored: false,
            twinCode: null,
            maker: null,
            madeOn: null,
            condition: "sound",
            locationId: null,
            coverageRatio: null,
            outlinePath: null,
            impressionsCount: 0,
            notes: null,
            tags: [],
          }}
        />
      </Panel>
    </>
  );
}
